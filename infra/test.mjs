#!/usr/bin/env node
// `npm test`: the same bootstrap as `npm start` into a separate data folder and ports, then every tier —
// static checks, unit tests, API end-to-end tests, browser tests — and one closing line `N passed, N failed`.
// Options: --only static|unit|e2e|browser (repeatable).

import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import {
  buildAll,
  checkEnvironment,
  ensureAptPackages,
  ensureNodeModules,
  migrateAndSeed,
} from './lib/bootstrap.mjs';
import { profileEnv, root } from './lib/env.mjs';
import { InfraError, fail, info, step } from './lib/log.mjs';
import { runAsync, stopAll } from './lib/proc.mjs';
import { startApi, startMariadb, startS3, startSmtp } from './lib/services.mjs';

const only = process.argv.flatMap((a, i, all) => (a === '--only' ? [all[i + 1]] : []));
const want = (tier) => only.length === 0 || only.includes(tier);
const results = []; // { tier, name, passed, failed }
const record = (tier, name, passed, failed) => {
  results.push({ tier, name, passed, failed });
  info(`${failed ? '\u2716' : '\u2714'} ${tier}: ${name} — ${passed} passed, ${failed} failed`);
};

const { dataDir, env } = profileEnv('test');
const childEnv = { ...process.env, ...env, CI: process.env.CI ?? 'true', FORCE_COLOR: '0' };
const scratch = mkdtempSync(path.join(tmpdir(), 'roundbook-test-'));

/** A command that passes or fails as a whole counts as one check. */
async function check(tier, name, command, args, opts = {}) {
  step(`${tier}: ${name}`);
  const code = await runAsync(command, args, { cwd: root, env: childEnv, ...opts });
  record(tier, name, code === 0 ? 1 : 0, code === 0 ? 0 : 1);
}

/** Jest with a JSON report; counts its tests. */
async function jest(tier, name, workspaceDir, extraArgs = []) {
  step(`${tier}: ${name}`);
  const out = path.join(scratch, `${name.replace(/\W+/g, '-')}.json`);
  const code = await runAsync('npx', ['jest', ...extraArgs, '--ci', '--json', `--outputFile=${out}`], {
    cwd: path.join(root, workspaceDir),
    env: childEnv,
  });
  if (!existsSync(out)) return record(tier, name, 0, 1);
  const r = JSON.parse(readFileSync(out, 'utf8'));
  const failedSuites = r.numFailedTestSuites > 0 && r.numFailedTests === 0 ? 1 : 0; // a suite that failed to load
  record(
    tier,
    name,
    r.numPassedTests,
    r.numFailedTests + failedSuites + (code !== 0 && r.numFailedTests === 0 && !failedSuites ? 1 : 0),
  );
}

let stopping = false;
async function finish(code) {
  if (stopping) return;
  stopping = true;
  await stopAll();
  rmSync(scratch, { recursive: true, force: true });
  const passed = results.reduce((s, r) => s + r.passed, 0);
  const failed = results.reduce((s, r) => s + r.failed, 0);
  console.log('\nSummary by tier:');
  for (const r of results)
    console.log(
      `  ${r.failed ? 'FAIL' : 'ok  '} ${r.tier.padEnd(8)} ${r.name.padEnd(44)} ${r.passed} passed, ${r.failed} failed`,
    );
  console.log(`\n${passed} passed, ${failed} failed`);
  process.exit(code !== 0 || failed > 0 || passed === 0 ? 1 : 0);
}
process.on('SIGINT', () => void finish(130));
process.on('SIGTERM', () => void finish(143));

try {
  step('Roundbook tests: checking what is installed');
  ensureAptPackages([
    'mariadb-server',
    'mariadb-client',
    'fonts-open-sans',
    ...(want('browser') ? ['chromium'] : []),
    // pdfimages and pdftoppm: the handover e2e lists the pictures inside the PDF, the handover browser walk
    // renders its first page to PNG.
    ...(want('e2e') || want('browser') ? ['poppler-utils'] : []),
  ]);
  ensureNodeModules();

  if (want('static')) {
    await check('static', 'ESLint, zero warnings', 'npx', ['eslint', '.', '--max-warnings', '0']);
    await check('static', 'Prettier', 'npx', ['prettier', '--check', '.', '--log-level', 'warn']);
  }
  buildAll();
  if (want('static')) {
    await check('static', 'TypeScript (all workspaces)', 'npm', ['run', '--silent', 'typecheck']);
    await check('static', 'OpenAPI document and web client up to date', process.execPath, [
      path.join(root, 'infra/check-contract.mjs'),
    ]);
  }
  if (want('unit')) {
    await jest('unit', 'packages/geomath', 'packages/geomath', ['--config', 'jest.config.cjs']);
    await jest('unit', 'packages/domain', 'packages/domain', ['--config', 'jest.config.cjs']);
    await jest('unit', 'packages/ui', 'packages/ui');
    await jest('unit', 'apps/api', 'apps/api', ['--config', 'jest.config.cjs']);
    await jest('unit', 'apps/web', 'apps/web');
    await check('unit', 'infra supervisor back-off (node --test)', process.execPath, [
      '--test',
      path.join(root, 'infra/lib/supervise.test.mjs'),
    ]);
  }
  if (want('e2e') || want('browser')) {
    checkEnvironment(env);
    // A clean slate for every run: the test database, objects and mail are recreated.
    for (const d of ['s3', 'mail', 'logs']) rmSync(path.join(dataDir, d), { recursive: true, force: true });
    const db = await startMariadb({ dataDir, env });
    const recreateDatabase = () => {
      const r = db.rootSql(
        `DROP DATABASE IF EXISTS \`${env.DB_NAME}\`; CREATE DATABASE \`${env.DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
      );
      if (r.status !== 0) throw new InfraError(`Could not recreate the test database: ${r.stderr}`);
    };
    recreateDatabase();
    await startS3({ dataDir, env });
    await startSmtp({ dataDir, env });
    migrateAndSeed(env);
    if (want('e2e'))
      await jest('e2e', 'apps/api end-to-end', 'apps/api', [
        '--config',
        'jest-e2e.config.cjs',
        '--runInBand',
        // RB_E2E_FILES=round-record runs only the matching e2e files (while working on one module).
        ...(process.env.RB_E2E_FILES ? [process.env.RB_E2E_FILES] : []),
      ]);
    if (want('browser')) {
      if (want('e2e')) {
        // The browser tests start from the freshly seeded demo, whatever the API tests left behind.
        step('Recreating the test database for the browser tests');
        recreateDatabase();
        // And an empty inbox: the local mail view would list the API tests' e-mails beside the demo's.
        const mailDir = env.LOCAL_MAIL_DIR;
        for (const f of existsSync(mailDir) ? readdirSync(mailDir) : [])
          rmSync(path.join(mailDir, f), { force: true });
        migrateAndSeed(env);
      }
      await startApi({ dataDir, env });
      step('browser: Playwright in Chromium');
      const out = path.join(scratch, 'playwright.json');
      // RB_BROWSER_FILES=handover runs only the matching Playwright specs (while working on one screen).
      const browserFiles = process.env.RB_BROWSER_FILES ? [process.env.RB_BROWSER_FILES] : [];
      await runAsync('npx', ['playwright', 'test', '--reporter=list,json', ...browserFiles], {
        cwd: path.join(root, 'apps/web'),
        env: {
          ...childEnv,
          ROUNDBOOK_URL: `http://127.0.0.1:${env.PORT}`,
          ROUNDBOOK_DEMO_PASSWORD: env.DEMO_PASSWORD,
          PLAYWRIGHT_JSON_OUTPUT_NAME: out,
          PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1',
        },
      });
      if (existsSync(out)) {
        const s = JSON.parse(readFileSync(out, 'utf8')).stats ?? {};
        record('browser', 'apps/web Playwright', (s.expected ?? 0) + (s.flaky ?? 0), s.unexpected ?? 0);
      } else record('browser', 'apps/web Playwright', 0, 1);
    }
  }
  await finish(0);
} catch (err) {
  fail(err instanceof InfraError ? err.message : (err?.stack ?? String(err)));
  results.push({ tier: 'setup', name: 'bootstrap', passed: 0, failed: 1 });
  await finish(1);
}
