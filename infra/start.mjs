#!/usr/bin/env node
// `npm start`: install what is missing, build, start MariaDB, the S3 fake, the SMTP fake and Roundbook on
// loopback, migrate, seed the demo when the database is empty, print the address and logins. Ctrl-C stops
// everything this script started, by PID.
import {
  ensureAptPackages,
  ensureNodeModules,
  buildAll,
  checkEnvironment,
  migrateAndSeed,
} from './lib/bootstrap.mjs';
import { profileEnv } from './lib/env.mjs';
import { InfraError, fail, step } from './lib/log.mjs';
import { stopAll } from './lib/proc.mjs';
import { startApi, startMariadb, startS3, startSmtp } from './lib/services.mjs';

const { dataDir, env } = profileEnv('local');
let stopping = false;

async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  step('Stopping everything started by npm start');
  await stopAll();
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));
process.on('SIGHUP', () => void shutdown(0));

try {
  step('Roundbook: checking what is installed');
  ensureAptPackages(['mariadb-server', 'mariadb-client', 'fonts-open-sans']);
  ensureNodeModules();
  buildAll();
  checkEnvironment(env);
  await startMariadb({ dataDir, env });
  await startS3({ dataDir, env });
  await startSmtp({ dataDir, env });
  migrateAndSeed(env);
  const api = await startApi({ dataDir, env });
  api.on('exit', (code) => {
    if (!stopping) {
      fail(`Roundbook stopped unexpectedly (exit code ${code}); see ${dataDir}/logs/api.log`);
      void shutdown(1);
    }
  });
  const url = `http://${env.HOST}:${env.PORT}`;
  console.log(`
  Roundbook is running at ${url}
  API documentation:       ${url}/api/docs
  Mail received (admins):  ${url}/mail

  Demo logins (password for all: ${env.DEMO_PASSWORD})
    admin@roundbook.test       project admin
    geologist@roundbook.test   shift geologist
    engineer@roundbook.test    site engineer
    supervisor@roundbook.test  shift supervisor
    viewer@roundbook.test      client's representative (read only)

  Data is kept in ${dataDir}. Press Ctrl-C to stop.
`);
} catch (err) {
  fail(err instanceof InfraError ? err.message : (err?.stack ?? String(err)));
  await shutdown(1);
}
