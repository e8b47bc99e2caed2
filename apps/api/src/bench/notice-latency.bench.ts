import 'reflect-metadata';
import type { AddressInfo } from 'node:net';
import { performance } from 'node:perf_hooks';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { SMTPServer } from 'smtp-server';
import { DataSource } from 'typeorm';
import { AppModule } from '../app.module.js';
import { loadAppConfig } from '../config/app-config.js';
import { MailService } from '../infrastructure/mail/mail.service.js';
import { Project } from '../modules/projects/project.entity.js';
import { setupApp } from '../setup-app.js';
import { benchHeading } from './bench-heading.js';

/**
 * Benchmark (issue 11 "Done when"): the time from a round's submit (the request sent) to its "To confirm"
 * notice being in an SMTP server, median of 20, through the real path — the submit's transaction queues the
 * notice and its job, a jobs worker (the app's own, default poll interval) claims it and nodemailer sends it.
 * The reference, measured in the same run, is one e-mail sent straight through the same mail transport.
 * Run by `npm run bench` (infra/bench.mjs starts the test database, migrated and seeded, first).
 */
const RUNS = 20;

/** The fields of a round the benchmark reads back from the API. */
interface RoundShape {
  id: string;
  version: number;
  roundNumber: number;
  faceChainage: number;
  previousChainage: number | null;
  roundLength: number | null;
  shiftDate: string;
  shift: string;
}
const DEMO_PASSWORD = process.env.DEMO_PASSWORD ?? 'rb-demo-2026';

const median = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

async function main(): Promise<void> {
  // The SMTP server: resolves the waiter of the subject it was told to watch.
  const waiting = new Map<string, (at: number) => void>();
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData: (stream, _session, callback) => {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const at = performance.now();
        const raw = Buffer.concat(chunks).toString('utf8');
        for (const [tag, resolve] of waiting)
          if (raw.includes(tag)) {
            waiting.delete(tag);
            resolve(at);
          }
        callback();
      });
    },
  });
  await new Promise<void>((resolve) => smtp.listen(0, '127.0.0.1', resolve));
  const smtpPort = (smtp.server.address() as AddressInfo).port;
  const arrival = (tag: string) => new Promise<number>((resolve) => waiting.set(tag, resolve));

  const base = loadAppConfig();
  const config = {
    ...base,
    mail: { ...base.mail, driver: 'smtp' as const, host: '127.0.0.1', port: smtpPort, ignoreTls: true },
    jobs: { ...base.jobs, workerEnabled: true },
  };
  const app = await NestFactory.create<NestExpressApplication>(AppModule.forRoot(config), {
    logger: ['error'],
  });
  setupApp(app);
  await app.listen(0, '127.0.0.1');
  const url = `http://127.0.0.1:${(app.getHttpServer().address() as AddressInfo).port}/api`;
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
      return (await res.json()) as T;
    };
    const login = async (email: string) =>
      (await call<{ accessToken: string }>('POST', '/auth/login', null, { email, password: DEMO_PASSWORD }))
        .accessToken;
    const geologist = await login('geologist@roundbook.test');

    const ds = app.get(DataSource);
    const project = await ds.getRepository(Project).findOneByOrFail({ code: 'BRH' });
    const heading = await benchHeading(ds, project.id, 'NB', 'Invented notice benchmark heading');
    const p = `/projects/${project.id}`;
    const { classes } = await call<{ classes: Array<{ id: string; retired?: boolean }> }>(
      'GET',
      `${p}/support-classes`,
      geologist,
    );
    const classId = (classes.find((c) => !c.retired) ?? classes[0]).id;

    const submitToInbox: number[] = [];
    const submitRequest: number[] = [];
    for (let i = 0; i < RUNS; i++) {
      const opened = await call<RoundShape>('POST', `${p}/headings/${heading.id}/rounds`, geologist, {
        stage: 'full-face',
        faceChainage: 1003 + 3 * i,
      });
      const saved = await call<RoundShape>('PUT', `${p}/rounds/${opened.id}`, geologist, {
        version: opened.version,
        faceChainage: opened.faceChainage,
        previousChainage: opened.previousChainage,
        roundLength: opened.roundLength,
        shiftDate: opened.shiftDate,
        shift: opened.shift,
        distantParts: '',
        ground: {
          units: [
            { name: 'Invented gneiss', sharePercent: 100, weatheringGrade: 'WII', strengthGrade: 'R4' },
          ],
          pointLoadIs50: 4,
          pointLoadFactor: 22,
          inflowLpm: 3,
          inflowLengthM: 3,
          waterDescription: '',
          overbreakM3: 0.5,
          notes: '',
        },
        joints: [],
        qInput: { rqd: 60, jn: 4, jr: 1.5, ja: 2, jw: 1, srf: 1 },
        rmrInput: null,
        gsiObserved: null,
        recommendedClassId: classId,
        nextRoundLength: 2,
        recommendationReason: '',
      });
      // The subject names the heading and the round: "To confirm: NB… round N (…)".
      const inbox = arrival(`${heading.code} round ${opened.roundNumber} `);
      const t0 = performance.now();
      await call('POST', `${p}/rounds/${saved.id}/submit`, geologist, { version: saved.version });
      submitRequest.push(performance.now() - t0);
      submitToInbox.push((await inbox) - t0);
    }

    // The reference: one e-mail straight through the same transport (no outbox, no worker).
    const mail = app.get(MailService);
    const direct: number[] = [];
    for (let i = 0; i < RUNS; i++) {
      const tag = `direct-${Date.now()}-${i}`;
      const inbox = arrival(tag);
      const t0 = performance.now();
      await mail.send({ to: ['engineer@roundbook.test'], subject: tag, text: 'Benchmark reference.' });
      direct.push((await inbox) - t0);
    }

    const ours = median(submitToInbox);
    const ref = median(direct);
    console.log(
      `review notice: submit → "To confirm" e-mail in the SMTP server, median of ${RUNS}: ${ours.toFixed(0)} ms ` +
        `(min ${Math.min(...submitToInbox).toFixed(0)}, max ${Math.max(...submitToInbox).toFixed(0)}; the submit request itself ${median(submitRequest).toFixed(0)} ms; ` +
        `jobs poll interval ${config.jobs.pollIntervalMs} ms)`,
    );
    console.log(
      `  reference: one e-mail sent straight through the same transport ${ref.toFixed(1)} ms   ratio ${(ours / ref).toFixed(1)}×`,
    );
  } finally {
    await app.close();
    await new Promise<void>((resolve) => smtp.close(() => resolve()));
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
