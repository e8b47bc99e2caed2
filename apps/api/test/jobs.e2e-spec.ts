import type { AddressInfo } from 'node:net';
import type { INestApplication } from '@nestjs/common';
import { SMTPServer } from 'smtp-server';
import { DataSource, In } from 'typeorm';
import { Job } from '../src/infrastructure/jobs/job.entity';
import { JobsService } from '../src/infrastructure/jobs/jobs.service';
import { MailService } from '../src/infrastructure/mail/mail.service';
import { Notice } from '../src/infrastructure/mail/notice.entity';
import { NoticesService } from '../src/infrastructure/mail/notices.service';
import { createTestApp } from './test-app';

/** A run-unique tag, so messages and jobs of earlier runs against the same database are not counted. */
const run = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

/** Waits for a condition with a bounded loop of short pauses (no fixed sleeps). */
async function until<T>(probe: () => Promise<T> | T, ok: (v: T) => boolean, ms = 20_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await probe();
    if (ok(v)) return v;
    if (Date.now() > end)
      throw new Error(`condition not reached within ${ms} ms (last: ${JSON.stringify(v)})`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

/** The test's own SMTP server on 127.0.0.1 (STARTTLS off: smtp-server's bundled certificate has expired). */
class TestSmtp {
  /** Message-ID → how many times it arrived */
  readonly received = new Map<string, number>();
  private server: SMTPServer | null = null;
  port = 0;

  async start(port = 0): Promise<void> {
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      closeTimeout: 200,
      onData: (stream, _session, callback) => {
        const chunks: Buffer[] = [];
        stream.on('data', (c: Buffer) => chunks.push(c));
        stream.on('end', () => {
          const head = Buffer.concat(chunks)
            .toString('utf8')
            .split(/\r?\n\r?\n/)[0];
          const id = /^Message-ID:\s*(\S+)/im.exec(head)?.[1] ?? '(none)';
          this.received.set(id, (this.received.get(id) ?? 0) + 1);
          callback();
        });
      },
    });
    await new Promise<void>((resolve, reject) => {
      server.once('error', reject);
      server.listen(port, '127.0.0.1', () => resolve());
    });
    this.port = (server.server.address() as AddressInfo).port;
    this.server = server;
  }

  async stop(): Promise<void> {
    const s = this.server;
    this.server = null;
    if (s) await new Promise<void>((resolve) => s.close(() => resolve()));
  }

  count(ids: Iterable<string>): { delivered: number; twice: number } {
    let delivered = 0;
    let twice = 0;
    for (const id of ids) {
      const n = this.received.get(id) ?? 0;
      if (n >= 1) delivered++;
      if (n > 1) twice++;
    }
    return { delivered, twice };
  }
}

describe('background jobs: two API processes, one jobs table, each e-mail once (e2e, real MariaDB)', () => {
  const smtp = new TestSmtp();
  let a: INestApplication;
  let b: INestApplication;
  const sentBy = { a: 0, b: 0 };

  /** Queues `n` e-mails in one transaction, as a request would; returns their Message-IDs. */
  async function queue(n: number, label: string): Promise<{ messageIds: string[]; noticeIds: string[] }> {
    const notices = a.get(NoticesService);
    const saved = await a.get(DataSource).transaction(async (manager) => {
      const out: Notice[] = [];
      for (let i = 0; i < n; i++) {
        out.push(
          await notices.queue(manager, {
            kind: 'test',
            to: [`reader.${i}@roundbook.test`],
            subject: `Jobs test ${run} ${label} #${i}`,
            text: `Message ${i} of ${n}`,
          }),
        );
      }
      return out;
    });
    return { messageIds: saved.map((s) => s.messageId), noticeIds: saved.map((s) => s.id) };
  }

  const jobsOf = (noticeIds: string[]): Promise<Job[]> =>
    a
      .get(DataSource)
      .getRepository(Job)
      .find({ where: { dedupeKey: In(noticeIds.map((id) => `notice:${id}`)) } });

  beforeAll(async () => {
    await smtp.start();
    // Two apps, as two API processes would be: each its own pool, mail transport and worker.
    const config = (c: Parameters<Parameters<typeof createTestApp>[0] & object>[0]) => ({
      ...c,
      mail: { ...c.mail, host: '127.0.0.1', port: smtp.port },
      jobs: {
        ...c.jobs,
        workerEnabled: true,
        pollIntervalMs: 20,
        concurrency: 4,
        maxAttempts: 1000,
        backoffBaseMs: 20,
        backoffMaxMs: 150,
      },
    });
    a = await createTestApp(config);
    b = await createTestApp(config);
    for (const [name, app] of [
      ['a', a],
      ['b', b],
    ] as const) {
      const mail = app.get(MailService);
      const send = mail.send.bind(mail);
      mail.send = (m) => {
        sentBy[name]++;
        return send(m);
      };
    }
  });

  afterAll(async () => {
    await Promise.all([a?.close(), b?.close()]);
    await smtp.stop();
  });

  it('delivers 200 queued e-mails with two workers, none twice (counted by Message-ID)', async () => {
    const started = Date.now();
    const { messageIds, noticeIds } = await queue(200, 'bulk');
    const queuedMs = Date.now() - started;
    expect(new Set(messageIds).size).toBe(200);
    await until(
      () => smtp.count(messageIds),
      (c) => c.delivered === 200,
    );
    const elapsed = Date.now() - started;
    const jobs = await until(
      () => jobsOf(noticeIds),
      (js) => js.length === 200 && js.every((j) => j.state === 'done'),
    );
    expect(smtp.count(messageIds)).toEqual({ delivered: 200, twice: 0 });
    expect(jobs.every((j) => j.attempts === 1 && j.lockedBy === null)).toBe(true);
    const notices = await a
      .get(DataSource)
      .getRepository(Notice)
      .find({ where: { id: In(noticeIds) } });
    expect(notices.every((n) => n.sentAt !== null)).toBe(true);
    // Both processes took part (each claims at most 4 at a time).
    expect(sentBy.a).toBeGreaterThan(0);
    expect(sentBy.b).toBeGreaterThan(0);
    expect(sentBy.a + sentBy.b).toBeGreaterThanOrEqual(200);
    console.log(
      `jobs e2e: 200 e-mails queued in one transaction in ${queuedMs} ms; all delivered through two workers ${elapsed} ms after the start (process A sent ${sentBy.a}, B ${sentBy.b})`,
    );
  });

  it('keeps e-mails waiting while the mail server is down (attempts grow, still pending) and sends each once when it is back', async () => {
    const port = smtp.port;
    await smtp.stop();
    const { messageIds, noticeIds } = await queue(10, 'outage');
    const waiting = await until(
      () => jobsOf(noticeIds),
      (js) => js.length === 10 && js.every((j) => j.attempts >= 3 && j.state !== 'done'),
    );
    expect(waiting.every((j) => j.state === 'pending' || j.state === 'running')).toBe(true);
    expect(waiting.some((j) => /ECONNREFUSED/.test(j.lastError ?? ''))).toBe(true);
    expect(smtp.count(messageIds).delivered).toBe(0);

    await smtp.start(port);
    await until(
      () => smtp.count(messageIds),
      (c) => c.delivered === 10,
    );
    const done = await until(
      () => jobsOf(noticeIds),
      (js) => js.every((j) => j.state === 'done'),
    );
    expect(done.every((j) => j.attempts >= 3)).toBe(true);
    expect(smtp.count(messageIds)).toEqual({ delivered: 10, twice: 0 });
  });

  it('does not send a notice again once it is marked sent, and reuses its Message-ID after a crash before the mark', async () => {
    const { messageIds, noticeIds } = await queue(1, 'crash');
    await until(
      () => smtp.count(messageIds),
      (c) => c.delivered === 1,
    );
    const notices = a.get(NoticesService);
    // A second run of the handler (e.g. a job retried after the mark): nothing is sent.
    await notices.deliver(noticeIds[0]);
    expect(smtp.received.get(messageIds[0])).toBe(1);
    // A crash between sending and the mark: sent_at still empty, the resend carries the same Message-ID.
    await a.get(DataSource).getRepository(Notice).update({ id: noticeIds[0] }, { sentAt: null });
    await notices.deliver(noticeIds[0]);
    expect(smtp.received.get(messageIds[0])).toBe(2);
  });

  it('claims with SKIP LOCKED: two claims at the same moment never share a job; a dedupe key makes one job', async () => {
    const jobs = a.get(JobsService);
    const ds = a.get(DataSource);
    // Due only for a clock two hours ahead, so the running workers (real clock) leave them alone.
    const later = new Date(Date.now() + 3_600_000);
    const ids = await ds.transaction(async (m) => {
      const out: string[] = [];
      for (let i = 0; i < 30; i++)
        out.push(
          await jobs.enqueue(m, {
            kind: `test.claim.${run}`,
            payload: { i },
            runAt: later,
            dedupeKey: `${run}-${i}`,
          }),
        );
      return out;
    });
    const again = await ds.transaction((m) =>
      jobs.enqueue(m, { kind: `test.claim.${run}`, payload: { i: 0 }, runAt: later, dedupeKey: `${run}-0` }),
    );
    expect(again).toBe(ids[0]);
    const clock = new Date(Date.now() + 7_200_000);
    const [x, y] = await Promise.all([
      // Only this test's kind: other files' jobs waiting on their back-off stay untouched.
      jobs.claim('claim-test-x', 20, clock, [`test.claim.${run}`]),
      b.get(JobsService).claim('claim-test-y', 20, clock, [`test.claim.${run}`]),
    ]);
    const mine = new Set(ids);
    const xs = x.filter((j) => mine.has(j.id)).map((j) => j.id);
    const ys = y.filter((j) => mine.has(j.id)).map((j) => j.id);
    expect(xs.filter((id) => ys.includes(id))).toEqual([]);
    expect(new Set([...xs, ...ys]).size).toBe(30);
    expect(xs.length + ys.length).toBe(x.length + y.length); // nothing but this test's kind
    expect(x.every((j) => j.state === 'running' && j.lockedBy === 'claim-test-x' && j.attempts === 1)).toBe(
      true,
    );
    // Give them back finished so later runs and workers leave them alone.
    for (const j of x) await jobs.complete(j.id, 'claim-test-x', new Date());
    for (const j of y) await jobs.complete(j.id, 'claim-test-y', new Date());
    const rows = await ds.getRepository(Job).find({ where: { id: In(ids) } });
    expect(rows.every((r) => r.state === 'done')).toBe(true);
  });
});
