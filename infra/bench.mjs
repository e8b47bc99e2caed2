#!/usr/bin/env node
// `npm run bench` (after the geomath benchmark): starts the test database, the S3 fake and the SMTP fake on
// their own ports, migrates and seeds the database, runs the API benchmarks against them, then the browser
// benchmark (the sketch, in Debian's Chromium) against the app it starts, and stops what it started.
import { rmSync } from 'node:fs';
import path from 'node:path';
import { buildAll, ensureAptPackages, ensureNodeModules, migrateAndSeed } from './lib/bootstrap.mjs';
import { profileEnv, root } from './lib/env.mjs';
import { InfraError, fail } from './lib/log.mjs';
import { run, runAsync, stopAll } from './lib/proc.mjs';
import { startApi, startMariadb, startS3, startSmtp } from './lib/services.mjs';

const { dataDir, env } = profileEnv('test');
let code = 0;
// RB_BENCH=handover (or photos, sketch) runs only the matching benchmarks.
const wanted = (b) => !process.env.RB_BENCH || b.includes(process.env.RB_BENCH);
const browser = wanted('sketch');
try {
  ensureAptPackages([
    'mariadb-server',
    'mariadb-client',
    ...(browser ? ['chromium', 'fonts-open-sans'] : []),
  ]);
  ensureNodeModules();
  buildAll({ web: browser });
  const db = await startMariadb({ dataDir, env });
  db.rootSql(
    `DROP DATABASE IF EXISTS \`${env.DB_NAME}\`; CREATE DATABASE \`${env.DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
  );
  for (const d of ['s3', 'mail']) rmSync(path.join(dataDir, d), { recursive: true, force: true });
  await startS3({ dataDir, env });
  await startSmtp({ dataDir, env });
  migrateAndSeed(env);
  const benches = ['rounds-list', 'notice-latency', 'handover', 'photos'].filter(wanted);
  for (const bench of benches)
    run(process.execPath, [path.join(root, `apps/api/dist/bench/${bench}.bench.js`)], {
      env: { ...process.env, ...env },
    });
  if (browser) {
    // The browser benchmark starts from the freshly seeded demo, whatever the API benchmarks left behind.
    db.rootSql(
      `DROP DATABASE IF EXISTS \`${env.DB_NAME}\`; CREATE DATABASE \`${env.DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
    );
    migrateAndSeed(env);
    await startApi({ dataDir, env });
    // Asynchronously: the API's log is read by this process while the browser runs.
    const status = await runAsync('npx', ['playwright', 'test', '-c', 'playwright.bench.config.ts'], {
      cwd: path.join(root, 'apps/web'),
      env: {
        ...process.env,
        ROUNDBOOK_URL: `http://127.0.0.1:${env.PORT}`,
        ROUNDBOOK_DEMO_PASSWORD: env.DEMO_PASSWORD,
        PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1',
      },
    });
    if (status !== 0) throw new InfraError(`The sketch browser benchmark failed (exit code ${status}).`);
  }
  // The field-sync benchmark runs on the API the sketch benchmark started (or starts its own).
  if (wanted('field-sync'))
    await (await import('./bench-field.mjs')).fieldSyncBench({ dataDir, env, apiStarted: browser });
} catch (err) {
  fail(err instanceof InfraError ? err.message : (err?.stack ?? String(err)));
  code = 1;
}
await stopAll();
process.exit(code);
