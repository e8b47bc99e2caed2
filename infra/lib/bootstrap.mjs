// Installs what is missing, and only that: Debian packages with apt-get, npm packages with `npm ci`,
// then builds the workspaces. Node built-ins only (this runs before node_modules exists).
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
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

/** Newest modification time of the files under `inputs` (node_modules and outputs skipped). */
function newest(inputs) {
  let latest = 0;
  const walk = (p) => {
    if (!existsSync(p)) return;
    const st = statSync(p);
    if (!st.isDirectory()) {
      latest = Math.max(latest, st.mtimeMs);
      return;
    }
    for (const name of readdirSync(p)) {
      if (!['node_modules', 'dist', 'test-results', 'e2e'].includes(name)) walk(path.join(p, name));
    }
  };
  for (const input of inputs) walk(path.join(root, input));
  return latest;
}

/** Builds a workspace unless its output is newer than every input it is built from. */
function build(name, workspace, inputs, output) {
  const out = path.join(root, output);
  if (existsSync(out) && statSync(out).mtimeMs > newest(inputs)) {
    info(`${name} is up to date`);
    return;
  }
  const env = { ...process.env, NODE_ENV: 'production' };
  run('npm', ['run', '--silent', 'build', '-w', workspace], {
    cwd: root,
    env,
    quiet: true,
    hint: `The ${name} build failed.`,
  });
  info(`${name} built`);
}

export function buildAll({ web = true } = {}) {
  step(
    web
      ? 'Building geomath, domain, the API and the web app (when changed)'
      : 'Building geomath, domain and the API (when changed)',
  );
  const lock = 'package-lock.json';
  const geomath = [
    'packages/geomath/src',
    'packages/geomath/package.json',
    'packages/geomath/tsconfig.build.json',
  ];
  build('geomath', '@roundbook/geomath', [...geomath, lock], 'packages/geomath/dist/index.js');
  const domain = [
    'packages/domain/src',
    'packages/domain/package.json',
    'packages/domain/tsconfig.build.json',
    ...geomath,
  ];
  build('domain', '@roundbook/domain', [...domain, lock], 'packages/domain/dist/index.js');
  build(
    'the API',
    '@roundbook/api',
    [
      'apps/api/src',
      'apps/api/package.json',
      'apps/api/tsconfig.json',
      'apps/api/tsconfig.build.json',
      'apps/api/nest-cli.json',
      ...domain,
      lock,
    ],
    'apps/api/dist/main.js',
  );
  if (!web) return;
  build(
    'the web app',
    '@roundbook/web',
    [
      'apps/web/src',
      'apps/web/index.html',
      'apps/web/vite.config.ts',
      'apps/web/package.json',
      'packages/ui/src',
      ...domain,
      lock,
    ],
    'apps/web/dist/index.html',
  );
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
