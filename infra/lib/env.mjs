// The environment for one profile ('local' for `npm start`, 'test' for `npm test`): defaults on loopback,
// then values from `.env` (if present), then the process environment. The API validates the result once
// (apps/api/src/config/env.validation.ts) before any service is started.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

export const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '../..');

const profiles = {
  local: { dataDir: '.data', dbPort: 3307, s3Port: 4569, smtpPort: 2525, apiPort: 8080, dbName: 'roundbook' },
  test: {
    dataDir: '.data/test',
    dbPort: 3308,
    s3Port: 4570,
    smtpPort: 2526,
    apiPort: 8081,
    dbName: 'roundbook_test',
  },
  // `npm run faults`: an instance of its own, killed and restarted on purpose (infra/faults.mjs).
  faults: {
    dataDir: '.data/faults',
    dbPort: 3309,
    s3Port: 4571,
    smtpPort: 2527,
    apiPort: 8082,
    dbName: 'roundbook_faults',
  },
};

function readDotEnv(file) {
  if (!existsSync(file)) return {};
  const out = {};
  for (const raw of readFileSync(file, 'utf8').split('\n')) {
    const line = raw.trim();
    if (!line || line.startsWith('#')) continue;
    const eq = line.indexOf('=');
    if (eq < 0) continue;
    let value = line.slice(eq + 1).trim();
    if (/^(['"]).*\1$/.test(value)) value = value.slice(1, -1);
    out[line.slice(0, eq).trim()] = value;
  }
  return out;
}

/** A secret kept in the profile's data folder so that tokens survive a restart. */
function localSecret(dataDir, name) {
  const file = path.join(dataDir, 'secrets.json');
  mkdirSync(dataDir, { recursive: true });
  const secrets = existsSync(file) ? JSON.parse(readFileSync(file, 'utf8')) : {};
  if (!secrets[name]) {
    secrets[name] = randomBytes(32).toString('hex');
    writeFileSync(file, JSON.stringify(secrets, null, 2), { mode: 0o600 });
  }
  return secrets[name];
}

export function profileEnv(profileName) {
  const base = profiles[profileName];
  // The test and faults profiles ignore .env: they always run on their own folder and loopback ports.
  const isolated = profileName !== 'local';
  // RB_TEST_PORT_OFFSET moves every test (and faults) port by N, so that several checkouts on one machine
  // can run them at once (each with its own RB_DATA_DIR). The local profile's ports come from .env instead.
  const offset = isolated ? Number(process.env.RB_TEST_PORT_OFFSET ?? 0) || 0 : 0;
  const p = {
    ...base,
    dbPort: base.dbPort + offset,
    s3Port: base.s3Port + offset,
    smtpPort: base.smtpPort + offset,
    apiPort: base.apiPort + offset,
  };
  const fromFile = isolated ? {} : readDotEnv(path.join(root, '.env'));
  const given = { ...fromFile, ...process.env };
  const dataDir = path.resolve(root, given.RB_DATA_DIR ?? p.dataDir);
  const pick = (name, fallback) => (isolated ? fallback : (given[name] ?? fallback));
  const env = {
    NODE_ENV: isolated ? 'test' : (given.NODE_ENV ?? 'production'),
    RB_DATA_DIR: dataDir,
    HOST: pick('HOST', '127.0.0.1'),
    PORT: pick('PORT', String(p.apiPort)),
    APP_URL: pick('APP_URL', `http://127.0.0.1:${pick('PORT', String(p.apiPort))}`),
    LOCAL_MODE: pick('LOCAL_MODE', 'true'),
    DB_HOST: pick('DB_HOST', '127.0.0.1'),
    DB_PORT: pick('DB_PORT', String(p.dbPort)),
    DB_NAME: pick('DB_NAME', p.dbName),
    DB_USER: pick('DB_USER', 'roundbook'),
    DB_PASSWORD: pick('DB_PASSWORD', 'roundbook-local-pw'),
    JWT_SECRET: given.JWT_SECRET ?? localSecret(dataDir, 'jwtSecret'),
    JWT_EXPIRES_IN: pick('JWT_EXPIRES_IN', '12h'),
    STORAGE_DRIVER: pick('STORAGE_DRIVER', 's3'),
    S3_ENDPOINT: pick('S3_ENDPOINT', `http://127.0.0.1:${p.s3Port}`),
    S3_REGION: pick('S3_REGION', 'us-east-1'),
    S3_BUCKET: pick('S3_BUCKET', 'roundbook'),
    S3_ACCESS_KEY_ID: pick('S3_ACCESS_KEY_ID', 'S3RVER'),
    S3_SECRET_ACCESS_KEY: pick('S3_SECRET_ACCESS_KEY', 'S3RVER'),
    S3_FORCE_PATH_STYLE: pick('S3_FORCE_PATH_STYLE', 'true'),
    MAIL_DRIVER: pick('MAIL_DRIVER', 'smtp'),
    SMTP_HOST: pick('SMTP_HOST', '127.0.0.1'),
    SMTP_PORT: pick('SMTP_PORT', String(p.smtpPort)),
    SMTP_SECURE: pick('SMTP_SECURE', 'false'),
    SMTP_IGNORE_TLS: pick('SMTP_IGNORE_TLS', 'true'),
    MAIL_FROM: pick('MAIL_FROM', 'Roundbook <roundbook@roundbook.test>'),
    LOCAL_MAIL_DIR: pick('LOCAL_MAIL_DIR', path.join(dataDir, 'mail')),
    WEB_DIST_DIR: pick('WEB_DIST_DIR', path.join(root, 'apps/web/dist')),
    DEMO_PASSWORD: pick('DEMO_PASSWORD', 'rb-demo-2026'),
    LOGIN_RATE_LIMIT: pick('LOGIN_RATE_LIMIT', isolated ? '1000' : '10'),
    WORKER_ENABLED: pick('WORKER_ENABLED', 'true'),
    JOBS_POLL_INTERVAL_MS: pick('JOBS_POLL_INTERVAL_MS', isolated ? '50' : '1000'),
    // Local and test instances let anyone signed in create a project; the API's own default is operators.
    PROJECT_CREATION: pick('PROJECT_CREATION', 'anyone'),
  };
  return {
    profile: profileName,
    dataDir,
    ports: {
      db: Number(env.DB_PORT),
      s3: Number(new URL(env.S3_ENDPOINT).port),
      smtp: Number(env.SMTP_PORT),
      api: Number(env.PORT),
    },
    env,
  };
}
