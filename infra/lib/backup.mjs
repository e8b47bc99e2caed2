// Backup and restore of one Roundbook instance: a consistent dump of the database (one transaction,
// mariadb-dump --single-transaction) and a copy of every object in the bucket, into a dated folder with a
// manifest (row counts and CHECKSUM TABLE per table, size and SHA-256 per object) that restore checks.
import { spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import {
  createReadStream,
  createWriteStream,
  existsSync,
  mkdirSync,
  readFileSync,
  writeFileSync,
} from 'node:fs';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import {
  CreateBucketCommand,
  GetObjectCommand,
  HeadBucketCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import { InfraError, info, step } from './log.mjs';

const s3Of = (env) =>
  new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    forcePathStyle: env.S3_FORCE_PATH_STYLE === 'true',
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
    // The S3 fake does not speak the newer checksum headers (stack-notes).
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });

/** Connection arguments for the mariadb clients: the root socket when given (restore), else the app's user. */
const dbArgs = (env, socket) =>
  socket
    ? ['--no-defaults', `--socket=${socket}`, '-uroot']
    : [
        '--no-defaults',
        `--host=${env.DB_HOST}`,
        `--port=${env.DB_PORT}`,
        `--user=${env.DB_USER}`,
        `--password=${env.DB_PASSWORD}`,
      ];

function sql(env, statement, { socket, database } = {}) {
  const r = spawnSync(
    'mariadb',
    [...dbArgs(env, socket), '--batch', '--skip-column-names', ...(database ? [database] : [])],
    {
      input: statement,
      encoding: 'utf8',
    },
  );
  if (r.status !== 0) throw new InfraError(`MariaDB refused: ${r.stderr.trim()}`);
  return r.stdout;
}

/** Row count and CHECKSUM TABLE of every table of the database. */
export function tableSummary(env, database, options = {}) {
  const tables = sql(env, 'SHOW TABLES;', { ...options, database })
    .split('\n')
    .filter(Boolean)
    .sort();
  const summary = {};
  for (const t of tables) {
    const rows = Number(sql(env, `SELECT COUNT(*) FROM \`${t}\`;`, { ...options, database }).trim());
    const checksum = sql(env, `CHECKSUM TABLE \`${t}\`;`, { ...options, database })
      .trim()
      .split('\t')[1];
    summary[t] = { rows, checksum };
  }
  return summary;
}

async function listObjects(s3, bucket) {
  const keys = [];
  let token;
  do {
    const page = await s3.send(new ListObjectsV2Command({ Bucket: bucket, ContinuationToken: token }));
    for (const o of page.Contents ?? []) keys.push({ key: o.Key, size: o.Size });
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return keys.sort((a, b) => a.key.localeCompare(b.key));
}

const sha256File = async (file) => {
  const hash = createHash('sha256');
  await pipeline(createReadStream(file), hash);
  return hash.digest('hex');
};

function dumpTo(env, file) {
  return new Promise((resolve, reject) => {
    const child = spawn(
      'mariadb-dump',
      [
        ...dbArgs(env),
        '--single-transaction',
        '--quick',
        '--hex-blob',
        '--routines',
        '--triggers',
        '--skip-comments',
        env.DB_NAME,
      ],
      { stdio: ['ignore', 'pipe', 'pipe'] },
    );
    let err = '';
    child.stderr.on('data', (d) => (err += d));
    pipeline(child.stdout, createWriteStream(file)).catch(reject);
    child.on('close', (code) =>
      code === 0 ? resolve() : reject(new InfraError(`mariadb-dump failed: ${err.trim()}`)),
    );
  });
}

/** Writes `<dir>/database.sql`, `<dir>/objects/…` and `<dir>/manifest.json`; returns the manifest. */
export async function backup(env, dir) {
  mkdirSync(path.join(dir, 'objects'), { recursive: true });
  // The dump is one consistent transaction; the manifest's counts and checksums are read around it, and the
  // dump is taken again (up to three times) when something was written meanwhile, so they describe it.
  const dumpFile = path.join(dir, 'database.sql');
  let tables = null;
  for (let attempt = 1; attempt <= 3 && tables === null; attempt++) {
    step(
      `Dumping database ${env.DB_NAME} (one consistent transaction${attempt > 1 ? `, attempt ${attempt}` : ''})`,
    );
    const before = tableSummary(env, env.DB_NAME);
    await dumpTo(env, dumpFile);
    const after = tableSummary(env, env.DB_NAME);
    if (JSON.stringify(before) === JSON.stringify(after)) tables = after;
    else info('the database changed during the dump; taking it again');
  }
  if (tables === null)
    throw new InfraError(
      'The database kept changing during the dump: stop Roundbook (or its writes) and run the backup again.',
    );
  step(`Copying the objects of bucket ${env.S3_BUCKET}`);
  const s3 = s3Of(env);
  const objects = [];
  for (const { key, size } of await listObjects(s3, env.S3_BUCKET)) {
    const file = path.join(dir, 'objects', key);
    if (!path.resolve(file).startsWith(path.resolve(dir, 'objects') + path.sep))
      throw new InfraError(`Refusing an object key that leaves the backup folder: ${key}`);
    mkdirSync(path.dirname(file), { recursive: true });
    const got = await s3.send(new GetObjectCommand({ Bucket: env.S3_BUCKET, Key: key }));
    await pipeline(got.Body, createWriteStream(file));
    objects.push({ key, size, sha256: await sha256File(file), contentType: got.ContentType ?? null });
  }
  const manifest = {
    kind: 'roundbook-backup',
    version: 1,
    createdAt: new Date().toISOString(),
    database: env.DB_NAME,
    bucket: env.S3_BUCKET,
    tables,
    objects,
  };
  writeFileSync(path.join(dir, 'manifest.json'), JSON.stringify(manifest, null, 2));
  info(
    `${Object.keys(tables).length} tables, ${Object.values(tables).reduce((n, t) => n + t.rows, 0)} rows, ${objects.length} objects → ${dir}`,
  );
  return manifest;
}

/**
 * Restores a backup folder into `database` (created if missing; its tables replaced) and `bucket`
 * (created if missing), then checks row counts and checksums against the manifest. Needs the root socket of
 * the MariaDB instance to create a database other than the app's own.
 */
export async function restore(env, dir, { database = env.DB_NAME, bucket = env.S3_BUCKET, socket } = {}) {
  const manifestFile = path.join(dir, 'manifest.json');
  if (!existsSync(manifestFile))
    throw new InfraError(`${dir} holds no manifest.json: not a Roundbook backup.`);
  const manifest = JSON.parse(readFileSync(manifestFile, 'utf8'));
  if (manifest.kind !== 'roundbook-backup')
    throw new InfraError(`${manifestFile} is not a Roundbook backup manifest.`);
  if (!/^[A-Za-z0-9_]+$/.test(database)) throw new InfraError(`Not a database name: ${database}`);
  step(`Restoring the database into ${database}`);
  const options = { socket };
  sql(
    env,
    `CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
    options,
  );
  if (socket) {
    sql(
      env,
      `GRANT ALL PRIVILEGES ON \`${database}\`.* TO '${env.DB_USER}'@'127.0.0.1', '${env.DB_USER}'@'localhost';`,
      options,
    );
  }
  await new Promise((resolve, reject) => {
    const child = spawn('mariadb', [...dbArgs(env, socket), database], { stdio: ['pipe', 'ignore', 'pipe'] });
    let err = '';
    child.stderr.on('data', (d) => (err += d));
    pipeline(createReadStream(path.join(dir, 'database.sql')), child.stdin).catch(reject);
    child.on('close', (code) =>
      code === 0 ? resolve() : reject(new InfraError(`Loading the dump failed: ${err.trim()}`)),
    );
  });
  step(`Restoring ${manifest.objects.length} objects into bucket ${bucket}`);
  const s3 = s3Of(env);
  try {
    await s3.send(new HeadBucketCommand({ Bucket: bucket }));
  } catch {
    await s3.send(new CreateBucketCommand({ Bucket: bucket }));
  }
  for (const o of manifest.objects) {
    const file = path.join(dir, 'objects', o.key);
    if ((await sha256File(file)) !== o.sha256)
      throw new InfraError(`Object ${o.key} does not match its checksum in the manifest.`);
    await s3.send(
      new PutObjectCommand({
        Bucket: bucket,
        Key: o.key,
        Body: readFileSync(file),
        ContentType: o.contentType ?? undefined,
      }),
    );
  }
  const restored = tableSummary(env, database, options);
  const differences = Object.keys({ ...manifest.tables, ...restored }).filter(
    (t) =>
      manifest.tables[t]?.rows !== restored[t]?.rows ||
      manifest.tables[t]?.checksum !== restored[t]?.checksum,
  );
  if (differences.length)
    throw new InfraError(`Restored tables differ from the backup: ${differences.join(', ')}`);
  const objects = await listObjects(s3, bucket);
  const missing = manifest.objects.filter((o) => !objects.some((x) => x.key === o.key && x.size === o.size));
  if (missing.length)
    throw new InfraError(`Objects missing after restore: ${missing.map((o) => o.key).join(', ')}`);
  info(`restored and checked: ${Object.keys(restored).length} tables, ${manifest.objects.length} objects`);
  return { manifest, restored };
}
