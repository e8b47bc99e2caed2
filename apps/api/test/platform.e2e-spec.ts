import { createHash, randomBytes } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import { Readable } from 'node:stream';
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { APP_CONFIG, type AppConfig } from '../src/config/app-config';
import { MailService } from '../src/infrastructure/mail/mail.service';
import { StorageService } from '../src/infrastructure/storage/storage.service';
import { User } from '../src/modules/users/user.entity';
import { makeProject, signIn, TEST_PASSWORD } from './factories';
import { createTestApp } from './test-app';

const sha256 = (b: Buffer): string => createHash('sha256').update(b).digest('hex');

async function readAll(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const c of stream) chunks.push(Buffer.from(c as Buffer));
  return Buffer.concat(chunks);
}

describe('health, storage, mail and docs (e2e against MariaDB, the S3 fake and the SMTP fake)', () => {
  let app: INestApplication;
  let http: App;
  let token: (role: string) => Promise<string>;
  let adminEmail: string;

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    // A project of this file's own; its admin also runs the instance (the operator), as the demo's does.
    const own = await makeProject(app, { code: `PL${String(Date.now() % 1e6)}` });
    await app
      .get(DataSource)
      .getRepository(User)
      .update({ email: own.emailOf('admin') }, { isOperator: true });
    adminEmail = own.emailOf('admin');
    const tokens = await signIn(http, ['admin', 'geologist', 'viewer'], own.emailOf, TEST_PASSWORD);
    token = (role) => Promise.resolve(tokens[role as 'admin' | 'geologist' | 'viewer']);
  });

  afterAll(async () => {
    await app.close();
  });

  it('GET /api/health reports the database, object storage and mail transport, without a token', async () => {
    const res = await request(http).get('/api/health').expect(200);
    expect(res.body).toEqual({
      status: 'ok',
      checkedAt: expect.any(String),
      database: { ok: true, detail: 'answering' },
      storage: { ok: true, detail: 'answering' },
      mail: { ok: true, detail: 'answering' },
    });
  });

  it('reports degraded with 503 and names the failing part when the mail server is down', async () => {
    const broken = await createTestApp((c) => ({ ...c, mail: { ...c.mail, port: 1 } }));
    try {
      const res = await request(broken.getHttpServer() as App)
        .get('/api/health')
        .expect(503);
      expect(res.body).toMatchObject({
        status: 'degraded',
        database: { ok: true },
        storage: { ok: true },
        mail: { ok: false },
      });
      // The reason goes to the server log, not to anonymous callers (issue 18, item 7).
      expect(res.body.mail.detail).toMatch(/not answering/);
      expect(res.headers['retry-after']).toBe('10');
    } finally {
      await broken.close();
    }
  });

  it('stores a 6 MB stream in S3 and reads back the same bytes (checksum settings for the S3 fake)', async () => {
    const storage = app.get(StorageService);
    const data = randomBytes(6 * 1024 * 1024);
    const key = `test/${Date.now()}.bin`;
    await storage.put(
      key,
      Readable.from([data.subarray(0, 1e6), data.subarray(1e6)]),
      'application/octet-stream',
    );
    const back = await storage.get(key);
    expect(sha256(await readAll(back.body))).toBe(sha256(data));
    await storage.delete(key);
    await expect(storage.get(key)).rejects.toThrow();
  });

  it('sends an e-mail with an attachment that the SMTP fake receives, and shows it in the local mail view to admins only', async () => {
    const mail = app.get(MailService);
    const config = app.get<AppConfig>(APP_CONFIG);
    const attachment = randomBytes(50_000);
    const subject = `Roundbook test message ${Date.now()} – Übergabe ✓`;
    await mail.send({
      to: ['incoming-shift@roundbook.test'],
      subject,
      text: 'Plain text body',
      html: '<p>HTML body</p>',
      attachments: [{ filename: 'sample.bin', content: attachment, contentType: 'application/octet-stream' }],
    });
    const dir = config.mail.localInboxDir!;
    expect(existsSync(dir)).toBe(true);
    expect(readdirSync(dir).some((f) => f.endsWith('.eml'))).toBe(true);

    const admin = await token('admin');
    const list = await request(http)
      .get('/api/local/mail')
      .set('Authorization', `Bearer ${admin}`)
      .expect(200);
    const message = (
      list.body as Array<{
        id: string;
        subject: string;
        to: string[];
        text: string;
        html: string;
        attachments: Array<{ index: number; size: number; filename: string }>;
      }>
    ).find((m) => m.subject === subject);
    expect(message).toBeDefined();
    expect(message!.to).toEqual(['incoming-shift@roundbook.test']);
    expect(message!.text.trim()).toBe('Plain text body');
    expect(message!.html).toContain('<p>HTML body</p>');
    expect(message!.attachments).toEqual([
      { index: 0, filename: 'sample.bin', contentType: 'application/octet-stream', size: 50_000 },
    ]);
    const file = await request(http)
      .get(`/api/local/mail/${message!.id}/attachments/0`)
      .set('Authorization', `Bearer ${admin}`)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(sha256(file.body as Buffer)).toBe(sha256(attachment));

    await request(http)
      .get('/api/local/mail')
      .set('Authorization', `Bearer ${await token('geologist')}`)
      .expect(403);
    await request(http).get('/api/local/mail').expect(401);
    await request(http)
      .get('/api/local/mail/..%2F..%2Fetc/attachments/0')
      .set('Authorization', `Bearer ${admin}`)
      .expect(404);
  });

  it('hides the local mail view outside local mode', async () => {
    const prod = await createTestApp((c) => ({ ...c, localMode: false }));
    try {
      const h = prod.getHttpServer() as App;
      const t = (
        (await request(h).post('/api/auth/login').send({ email: adminEmail, password: TEST_PASSWORD }))
          .body as { accessToken: string }
      ).accessToken;
      await request(h).get('/api/local/mail').set('Authorization', `Bearer ${t}`).expect(404);
      expect((await request(h).get('/api/config').expect(200)).body).toEqual({
        localMode: false,
        version: expect.any(String),
      });
    } finally {
      await prod.close();
    }
  });

  it('serves the OpenAPI document and its UI', async () => {
    const doc = await request(http).get('/api/docs/openapi.json').expect(200);
    expect(doc.body.openapi).toMatch(/^3\./);
    expect(Object.keys(doc.body.paths as object)).toEqual(
      expect.arrayContaining(['/api/auth/login', '/api/projects', '/api/health']),
    );
    const ui = await request(http).get('/api/docs').expect(200);
    expect(ui.text).toContain('swagger');
  });

  // Deep links of the web app (served by the API process) are checked by the browser tests.
  it('answers an unknown API route with the error body', async () => {
    const res = await request(http)
      .get('/api/no-such-thing')
      .set('Authorization', `Bearer ${await token('viewer')}`)
      .expect(404);
    expect(res.body.code).toBe('NOT_FOUND');
  });

  it('refuses a body over the size limit with 413 and the error body', async () => {
    const res = await request(http)
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a@b.c', password: 'x'.repeat(3 * 1024 * 1024) }));
    expect([413]).toContain(res.status);
    expect(res.body.code).toBe('PAYLOAD_TOO_LARGE');
  });
});
