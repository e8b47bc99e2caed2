// Issue 15, "two API processes → one e-mail", and the PDF's pictures: two apps (each its own pool, mail
// transport and jobs worker, as jobs.e2e-spec.ts runs them) share one jobs table; one handover sent through
// A is rendered and e-mailed once, with one PDF, and that PDF holds the sketch's render, the stereonet and
// the photo thumbnails. On a project of this file's own, with its own SMTP server.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { INestApplication } from '@nestjs/common';
import type { RoundAssessment } from '@roundbook/domain';
import { simpleParser, type ParsedMail } from 'mailparser';
import sharp from 'sharp';
import { SMTPServer } from 'smtp-server';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { Job } from '../src/infrastructure/jobs/job.entity';
import { MailService } from '../src/infrastructure/mail/mail.service';
import { StorageService } from '../src/infrastructure/storage/storage.service';
import { HandoversService } from '../src/modules/handovers/handovers.service';
import { Photo } from '../src/modules/photos/photo.entity';
import { ProjectMember } from '../src/modules/projects/project-member.entity';
import { RoundRevision } from '../src/modules/rounds/round-revision.entity';
import { sketchRenderKey } from '../src/modules/rounds/sketch-render.service';
import { hashPassword } from '../src/modules/users/password';
import { User } from '../src/modules/users/user.entity';
import { makeProject, saveBody, TEST_PASSWORD, testJoint, type TestProject } from './factories';
import { createTestApp } from './test-app';

// pdf-parse 1.1.4 works in plain Jest on Node 20 (stack-notes §12); its index runs a self-test, so the lib.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const pdfParse = require('pdf-parse/lib/pdf-parse.js') as (data: Buffer) => Promise<{ text: string }>;

type Body = Record<string, any>;
const code = `HP${String(Date.now() % 1e6)}`;
const PHOTOS = 4;
const flat = (s: string) => s.replace(/\s+/g, ' ');
/** This file's handover e-mail (the round's submit notice to the engineers also names the project). */
const isHandover = (subject: string) => subject.startsWith('Handover TH,') && subject.endsWith(code);

/** Waits for a condition with a bounded loop of short pauses (no fixed sleeps). */
async function until<T>(probe: () => Promise<T> | T, ok: (v: T) => boolean, ms = 30_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await probe();
    if (ok(v)) return v;
    if (Date.now() > end) throw new Error(`condition not reached within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

/** An SMTP server of this file's own that keeps every message parsed (STARTTLS off, stack-notes §7). */
class OwnSmtp {
  readonly mails: ParsedMail[] = [];
  private server: SMTPServer | null = null;
  port = 0;

  async start(): Promise<void> {
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      closeTimeout: 200,
      onData: (stream, _session, callback) => {
        simpleParser(stream).then(
          (m) => {
            this.mails.push(m);
            callback();
          },
          (e: Error) => callback(e),
        );
      },
    });
    await new Promise<void>((resolve, reject) => {
      server.once('error', reject);
      server.listen(0, '127.0.0.1', () => resolve());
    });
    this.port = (server.server.address() as AddressInfo).port;
    this.server = server;
  }

  async stop(): Promise<void> {
    const s = this.server;
    this.server = null;
    if (s) await new Promise<void>((resolve) => s.close(() => resolve()));
  }
}

/** A photo-like JPEG (noise over a gradient, so it compresses like one), 640×480. */
async function photoJpeg(seed: number): Promise<Buffer> {
  const width = 640;
  const height = 480;
  const raw = Buffer.alloc(width * height * 3);
  let s = seed;
  for (let i = 0; i < raw.length; i++) {
    s = (s * 1103515245 + 12345) & 0x7fffffff;
    raw[i] = (((i / 3) % width) / 4 + (s >> 25)) & 0xff;
  }
  return sharp(raw, { raw: { width, height, channels: 3 } })
    .jpeg({ quality: 85 })
    .toBuffer();
}

/** `pdfimages -list` (poppler-utils): one row per image object drawn, with its page and size. */
function imagesOf(
  pdf: Buffer,
): Array<{ page: number; type: string; width: number; height: number; enc: string }> {
  const dir = mkdtempSync(path.join(tmpdir(), 'rb-pdfimages-'));
  try {
    const file = path.join(dir, 'handover.pdf');
    writeFileSync(file, pdf);
    const out = execFileSync('pdfimages', ['-list', file], { encoding: 'utf8' });
    return out
      .split('\n')
      .slice(2)
      .filter((l) => l.trim())
      .map((l) => {
        const c = l.trim().split(/\s+/);
        return { page: Number(c[0]), type: c[2], width: Number(c[3]), height: Number(c[4]), enc: c[8] };
      });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

describe('Handover delivery with two API processes, and the PDF’s pictures (e2e, real MariaDB, S3 fake, own SMTP)', () => {
  const smtp = new OwnSmtp();
  let a: INestApplication;
  let b: INestApplication;
  let http: App;
  let p: TestProject;
  let incomingId: string;
  let roundId: string;
  let sketchPng: Buffer;
  let sets: string[];
  /** Runs of each handler per process */
  const runs = { deliver: { a: 0, b: 0 }, mail: { a: 0, b: 0 } };

  const photosOf = (id: string) => `${p.base}/rounds/${id}/photos`;
  /** Start, send the parts (from the sizes the API gave), complete; then the caption. */
  async function upload(id: string, bytes: Buffer, caption: string): Promise<string> {
    const started = (
      await request(http)
        .post(photosOf(id))
        .set(p.as('geologist'))
        .send({ fileName: `${caption}.jpg`, contentType: 'image/jpeg', size: bytes.length })
        .expect(201)
    ).body as Body;
    const parts: Body[] = [];
    for (let n = 1; n <= (started.partCount as number); n++) {
      const chunk = bytes.subarray((n - 1) * started.partSize, n * started.partSize);
      parts.push(
        (
          await request(http)
            .put(`${photosOf(id)}/${started.photo.id}/parts/${n}`)
            .set(p.as('geologist'))
            .set('Content-Type', 'application/octet-stream')
            .send(chunk)
            .expect(200)
        ).body as Body,
      );
    }
    await request(http)
      .post(`${photosOf(id)}/${started.photo.id}/complete`)
      .set(p.as('geologist'))
      .send({ parts })
      .expect(200);
    await request(http)
      .patch(`${photosOf(id)}/${started.photo.id}`)
      .set(p.as('geologist'))
      .send({ caption })
      .expect(200);
    return started.photo.id as string;
  }

  beforeAll(async () => {
    await smtp.start();
    // Two apps, as two API processes would be: each its own pool, mail transport and worker.
    const config = (c: Parameters<Parameters<typeof createTestApp>[0] & object>[0]) => ({
      ...c,
      mail: { ...c.mail, driver: 'smtp' as const, host: '127.0.0.1', port: smtp.port },
      jobs: { ...c.jobs, workerEnabled: true, pollIntervalMs: 20, concurrency: 4 },
    });
    a = await createTestApp(config);
    b = await createTestApp(config);
    for (const [name, app] of [
      ['a', a],
      ['b', b],
    ] as const) {
      const handovers = app.get(HandoversService);
      const deliver = handovers.deliver.bind(handovers);
      handovers.deliver = (id) => {
        runs.deliver[name]++;
        return deliver(id);
      };
      const mail = app.get(MailService);
      const send = mail.send.bind(mail);
      mail.send = (m) => {
        if (isHandover(m.subject)) runs.mail[name]++;
        return send(m);
      };
    }
    http = a.getHttpServer() as App;
    p = await makeProject(a, { code });
    const ds = a.get(DataSource);
    const user = await ds.getRepository(User).save({
      email: `incoming.${code.toLowerCase()}@roundbook.test`,
      name: `Invented incoming ${code}`,
      passwordHash: await hashPassword(TEST_PASSWORD),
    });
    await ds
      .getRepository(ProjectMember)
      .save({ projectId: p.projectId, userId: user.id, role: 'supervisor' });
    incomingId = user.id;

    // One round handed in with a sketch, two groups of joints and PHOTOS photos; the workers render the
    // sketch and make the thumbnails.
    const opened = (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage: 1003 })
        .expect(201)
    ).body as Body;
    roundId = opened.id as string;
    const c1 = p.classes.find((c) => c.code === 'C1')!;
    const saved = (
      await request(http)
        .put(`${p.base}/rounds/${roundId}`)
        .set(p.as('geologist'))
        .send(
          saveBody(opened, {
            recommendedClassId: c1.id,
            nextRoundLength: 3,
            joints: ['120/60', '124/62', '117/58', '122/64', '230/35', '226/38', '233/33', '229/36'].map(
              (o) => testJoint(o),
            ),
            sketch: {
              schemaVersion: 2,
              frame: 'face-m',
              elements: [
                {
                  id: 't1',
                  kind: 'trace',
                  mode: 'polyline',
                  points: [
                    [-2.5, 1.2],
                    [0.4, 3.1],
                    [2.2, 4.8],
                  ],
                  link: null,
                },
                { id: 'l1', kind: 'label', at: [-1, 2], text: 'Invented: blocky gneiss' },
              ],
            },
          }),
        )
        .expect(200)
    ).body as Body;
    for (let i = 0; i < PHOTOS; i++) await upload(roundId, await photoJpeg(i + 3), `Invented photo ${i + 1}`);
    await request(http)
      .post(`${p.base}/rounds/${roundId}/submit`)
      .set(p.as('geologist'))
      .send({ version: saved.version })
      .expect(200);
    const photos = await until(
      () => ds.getRepository(Photo).find({ where: { roundId } }),
      (ph) => ph.length === PHOTOS && ph.every((x) => x.thumbnailKey !== null),
    );
    expect(photos).toHaveLength(PHOTOS);
    const revision = await ds.getRepository(RoundRevision).findOneByOrFail({ roundId, event: 'submit' });
    sets = ((revision.assessment as RoundAssessment | null)?.sets?.sets ?? []).map((s) => s.label);
    const storage = a.get(StorageService);
    const key = sketchRenderKey(p.projectId, roundId, revision.revision, 'png');
    await until(
      () =>
        storage.stat(key).then(
          () => true,
          () => false,
        ),
      (ok) => ok,
    );
    const stored = await storage.get(key);
    const chunks: Buffer[] = [];
    for await (const c of stored.body) chunks.push(Buffer.from(c as Uint8Array));
    sketchPng = Buffer.concat(chunks);
  });

  afterAll(async () => {
    await Promise.all([a?.close(), b?.close()]);
    await smtp.stop();
  });

  let pdf: Buffer;

  it('sends one handover through A while both workers poll: exactly one e-mail, with one PDF, each job run once', async () => {
    const ds = a.get(DataSource);
    const tStart = Date.now();
    const sent = (
      await request(http)
        .post(`${p.base}/handovers`)
        .set(p.as('supervisor'))
        .send({
          shiftDate: '2026-12-03',
          shift: 'day',
          incomingUserId: incomingId,
          headings: [{ headingId: p.headingId, cycleStage: 'support' }],
        })
        .expect(201)
    ).body as Body;
    const t0 = Date.now();
    const mine = () => smtp.mails.filter((m) => isHandover(m.subject ?? ''));
    await until(mine, (m) => m.length > 0, 60_000).catch(async (e: Error) => {
      // Say where it stands: the deliver job's state and last error, and the mail job's.
      const rows = await ds.query<Body[]>(
        "SELECT kind, state, attempts, last_error FROM jobs WHERE dedupe_key = ? OR (kind = 'mail.send' AND created_at >= ?)",
        [`handover:${sent.id}`, new Date(Date.parse(sent.sentAt as string) - 1000)],
      );
      throw new Error(`${e.message}; jobs: ${JSON.stringify(rows)}`);
    });
    const tMail = Date.now() - t0;
    const noticeId = (
      await until(
        () =>
          ds.query<Array<{ notice_id: string | null }>>('SELECT notice_id FROM handovers WHERE id = ?', [
            sent.id,
          ]),
        (r) => r[0]?.notice_id != null,
      )
    )[0].notice_id as string;
    const jobs = await until(
      () =>
        ds
          .getRepository(Job)
          .find({ where: [{ dedupeKey: `handover:${sent.id}` }, { dedupeKey: `notice:${noticeId}` }] }),
      (js) => js.length === 2 && js.every((j) => j.state === 'done'),
    ).catch(async (e: Error) => {
      const rows = await ds.query<Body[]>(
        'SELECT kind, state, attempts, locked_by, last_error, dedupe_key FROM jobs WHERE dedupe_key IN (?, ?)',
        [`handover:${sent.id}`, `notice:${noticeId}`],
      );
      throw new Error(`${e.message}; notice ${noticeId}; jobs: ${JSON.stringify(rows)}`);
    });
    // Both jobs done at their first attempt, each handler run once across the two processes.
    expect(jobs.map((j) => j.attempts)).toEqual([1, 1]);
    expect(runs.deliver.a + runs.deliver.b).toBe(1);
    expect(runs.mail.a + runs.mail.b).toBe(1);
    expect(mine()).toHaveLength(1);
    const [mail] = mine();
    expect(mail.attachments.map((x) => x.contentType)).toEqual(['application/pdf']);
    pdf = mail.attachments[0].content;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    // The stored copy listed with the handover is the attached one.
    const got = (await request(http).get(`${p.base}/handovers/${sent.id}`).set(p.as('viewer')).expect(200))
      .body as Body;
    expect(got).toMatchObject({ pdfReady: true, emailStatus: 'sent' });
    console.log(
      `handover delivery e2e: composed in ${t0 - tStart} ms; mail after ${tMail} ms; deliver ran in A ${runs.deliver.a}×, B ${runs.deliver.b}×; the e-mail was sent by A ${runs.mail.a}×, B ${runs.mail.b}×`,
    );
  }, 90_000);

  it('the PDF holds the sketch’s render, the stereonet with its legend and every photo thumbnail, none split across pages', async () => {
    expect(pdf).toBeDefined();
    const images = imagesOf(pdf);
    const sketchMeta = await sharp(sketchPng).metadata();
    // The sketch: one Flate image of the render's size (flattened onto white, so no soft mask).
    const sketches = images.filter((i) => i.enc !== 'jpeg');
    expect(sketches).toEqual([
      expect.objectContaining({ type: 'image', width: sketchMeta.width, height: sketchMeta.height }),
    ]);
    // The thumbnails: one JPEG each, as the photo job made them (320 px on the long side).
    const thumbs = images.filter((i) => i.enc === 'jpeg');
    expect(thumbs).toHaveLength(PHOTOS);
    expect(thumbs.every((t) => t.type === 'image' && t.width === 320 && t.height === 240)).toBe(true);
    expect(images.some((i) => i.type === 'smask')).toBe(false);

    const text = flat((await pdfParse(pdf)).text);
    expect(text).toContain('Sketch of round 1');
    for (let i = 1; i <= PHOTOS; i++) expect(text).toContain(`Round 1: Invented photo ${i}`);
    // The stereonet (vectors): its title, one legend line per set of the frozen assessment, the drive.
    expect(text).toContain('Poles of joints, rounds 1 — lower hemisphere, equal-area');
    // Eight joints are too few for sets here: then every pole is 'not in a set', and the legend says so.
    if (sets.length === 0) expect(text).toContain('Not in a set of the latest round');
    for (const s of sets)
      expect(text).toMatch(new RegExp(`${s}: mean \\d{3}/\\d{2} \\(dip direction/dip\\), \\d+ joints`));
    expect(text).toContain('Drive 060° at the face');
    // The thumbnails are drawn after the sketch (never on an earlier page).
    expect(Math.min(...thumbs.map((t) => t.page))).toBeGreaterThanOrEqual(sketches[0].page);
  });
});
