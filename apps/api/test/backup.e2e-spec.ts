// Issue 20, item 5: `npm run backup` and `npm run restore` round-trip the instance — the database (a project
// with a round, its joints and audit trail, the demo too) and the objects in storage — into another database
// and bucket, with the same row counts and table checksums (restore checks them against the manifest; this
// test checks them again on its own) and the same object bytes.
import { spawnSync } from 'node:child_process';
import { createHash, randomBytes } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { makeProject, type TestProject } from './factories';
import { createTestApp } from './test-app';

const code = `BK${String(Date.now() % 1e6)}`;
const root = path.resolve(__dirname, '../../..');
const env = process.env;

describe('Backup and restore (e2e, mariadb-dump and the S3 fake)', () => {
  let app: INestApplication;
  let p: TestProject;
  let dir: string;
  const restoredDb = `${env.DB_NAME}_restore`;
  const restoredBucket = `roundbook-restore-${code.toLowerCase()}`;
  const s3 = new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    forcePathStyle: true,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID!, secretAccessKey: env.S3_SECRET_ACCESS_KEY! },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });

  beforeAll(async () => {
    app = await createTestApp();
    p = await makeProject(app, { code });
    await request(app.getHttpServer() as App)
      .post(`${p.base}/headings/${p.headingId}/rounds`)
      .set(p.as('geologist'))
      .send({ stage: 'full-face', faceChainage: 1003 })
      .expect(201);
    dir = mkdtempSync(path.join(tmpdir(), 'rb-backup-'));
  });

  afterAll(async () => {
    try {
      // Restore granted the app's user this database; without a restore there is nothing to drop.
      await app.get(DataSource).query(`DROP DATABASE IF EXISTS \`${restoredDb}\``);
    } catch {
      // not created
    } finally {
      await app.close();
      rmSync(dir, { recursive: true, force: true });
    }
  });

  /** The infra scripts' own failure line (✖ …), if any; the SDK's Node-version notice is not one. */
  const failure = (stderr: string) => /✖.*/.exec(stderr)?.[0] ?? null;
  const node = (script: string, args: string[]) =>
    spawnSync(process.execPath, [path.join(root, 'infra', script), '--profile', 'test', ...args], {
      cwd: root,
      env,
      encoding: 'utf8',
    });

  it('backs up the database and the objects, and restores both into another database and bucket, identical', async () => {
    const key = `projects/${p.projectId}/backup-check/${code}.bin`;
    const bytes = randomBytes(300_000);
    await s3.send(
      new PutObjectCommand({
        Bucket: env.S3_BUCKET,
        Key: key,
        Body: bytes,
        ContentType: 'application/octet-stream',
      }),
    );

    const made = node('backup.mjs', ['--to', dir]);
    expect({ status: made.status, failure: failure(made.stderr) }).toEqual({ status: 0, failure: null });
    const manifest = JSON.parse(readFileSync(path.join(dir, 'manifest.json'), 'utf8')) as {
      tables: Record<string, { rows: number; checksum: string }>;
      objects: Array<{ key: string; size: number; sha256: string }>;
    };
    expect(manifest.tables.rounds.rows).toBeGreaterThan(0);
    expect(manifest.tables.migrations.rows).toBeGreaterThan(0);
    expect(manifest.objects).toContainEqual({
      key,
      size: bytes.length,
      sha256: createHash('sha256').update(bytes).digest('hex'),
      contentType: 'application/octet-stream',
    });

    // Replacing the instance's own database needs --yes; nothing happens without it.
    const refused = node('restore.mjs', ['--from', dir]);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toMatch(/replaces the tables of .* --yes/);

    const restored = node('restore.mjs', [
      '--from',
      dir,
      '--database',
      restoredDb,
      '--bucket',
      restoredBucket,
    ]);
    expect({ status: restored.status, failure: failure(restored.stderr) }).toEqual({
      status: 0,
      failure: null,
    });
    expect(restored.stdout).toMatch(/restored and checked/);

    // Checked again here: the same rows and checksums table by table, and the same object bytes.
    const ds = app.get(DataSource);
    for (const [table, expected] of Object.entries(manifest.tables)) {
      const [row] = await ds.query<Array<{ Checksum: string }>>(
        `CHECKSUM TABLE \`${restoredDb}\`.\`${table}\``,
      );
      const [count] = await ds.query<Array<{ n: string }>>(
        `SELECT COUNT(*) AS n FROM \`${restoredDb}\`.\`${table}\``,
      );
      expect({ table, rows: Number(count.n), checksum: String(row.Checksum) }).toEqual({
        table,
        ...expected,
      });
    }
    const [mine] = await ds.query<Array<{ n: string }>>(
      `SELECT COUNT(*) AS n FROM \`${restoredDb}\`.rounds WHERE project_id = ?`,
      [p.projectId],
    );
    expect(Number(mine.n)).toBe(1);
    const back = await s3.send(new GetObjectCommand({ Bucket: restoredBucket, Key: key }));
    expect(Buffer.from(await back.Body!.transformToByteArray()).equals(bytes)).toBe(true);
  });
});
