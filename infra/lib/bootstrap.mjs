// Installs what is missing, and only that: Debian packages with apt-get, npm packages with `npm ci`,
// then builds the workspaces. Node built-ins only (this runs before node_modules exists).
import { spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import path from 'node:path';
import { root } from './env.mjs';
import { InfraError, info, step } from './log.mjs';
import { run } from './proc.mjs';

const installed = (pkg) =>
  spawnSync('dpkg-query', ['-W', '-f=${Status}', pkg], { encoding: 'utf8' }).stdout?.includes(
    'install ok installed',
  );

export function ensureAptPackages(packages) {
  const missing = packages.filter((p) => !installed(p));
  if (missing.length === 0) return;
  if (process.getuid?.() !== 0) {
    throw new InfraError(
      `Missing Debian packages: ${missing.join(' ')}. Install them with: sudo apt-get install -y ${missing.join(' ')}`,
    );
  }
  step(`Installing Debian packages: ${missing.join(', ')} (a few minutes on a fresh machine)`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const apt = ['-o', 'DPkg::Lock::Timeout=600'];
  run('apt-get', [...apt, 'update', '-q'], {
    env,
    quiet: true,
    hint: 'Check the network access to the Debian mirrors.',
  });
  run('apt-get', [...apt, 'install', '-y', '-q', '--no-install-recommends', ...missing], {
    env,
    hint: `Install them by hand: apt-get install -y ${missing.join(' ')}`,
  });
}

/** `npm ci` when node_modules is missing or older than package-lock.json. */
export function ensureNodeModules() {
  const lock = path.join(root, 'package-lock.json');
  const marker = path.join(root, 'node_modules', '.package-lock.json');
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return;
  step('Installing npm packages (npm ci; about a minute on a fresh machine)');
  run('npm', ['ci', '--no-audit', '--no-fund', '--loglevel=error'], {
    cwd: root,
    env: { ...process.env, PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1' },
    hint: 'See the npm output above.',
  });
}

export function buildAll({ web = true } = {}) {
  step(web ? 'Building geomath, the API and the web app' : 'Building geomath and the API');
  const env = { ...process.env, NODE_ENV: 'production' };
  run('npm', ['run', '--silent', 'build', '-w', '@roundbook/geomath'], {
    cwd: root,
    env,
    quiet: true,
    hint: 'The geomath build failed.',
  });
  info('geomath built');
  run('npm', ['run', '--silent', 'build', '-w', '@roundbook/api'], {
    cwd: root,
    env,
    quiet: true,
    hint: 'The API build failed.',
  });
  info('API built');
  run('npm', ['run', '--silent', 'build', '-w', '@roundbook/web'], {
    cwd: root,
    env,
    quiet: true,
    hint: 'The web build failed.',
  });
  info('web app built');
}

/** Checks the environment through the API's own validation before any service starts. */
export function checkEnvironment(env) {
  const r = spawnSync(process.execPath, [path.join(root, 'apps/api/dist/cli.js'), 'check-env'], {
    env: { ...process.env, ...env },
    encoding: 'utf8',
  });
  if (r.status !== 0) throw new InfraError((r.stderr || r.stdout).trim() || 'The environment is not valid.');
}

/** Runs the migrations and, when the database is empty, seeds the demo scenario. */
export function migrateAndSeed(env, { seed = true } = {}) {
  step('Running database migrations');
  run(process.execPath, [path.join(root, 'apps/api/dist/cli.js'), 'migrate'], {
    env: { ...process.env, ...env },
    hint: 'The migrations failed.',
  });
  if (seed) {
    run(process.execPath, [path.join(root, 'apps/api/dist/cli.js'), 'seed'], {
      env: { ...process.env, ...env },
      hint: 'Seeding the demo failed.',
    });
  }
}
