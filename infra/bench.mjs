#!/usr/bin/env node
// `npm run bench` (after the geomath benchmark): starts the test database on its own port, migrates and
// seeds it, runs the API benchmarks against it, and stops what it started.
import path from 'node:path';
import { buildAll, ensureAptPackages, ensureNodeModules, migrateAndSeed } from './lib/bootstrap.mjs';
import { profileEnv, root } from './lib/env.mjs';
import { InfraError, fail } from './lib/log.mjs';
import { run, stopAll } from './lib/proc.mjs';
import { startMariadb } from './lib/services.mjs';

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
  migrateAndSeed(env);
  run(process.execPath, [path.join(root, 'apps/api/dist/bench/rounds-list.bench.js')], {
    env: { ...process.env, ...env },
  });
  run(process.execPath, [path.join(root, 'apps/api/dist/bench/notice-latency.bench.js')], {
    env: { ...process.env, ...env },
  });
} catch (err) {
  fail(err instanceof InfraError ? err.message : (err?.stack ?? String(err)));
  code = 1;
}
await stopAll();
process.exit(code);
