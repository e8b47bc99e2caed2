#!/usr/bin/env node
// `npm run bench` (after the geomath benchmark): starts the test database, the S3 fake and the SMTP fake on
// their own ports, migrates and seeds the database, runs the API benchmarks against them, and stops what it
// started.
import { rmSync } from 'node:fs';
import path from 'node:path';
import { buildAll, ensureAptPackages, ensureNodeModules, migrateAndSeed } from './lib/bootstrap.mjs';
import { profileEnv, root } from './lib/env.mjs';
import { InfraError, fail } from './lib/log.mjs';
import { run, stopAll } from './lib/proc.mjs';
import { startMariadb, startS3, startSmtp } from './lib/services.mjs';

const { dataDir, env } = profileEnv('test');
let code = 0;
try {
  ensureAptPackages(['mariadb-server', 'mariadb-client']);
  ensureNodeModules();
  buildAll({ web: false });
  const db = await startMariadb({ dataDir, env });
  db.rootSql(
    `DROP DATABASE IF EXISTS \`${env.DB_NAME}\`; CREATE DATABASE \`${env.DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
  );
  for (const d of ['s3', 'mail']) rmSync(path.join(dataDir, d), { recursive: true, force: true });
  await startS3({ dataDir, env });
  await startSmtp({ dataDir, env });
  migrateAndSeed(env);
  // RB_BENCH=handover (or photos) runs only the matching API benchmarks.
  const benches = ['rounds-list', 'notice-latency', 'handover', 'photos'].filter(
    (b) => !process.env.RB_BENCH || b.includes(process.env.RB_BENCH),
  );
  for (const bench of benches)
    run(process.execPath, [path.join(root, `apps/api/dist/bench/${bench}.bench.js`)], {
      env: { ...process.env, ...env },
    });
  if (!process.env.RB_BENCH || 'field-sync'.includes(process.env.RB_BENCH))
    await (await import('./bench-field.mjs')).fieldSyncBench({ dataDir, env });
} catch (err) {
  fail(err instanceof InfraError ? err.message : (err?.stack ?? String(err)));
  code = 1;
}
await stopAll();
process.exit(code);
