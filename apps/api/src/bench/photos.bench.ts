import 'reflect-metadata';
import { readFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { performance } from 'node:perf_hooks';
import { DeleteObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import sharp from 'sharp';
import { DataSource } from 'typeorm';
import { AppModule } from '../app.module.js';
import { loadAppConfig } from '../config/app-config.js';
import { Project } from '../modules/projects/project.entity.js';
import { setupApp } from '../setup-app.js';
import { benchHeading } from './bench-heading.js';

/**
 * Benchmark of issue 14's photos (run by `npm run bench`, `RB_BENCH=photos` alone; infra/bench.mjs starts
 * the test database, migrated and seeded, and the S3 fake first). Two figures, each printed with its target:
 *
 * 1. FILES JPEGs of about 8 MB added through Roundbook the way the web app adds them (start, the parts of the
 *    API's part size one after the other, complete) and thumbnailed by the app's own jobs worker: the time
 *    from the first start to the last photo's variants being made, against putting the same bytes into the
 *    S3 fake directly with the SDK (one PutObject each, one after the other) in the same run. Target ≤ 2×.
 * 2. The growth of resident memory during the batch: the process's peak RSS (sampled every 20 ms) less its
 *    RSS just before, with the files already made. The API runs in this process, so the figure also holds
 *    the client's share (fetch's buffers): an upper bound of the API's own growth. Target < 100 MB.
 */
const FILES = 10;
const RATIO_TARGET = 2;
const RSS_TARGET_MB = 100;
const DEMO_PASSWORD = process.env.DEMO_PASSWORD ?? 'rb-demo-2026';
const MB = 1024 * 1024;

/** A noise JPEG of about 8 MB (noise keeps the encoder from shrinking it), different bytes per seed. */
async function noiseJpeg(seed: number): Promise<Buffer> {
  const [width, height] = [3300, 2480];
  const raw = Buffer.alloc(width * height * 3);
  let s = seed * 7919 + 1;
  for (let i = 0; i < raw.length; i++) {
    s = (s * 1103515245 + 12345) & 0x7fffffff;
    raw[i] = s >> 23;
  }
  return sharp(raw, { raw: { width, height, channels: 3 } })
    .jpeg({ quality: 96 })
    .toBuffer();
}

/** Resident memory from /proc (what the kernel counts), or Node's figure where /proc is missing. */
function rss(): number {
  try {
    const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync('/proc/self/status', 'utf8'));
    if (m) return Number(m[1]) * 1024;
  } catch {
    // not Linux
  }
  return process.memoryUsage().rss;
}

async function main(): Promise<void> {
  const base = loadAppConfig();
  const config = { ...base, jobs: { ...base.jobs, workerEnabled: true } };
  const app = await NestFactory.create<NestExpressApplication>(AppModule.forRoot(config), {
    logger: ['error'],
  });
  setupApp(app);
  await app.listen(0, '127.0.0.1');
  const url = `http://127.0.0.1:${(app.getHttpServer().address() as AddressInfo).port}/api`;
  const s = config.storage;
  const s3 = new S3Client({
    region: s.region,
    endpoint: s.endpoint,
    forcePathStyle: s.forcePathStyle,
    credentials: { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  try {
    const call = async <T>(
      method: string,
      path: string,
      token: string | null,
      body?: unknown,
    ): Promise<T> => {
      const res = await fetch(`${url}${path}`, {
        method,
        headers: {
          'Content-Type': 'application/json',
          ...(token ? { Authorization: `Bearer ${token}` } : {}),
        },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
      return (res.status === 204 ? undefined : await res.json()) as T;
    };
    const { accessToken: token } = await call<{ accessToken: string }>('POST', '/auth/login', null, {
      email: 'geologist@roundbook.test',
      password: DEMO_PASSWORD,
    });
    const ds = app.get(DataSource);
    const project = await ds.getRepository(Project).findOneByOrFail({ code: 'BRH' });
    const heading = await benchHeading(ds, project.id, 'PB', 'Invented photo benchmark heading');
    const p = `/projects/${project.id}`;
    const round = await call<{ id: string }>('POST', `${p}/headings/${heading.id}/rounds`, token, {
      stage: 'full-face',
      faceChainage: 1003,
    });
    const photos = `${p}/rounds/${round.id}/photos`;

    const files: Buffer[] = [];
    for (let i = 0; i < FILES; i++) files.push(await noiseJpeg(i + 1));
    const bytes = files.reduce((t, f) => t + f.length, 0);

    // The reference: the same bytes put straight into the S3 fake.
    const keys = files.map((_f, i) => `bench/photos-${Date.now()}-${i}`);
    const t0 = performance.now();
    for (const [i, f] of files.entries())
      await s3.send(
        new PutObjectCommand({ Bucket: s.bucket, Key: keys[i], Body: f, ContentType: 'image/jpeg' }),
      );
    const direct = performance.now() - t0;
    for (const key of keys) await s3.send(new DeleteObjectCommand({ Bucket: s.bucket, Key: key }));

    // Through Roundbook, with the resident memory sampled meanwhile.
    if (global.gc) global.gc();
    const before = rss();
    let peak = before;
    const sampler = setInterval(() => (peak = Math.max(peak, rss())), 20);
    const t1 = performance.now();
    const ids: string[] = [];
    const steps = { start: 0, parts: 0, complete: 0 };
    for (const [i, f] of files.entries()) {
      let at = performance.now();
      const lap = (step: keyof typeof steps) => {
        const now = performance.now();
        steps[step] += now - at;
        at = now;
      };
      const started = await call<{ photo: { id: string }; partSize: number; partCount: number }>(
        'POST',
        photos,
        token,
        { fileName: `bench-${i + 1}.jpg`, contentType: 'image/jpeg', size: f.length },
      );
      lap('start');
      const parts: unknown[] = [];
      for (let n = 1; n <= started.partCount; n++) {
        const chunk = f.subarray((n - 1) * started.partSize, n * started.partSize);
        const res = await fetch(`${url}${photos}/${started.photo.id}/parts/${n}`, {
          method: 'PUT',
          headers: { 'Content-Type': 'application/octet-stream', Authorization: `Bearer ${token}` },
          body: chunk,
        });
        if (!res.ok) throw new Error(`part ${n}: ${res.status} ${await res.text()}`);
        parts.push(await res.json());
      }
      lap('parts');
      await call('POST', `${photos}/${started.photo.id}/complete`, token, { parts });
      lap('complete');
      ids.push(started.photo.id);
    }
    const uploaded = performance.now() - t1;
    // Until the worker has made every photo's thumbnail and display size.
    for (;;) {
      const listed = await call<Array<{ id: string; variantState: string }>>('GET', photos, token);
      const states = ids.map((id) => listed.find((x) => x.id === id)?.variantState);
      if (states.some((st) => st === 'failed')) throw new Error('a thumbnail could not be made');
      if (states.every((st) => st === 'ready')) break;
      await new Promise((r) => setTimeout(r, 25));
    }
    const total = performance.now() - t1;
    clearInterval(sampler);
    peak = Math.max(peak, rss());

    const ratio = total / direct;
    const growth = (peak - before) / MB;
    console.log(
      `photos: ${FILES} JPEGs, ${(bytes / MB).toFixed(1)} MB in all (${(bytes / FILES / MB).toFixed(1)} MB each)`,
    );
    console.log(
      `photos: through Roundbook and thumbnailed ${total.toFixed(0)} ms (uploads ${uploaded.toFixed(0)} ms), straight into the S3 fake ${direct.toFixed(0)} ms: ${ratio.toFixed(2)}× (target ≤ ${RATIO_TARGET}×) ${ratio <= RATIO_TARGET ? 'ok' : 'OVER'}`,
    );
    console.log(
      `photos: of the uploads, starts ${steps.start.toFixed(0)} ms, parts ${steps.parts.toFixed(0)} ms, completes ${steps.complete.toFixed(0)} ms; thumbnails after the last upload ${(total - uploaded).toFixed(0)} ms`,
    );
    console.log(
      `photos: resident memory grew ${growth.toFixed(1)} MB during the batch (API and client in one process; target < ${RSS_TARGET_MB} MB) ${growth < RSS_TARGET_MB ? 'ok' : 'OVER'}`,
    );
  } finally {
    s3.destroy();
    await app.close();
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
