import 'reflect-metadata';
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { DeleteObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import sharp from 'sharp';
import { DataSource } from 'typeorm';
import { loadAppConfig } from '../config/app-config.js';
import { databaseOptions } from '../database/options.js';
import { Project } from '../modules/projects/project.entity.js';
import { benchHeading } from './bench-heading.js';

/**
 * Benchmark of issue 14's photos (run by `npm run bench`, `RB_BENCH=photos` alone; infra/bench.mjs starts
 * the test database, migrated and seeded, and the S3 fake first). The API runs as its own process
 * (dist/main.js, the jobs worker on, as `npm start` runs it), so that its resident memory is its own.
 *
 * Each of ROUNDS rounds, the same FILES JPEGs of about 8 MB (made before the first round):
 * 1. the reference: the same bytes put into the S3 fake directly with the SDK (one PutObject each, one
 *    after the other);
 * 2. through Roundbook the way the web app adds them (start, the parts one after the other, complete; one
 *    file after the other) and thumbnailed by the API's jobs worker: the time from the first start to the
 *    last photo's variants being made.
 * The ratio of the two is taken per round; the median is held against the target (≤ 2×), the spread says
 * how noisy the machine was. Memory: the API process's peak RSS (/proc/<pid>/status, sampled every 10 ms)
 * during the first round's batch less its RSS just before it (already signed in, nothing uploaded yet):
 * target < 100 MB. Later rounds' growth is printed too (glibc keeps freed memory, so they grow less).
 */
const FILES = 10;
const ROUNDS = Number(process.env.RB_PHOTOS_BENCH_ROUNDS ?? 3);
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

/** Resident memory of a process as the kernel counts it (Linux /proc). */
function rssOf(pid: number): number {
  const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
  if (!m) throw new Error(`no VmRSS for process ${pid}`);
  return Number(m[1]) * 1024;
}

/** Starts the built API (dist/main.js beside this file's folder) and resolves once it listens. */
function startApi(port: number): Promise<ChildProcess> {
  const child = spawn(process.execPath, [path.join(__dirname, '..', 'main.js')], {
    env: { ...process.env, PORT: String(port), WORKER_ENABLED: 'true' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  return new Promise((resolve, reject) => {
    let out = '';
    const timer = setTimeout(() => reject(new Error(`the API did not start:\n${out}`)), 60_000);
    const seen = (chunk: Buffer) => {
      out += chunk.toString();
      if (out.includes('Roundbook listening')) {
        clearTimeout(timer);
        child.stdout?.removeAllListeners('data');
        child.stdout?.resume();
        resolve(child);
      }
    };
    child.stdout?.on('data', seen);
    // Errors only (the SDK's Node-version notice is left out).
    child.stderr?.on('data', (c: Buffer) => {
      const text = c.toString();
      if (/error/i.test(text) && !/NodeVersionSupportWarning/.test(text)) process.stderr.write(text);
    });
    child.on('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the API stopped (exit ${code}):\n${out}`));
    });
  });
}

const median = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

async function main(): Promise<void> {
  const config = loadAppConfig();
  const ds = await new DataSource(databaseOptions(config)).initialize();
  const api = await startApi(config.port);
  const url = `http://127.0.0.1:${config.port}/api`;
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
      route: string,
      token: string | null,
      body?: unknown,
    ): Promise<T> => {
      const res = await fetch(`${url}${route}`, {
        method,
        headers: {
          'Content-Type': 'application/json',
          ...(token ? { Authorization: `Bearer ${token}` } : {}),
        },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      if (!res.ok) throw new Error(`${method} ${route}: ${res.status} ${await res.text()}`);
      return (res.status === 204 ? undefined : await res.json()) as T;
    };
    const { accessToken: token } = await call<{ accessToken: string }>('POST', '/auth/login', null, {
      email: 'geologist@roundbook.test',
      password: DEMO_PASSWORD,
    });
    const project = await ds.getRepository(Project).findOneByOrFail({ code: 'BRH' });
    const heading = await benchHeading(ds, project.id, 'PB', 'Invented photo benchmark heading');
    const p = `/projects/${project.id}`;

    const files: Buffer[] = [];
    for (let i = 0; i < FILES; i++) files.push(await noiseJpeg(i + 1));
    const bytes = files.reduce((t, f) => t + f.length, 0);
    console.log(
      `photos: ${FILES} JPEGs of 3300 × 2480 px, ${(bytes / MB).toFixed(1)} MB in all (${(bytes / FILES / MB).toFixed(1)} MB each); ${ROUNDS} round(s); API in its own process (PID ${api.pid})`,
    );

    const ratios: number[] = [];
    const growths: number[] = [];
    for (let r = 0; r < ROUNDS; r++) {
      const round = await call<{ id: string }>('POST', `${p}/headings/${heading.id}/rounds`, token, {
        stage: 'full-face',
        faceChainage: 1003 + 3 * r,
      });
      const photos = `${p}/rounds/${round.id}/photos`;

      // The reference: the same bytes put straight into the S3 fake.
      const keys = files.map((_f, i) => `bench/photos-${Date.now()}-${r}-${i}`);
      const t0 = performance.now();
      for (const [i, f] of files.entries())
        await s3.send(
          new PutObjectCommand({ Bucket: s.bucket, Key: keys[i], Body: f, ContentType: 'image/jpeg' }),
        );
      const direct = performance.now() - t0;
      for (const key of keys) await s3.send(new DeleteObjectCommand({ Bucket: s.bucket, Key: key }));

      // Through Roundbook, with the API's resident memory sampled meanwhile.
      const before = rssOf(api.pid!);
      let peak = before;
      const sampler = setInterval(() => (peak = Math.max(peak, rssOf(api.pid!))), 10);
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
        await new Promise((resolve) => setTimeout(resolve, 25));
      }
      const total = performance.now() - t1;
      clearInterval(sampler);
      peak = Math.max(peak, rssOf(api.pid!));

      const ratio = total / direct;
      const growth = (peak - before) / MB;
      ratios.push(ratio);
      growths.push(growth);
      console.log(
        `photos: round ${r + 1}: through Roundbook and thumbnailed ${total.toFixed(0)} ms, straight into the S3 fake ${direct.toFixed(0)} ms: ${ratio.toFixed(2)}×; uploads ${uploaded.toFixed(0)} ms (starts ${steps.start.toFixed(0)}, parts ${steps.parts.toFixed(0)}, completes ${steps.complete.toFixed(0)}), thumbnails after the last upload ${(total - uploaded).toFixed(0)} ms; API RSS ${(before / MB).toFixed(0)} → peak ${(peak / MB).toFixed(0)} MB (+${growth.toFixed(1)})`,
      );
    }
    const ratio = median(ratios);
    console.log(
      `photos: time ratio median ${ratio.toFixed(2)}× (rounds ${ratios.map((x) => x.toFixed(2)).join(', ')}; spread ${Math.min(...ratios).toFixed(2)}–${Math.max(...ratios).toFixed(2)}×), target ≤ ${RATIO_TARGET}×: ${ratio <= RATIO_TARGET ? 'met' : 'NOT MET'}`,
    );
    console.log(
      `photos: API resident memory grew ${growths[0].toFixed(1)} MB during the first batch (later batches ${
        growths
          .slice(1)
          .map((g) => `+${g.toFixed(1)}`)
          .join(', ') || 'none'
      } MB), target < ${RSS_TARGET_MB} MB: ${growths[0] < RSS_TARGET_MB ? 'met' : 'NOT MET'}`,
    );
  } finally {
    s3.destroy();
    api.kill('SIGTERM');
    await new Promise((resolve) => (api.exitCode === null ? api.once('exit', resolve) : resolve(null)));
    await ds.destroy();
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
