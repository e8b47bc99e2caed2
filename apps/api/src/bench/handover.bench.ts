import 'reflect-metadata';
import { randomUUID } from 'node:crypto';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { NestFactory } from '@nestjs/core';
import PDFDocument from 'pdfkit';
import { DataSource } from 'typeorm';
import { AppModule } from '../app.module.js';
import { loadAppConfig } from '../config/app-config.js';
import type { Job } from '../infrastructure/jobs/job.entity.js';
import { JobsService } from '../infrastructure/jobs/jobs.service.js';
import { Notice } from '../infrastructure/mail/notice.entity.js';
import { MAIL_JOB } from '../infrastructure/mail/notices.service.js';
import { StorageService } from '../infrastructure/storage/storage.service.js';
import type { LoadedPictures } from '../modules/handovers/handover-pdf-images.js';
import { renderHandoverPdf } from '../modules/handovers/handover-pdf.js';
import { Handover } from '../modules/handovers/handover.entity.js';
import { HANDOVER_DELIVER_JOB } from '../modules/handovers/handovers.service.js';
import { Project } from '../modules/projects/project.entity.js';
import { User } from '../modules/users/user.entity.js';
import { benchHandover, type BenchHandover } from './handover-fixture.js';

/**
 * Benchmark of issue 15's handover (run by `npm run bench`; infra/bench.mjs starts the test database, the
 * S3 fake and the SMTP fake first). Two figures, each printed with its target:
 *
 * 1. The PDF of a handover for two headings, each with a sketch, a stereonet and six photo thumbnails
 *    (handover-fixture.ts), against pdfkit placing the same image bytes at the same sizes on blank pages,
 *    measured in the same run (median of RUNS each, interleaved). Target: under 3×.
 * 2. The send: from the moment a worker claims the handover's job (its lease time) to the message being in
 *    the SMTP fake (the fake's own receipt time), through the PDF, storage, the notice and its mail job.
 *    SENDS handovers one after another. Target: median under 1 s.
 */
const RUNS = 15;
const SENDS = 20;
const PDF_TARGET = 3;
const SEND_TARGET_MS = 1000;

const median = (xs: number[]): number => quantile(xs, 0.5);
function quantile(xs: number[], q: number): number {
  const s = [...xs].sort((a, b) => a - b);
  const i = (s.length - 1) * q;
  const lo = Math.floor(i);
  return s[lo] + (s[Math.ceil(i)] - s[lo]) * (i - lo);
}

/** The reference: the same pictures at the sizes the handover draws them, one blank A4 page per heading. */
function imagesOnBlankPages(pictures: LoadedPictures[]): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margins: { top: 50, bottom: 70, left: 50, right: 50 } });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const left = 50;
  const width = doc.page.width - 100;
  const half = (width - 16) / 2;
  const w = (width - 20) / 3;
  const h = w * 0.72;
  pictures.forEach((p, i) => {
    if (i > 0) doc.addPage();
    if (p.sketch)
      doc.image(p.sketch, left + 2, 52, { fit: [half - 4, 216], align: 'center', valign: 'center' });
    p.photos.forEach((bytes, k) => {
      if (bytes)
        doc.image(bytes, left + (k % 3) * (w + 10), 300 + Math.floor(k / 3) * (h + 40), {
          fit: [w, h],
          align: 'center',
          valign: 'center',
        });
    });
  });
  doc.end();
  return done;
}

async function pdfBench(fixture: BenchHandover): Promise<void> {
  const ours = () =>
    renderHandoverPdf({
      snapshot: fixture.snapshot,
      pictures: fixture.pictures,
      shiftDate: '2026-12-03',
      shift: 'day',
      sentAt: new Date('2026-12-03T05:45:00Z'),
    });
  const reference = () => imagesOnBlankPages(fixture.pictures);
  const a: number[] = [];
  const b: number[] = [];
  let sizes = [0, 0];
  for (let i = -2; i < RUNS; i++) {
    let t = performance.now();
    const x = await ours();
    const ta = performance.now() - t;
    t = performance.now();
    const y = await reference();
    const tb = performance.now() - t;
    sizes = [x.length, y.length];
    if (i >= 0) {
      a.push(ta);
      b.push(tb);
    }
  }
  const ratio = median(a) / median(b);
  const photos = fixture.pictures.reduce((n, p) => n + p.photos.length, 0);
  console.log(
    `handover PDF: 2 headings, each a sketch (PNG), a stereonet (vectors) and 6 photo thumbnails (JPEG); ${photos} photos in all`,
  );
  console.log(
    `  handover PDF ${median(a).toFixed(1)} ms (${(sizes[0] / 1024).toFixed(0)} KiB)   same images on blank pages ${median(b).toFixed(1)} ms (${(sizes[1] / 1024).toFixed(0)} KiB)   ratio ${ratio.toFixed(2)}×   target < ${PDF_TARGET}×: ${ratio < PDF_TARGET ? 'met' : 'NOT MET'}   (median of ${RUNS} each)`,
  );
}

/** The SMTP fake's summaries (infra/fakes/smtp-fake.mjs) not read yet: Message-ID → its receipt time. */
function inbox(dir: string): () => Map<string, number> {
  const seen = new Set<string>();
  const got = new Map<string, number>();
  return () => {
    if (!existsSync(dir)) return got;
    for (const f of readdirSync(dir)) {
      if (!f.endsWith('.json') || seen.has(f)) continue;
      seen.add(f);
      const m = JSON.parse(readFileSync(path.join(dir, f), 'utf8')) as {
        messageId: string | null;
        receivedAt: string;
      };
      if (m.messageId) got.set(m.messageId, Date.parse(m.receivedAt));
    }
    return got;
  };
}

async function sendBench(fixture: BenchHandover): Promise<void> {
  const config = loadAppConfig();
  if (config.mail.driver !== 'smtp' || !config.mail.localInboxDir)
    throw new Error('The send benchmark needs the SMTP fake (MAIL_DRIVER=smtp, LOCAL_MAIL_DIR)');
  const app = await NestFactory.createApplicationContext(
    AppModule.forRoot({ ...config, jobs: { ...config.jobs, workerEnabled: true } }),
    { logger: ['error'] },
  );
  try {
    const ds = app.get(DataSource);
    const storage = app.get(StorageService);
    for (const [i, k] of fixture.keys.entries()) {
      await storage.put(k.sketch, fixture.pictures[i].sketch!, 'image/png');
      for (const [j, key] of k.photos.entries())
        await storage.put(key, fixture.pictures[i].photos[j]!, 'image/jpeg');
    }
    // The time each job was claimed (its lease start), seen as the worker's claim returns.
    const jobs = app.get(JobsService);
    const claim = jobs.claim.bind(jobs);
    const claimedAt = new Map<string, number>();
    jobs.claim = async (...args: Parameters<JobsService['claim']>): Promise<Job[]> => {
      const out = await claim(...args);
      for (const j of out) {
        const key = j.kind === HANDOVER_DELIVER_JOB ? j.payload.handoverId : j.payload.noticeId;
        claimedAt.set(String(key), (j.lockedAt ?? args[2]).getTime());
      }
      return out;
    };
    const project = await ds.getRepository(Project).findOneByOrFail({ code: 'BRH' });
    const outgoing = await ds.getRepository(User).findOneByOrFail({ email: 'supervisor@roundbook.test' });
    const incoming = await ds
      .getRepository(User)
      .findOneByOrFail({ email: 'night-supervisor@roundbook.test' });
    const snapshot = {
      ...fixture.snapshot,
      outgoing: { userId: outgoing.id, name: outgoing.name, email: outgoing.email },
      incoming: { userId: incoming.id, name: incoming.name, email: incoming.email },
    };
    const read = inbox(config.mail.localInboxDir);
    read();
    const total: number[] = [];
    const mailPart: number[] = [];
    const made: string[] = [];
    for (let i = -1; i < SENDS; i++) {
      const id = randomUUID();
      made.push(id);
      const sentAt = new Date();
      // What compose writes (the frozen snapshot and the deliver job), in one transaction.
      await ds.transaction(async (m) => {
        await m.save(
          m.create(Handover, {
            id,
            projectId: project.id,
            outgoingId: outgoing.id,
            incomingId: incoming.id,
            shiftDate: '2026-12-03',
            shift: 'day',
            status: 'sent',
            snapshot,
            recipients: [incoming.email],
            noticeId: null,
            pdfKey: null,
            sentAt,
            ackDueAt: new Date(sentAt.getTime() + 3_600_000),
            overdueNoticeId: null,
            acknowledgedAt: null,
            acknowledgedBy: null,
            acknowledgeComment: null,
          }),
        );
        await jobs.enqueue(m, {
          kind: HANDOVER_DELIVER_JOB,
          payload: { handoverId: id },
          dedupeKey: `bench-handover:${id}`,
        });
      });
      const deadline = Date.now() + 30_000;
      let notice: Notice | null = null;
      let received: number | undefined;
      while (received === undefined) {
        if (Date.now() > deadline) throw new Error(`handover ${id} did not reach the SMTP fake in 30 s`);
        await new Promise((r) => setTimeout(r, 10));
        if (!notice) {
          const h = await ds.getRepository(Handover).findOneByOrFail({ id });
          if (h.noticeId) notice = await ds.getRepository(Notice).findOneByOrFail({ id: h.noticeId });
        }
        if (notice) received = read().get(notice.messageId);
      }
      if (i < 0) continue; // the first send warms the pools and the fonts
      total.push(received - claimedAt.get(id)!);
      mailPart.push(received - claimedAt.get(notice!.id)!);
    }
    const med = median(total);
    console.log(
      `handover send (${SENDS} one after another): worker claims the handover job → PDF, storage, notice → ${MAIL_JOB} job → received by the SMTP fake`,
    );
    console.log(
      `  median ${med.toFixed(0)} ms   p90 ${quantile(total, 0.9).toFixed(0)} ms   max ${Math.max(...total).toFixed(0)} ms   target median < ${SEND_TARGET_MS} ms: ${med < SEND_TARGET_MS ? 'met' : 'NOT MET'}   (of which the e-mail job, claim → received: median ${median(mailPart).toFixed(0)} ms)`,
    );
    await ds.getRepository(Handover).delete(made);
  } finally {
    await app.close();
  }
}

async function main(): Promise<void> {
  const fixture = await benchHandover();
  await pdfBench(fixture);
  await sendBench(fixture);
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
