#!/usr/bin/env node
// `npm start`: install what is missing, build, start MariaDB, the S3 fake, the SMTP fake and Roundbook on
// loopback, migrate, seed the demo when the database is empty, print the address and logins. Ctrl-C stops
// everything this script started, by PID.
import path from 'node:path';
import {
  ensureAptPackages,
  ensureNodeModules,
  buildAll,
  checkEnvironment,
  migrateAndSeed,
} from './lib/bootstrap.mjs';
import { profileEnv, root } from './lib/env.mjs';
import { InfraError, fail, step } from './lib/log.mjs';
import { startChild, stopAll, waitForLine } from './lib/proc.mjs';
import { assertPortFree, startApi, startMariadb, startS3, startSmtp } from './lib/services.mjs';
import { supervise } from './lib/supervise.mjs';

const { dataDir, env } = profileEnv('local');
const dev = process.argv.includes('--dev');
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
  buildAll({ web: !dev });
  checkEnvironment(env);
  // Every port is checked before anything starts, so a clash never leaves half the services running.
  await assertPortFree(Number(new URL(env.S3_ENDPOINT).port), 'the S3 fake', 'S3_ENDPOINT');
  await assertPortFree(Number(env.SMTP_PORT), 'the SMTP fake', 'SMTP_PORT');
  await assertPortFree(Number(env.PORT), 'Roundbook', 'PORT');
  const isStopping = () => stopping;
  const logs = (name) => `See ${dataDir}/logs/${name}.log.`;
  const db = await startMariadb({ dataDir, env });
  supervise('MariaDB', db.child, async () => (await startMariadb({ dataDir, env })).child, {
    isStopping,
    logHint: logs('mariadb'),
  });
  supervise('The S3 fake', await startS3({ dataDir, env }), () => startS3({ dataDir, env }), {
    isStopping,
    logHint: logs('s3'),
  });
  supervise('The SMTP fake', await startSmtp({ dataDir, env }), () => startSmtp({ dataDir, env }), {
    isStopping,
    logHint: logs('smtp'),
  });
  migrateAndSeed(env);
  if (dev) {
    await startDev();
    await new Promise(() => {}); // until Ctrl-C
  }
  // One API crash does not take the stack down: it is restarted with back-off like the services.
  supervise('Roundbook (the API)', await startApi({ dataDir, env }), () => startApi({ dataDir, env }), {
    isStopping,
    logHint: logs('api'),
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
    night-supervisor@roundbook.test  the other shift's supervisor
    viewer@roundbook.test      client's representative (read only)

  Data is kept in ${dataDir}. Press Ctrl-C to stop.
`);
} catch (err) {
  fail(err instanceof InfraError ? err.message : (err?.stack ?? String(err)));
  await shutdown(1);
}

/** `npm run dev`: the API with reload (nest start --watch) and the Vite dev server proxying /api to it. */
async function startDev() {
  step('Development mode: API with reload, Vite dev server');
  const apiEnv = { ...process.env, ...env, NODE_ENV: 'development', WEB_DIST_DIR: '' };
  const api = startChild('API (watch)', 'npx', ['nest', 'start', '--watch', '--preserveWatchOutput'], {
    cwd: path.join(root, 'apps/api'),
    env: apiEnv,
  });
  api.stdout.pipe(process.stdout);
  api.stderr.pipe(process.stderr);
  await waitForLine(api, /Roundbook listening/, { name: 'The API', timeoutMs: 120000 });
  const web = startChild(
    'Vite dev server',
    'npx',
    ['vite', '--host', '127.0.0.1', '--port', '5173', '--strictPort'],
    { cwd: path.join(root, 'apps/web') },
  );
  web.stdout.pipe(process.stdout);
  web.stderr.pipe(process.stderr);
  await waitForLine(web, /Local:/, { name: 'The Vite dev server', timeoutMs: 60000 });
  console.log(
    `\n  Development: web app with reload at http://127.0.0.1:5173 (API on ${env.HOST}:${env.PORT}). Ctrl-C stops all.\n`,
  );
}
