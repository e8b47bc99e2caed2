// Issue 11 item 4: review notices and each person's choice of them. Settings honoured (a notice switched
// off is not queued for that person; red ones always are), the timeframe check judged by an injected clock,
// each notice sent once with two API processes, and delivered late after the mail server was down.
import { readdirSync, readFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import type { INestApplication } from '@nestjs/common';
import { simpleParser, type ParsedMail } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource, In } from 'typeorm';
import { APP_CONFIG, type AppConfig } from '../src/config/app-config';
import { JobHandlers } from '../src/infrastructure/jobs/job-handlers';
import type { Job } from '../src/infrastructure/jobs/job.entity';
import { JobsService } from '../src/infrastructure/jobs/jobs.service';
import { MailService } from '../src/infrastructure/mail/mail.service';
import { Notice } from '../src/infrastructure/mail/notice.entity';
import { AuditEvent } from '../src/modules/audit/audit-event.entity';
import { ProjectMember } from '../src/modules/projects/project-member.entity';
import { RULE_DUE_JOB } from '../src/modules/rounds/rounds.review';
import { hashPassword } from '../src/modules/users/password';
import { User } from '../src/modules/users/user.entity';
import { makeProject, saveBody, signIn, TEST_PASSWORD, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const code = `NT${String(Date.now() % 1e6)}`;
const HOUR = 3_600_000;
// Q = 60/4 × 1.5/2 × 1/1 = 11.25 (Barton et al. 1974) [computed here]: C1; the amber rule Q < 20 fires.
const fairQ = { rqd: 60, jn: 4, jr: 1.5, ja: 2, jw: 1, srf: 1 };
// Q = 10/9 × 1/4 × 1/2.5 ≈ 0.11 [computed here]: C3; the red rule Q < 1 fires too.
const poorQ = { rqd: 10, jn: 9, jr: 1, ja: 4, jw: 1, srf: 2.5 };
const ALL_ON = { submitted: true, ruleOverdue: true, returned: true, confirmedOtherClass: true, red: true };

/** Waits for a condition with a bounded loop of short pauses (no fixed sleeps). */
async function until<T>(probe: () => Promise<T> | T, ok: (v: T) => boolean, ms = 20_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await probe();
    if (ok(v)) return v;
    if (Date.now() > end)
      throw new Error(`condition not reached within ${ms} ms (last: ${JSON.stringify(v).slice(0, 400)})`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

/** Rounds of a test project: open at a chainage, save with a Q and a class, submit (as its geologist). */
function rounds(http: () => App, project: () => TestProject) {
  return async (faceChainage: number, q: Body, cls: string): Promise<Body> => {
    const p = project();
    const opened = (
      await request(http())
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage })
        .expect(201)
    ).body as Body;
    const saved = (
      await request(http())
        .put(`${p.base}/rounds/${opened.id}`)
        .set(p.as('geologist'))
        .send(
          saveBody(opened, {
            qInput: q,
            recommendedClassId: p.classes.find((c) => c.code === cls)!.id,
            nextRoundLength: 2,
          }),
        )
        .expect(200)
    ).body as Body;
    return (
      await request(http())
        .post(`${p.base}/rounds/${saved.id}/submit`)
        .set(p.as('geologist'))
        .send({ version: saved.version })
        .expect(200)
    ).body as Body;
  };
}

/** A second engineer of the project (the factory makes one person per role). */
async function addEngineer(app: INestApplication, p: TestProject, suffix: string) {
  const ds = app.get(DataSource);
  const email = `engineer2.${suffix.toLowerCase()}@roundbook.test`;
  const user = await ds.getRepository(User).save({
    email,
    name: `Second engineer ${suffix}`,
    passwordHash: await hashPassword(TEST_PASSWORD),
  });
  await ds.getRepository(ProjectMember).save({ projectId: p.projectId, userId: user.id, role: 'engineer' });
  const token = (await signIn(app.getHttpServer() as App, ['engineer'], () => email, TEST_PASSWORD)).engineer;
  return { email, as: { Authorization: `Bearer ${token}` } };
}

/** The review notices queued for a project (in the request's transaction, so no waiting is needed). */
const noticesOf = (ds: DataSource, projectId: string, kind?: string) =>
  ds.getRepository(Notice).find({
    where: { projectId, ...(kind ? { kind } : {}) },
    order: { createdAt: 'ASC' },
  });

describe('Notice settings: each person chooses, red always arrives (e2e, real MariaDB, SMTP fake)', () => {
  let app: INestApplication;
  let http: App;
  let ds: DataSource;
  let p: TestProject;
  let second: { email: string; as: { Authorization: string } };
  const submit = rounds(
    () => http,
    () => p,
  );

  /** What the SMTP fake received for an address (its local inbox, as the mail view reads it). */
  const mailFor = (to: string): Body[] => {
    const dir = app.get<AppConfig>(APP_CONFIG).mail.localInboxDir!;
    return readdirSync(dir)
      .filter((f) => f.endsWith('.json'))
      .map((f) => JSON.parse(readFileSync(path.join(dir, f), 'utf8')) as Body)
      .filter((m) => (m.to as string[]).includes(to) && String(m.subject).includes(code));
  };

  const settingsUrl = () => `${p.base}/notice-settings`;

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    ds = app.get(DataSource);
    p = await makeProject(app, {
      code,
      rules: [
        { watch: 'q', comparison: '<', threshold: 20, level: 'amber', timeAllowedHours: 6 },
        { watch: 'q', comparison: '<', threshold: 1, level: 'red', timeAllowedHours: 6 },
      ],
    });
    second = await addEngineer(app, p, code);
  });

  afterAll(async () => {
    await app.close();
  });

  it('starts with every notice on; refuses to switch red off (400, with the reason) and stores nothing', async () => {
    const fresh = (await request(http).get(settingsUrl()).set(p.as('engineer')).expect(200)).body as Body;
    expect(fresh).toMatchObject({ projectId: p.projectId, ...ALL_ON, updatedAt: null });
    expect(fresh.redLockedReason).toMatch(/cannot be switched off/);

    const refused = await request(http)
      .put(settingsUrl())
      .set(p.as('engineer'))
      .send({ ...ALL_ON, submitted: false, red: false })
      .expect(400);
    expect(refused.body.message).toMatch(/Red notices cannot be switched off/);
    expect(refused.body.fields).toMatchObject({ red: expect.stringMatching(/cannot be switched off/) });
    expect((await request(http).get(settingsUrl()).set(p.as('engineer')).expect(200)).body).toMatchObject({
      submitted: true,
      updatedAt: null,
    });
    // A missing or non-boolean choice is a 400 too (the whole set is sent at once).
    await request(http).put(settingsUrl()).set(p.as('engineer')).send({ submitted: false }).expect(400);
    await request(http)
      .put(settingsUrl())
      .set(p.as('engineer'))
      .send({ ...ALL_ON, returned: 'no' })
      .expect(400);
  });

  it('keeps each person’s choice for themselves, audited', async () => {
    const saved = (
      await request(http)
        .put(settingsUrl())
        .set(p.as('engineer'))
        .send({ ...ALL_ON, submitted: false, ruleOverdue: false })
        .expect(200)
    ).body as Body;
    expect(saved).toMatchObject({ submitted: false, ruleOverdue: false, returned: true, red: true });
    expect(saved.updatedAt).toEqual(expect.any(String));
    await request(http)
      .put(settingsUrl())
      .set(p.as('geologist'))
      .send({ ...ALL_ON, returned: false })
      .expect(200);
    // The other engineer's settings are untouched.
    expect((await request(http).get(settingsUrl()).set(second.as).expect(200)).body).toMatchObject({
      ...ALL_ON,
      updatedAt: null,
    });
    const audit = await ds.getRepository(AuditEvent).find({
      where: { projectId: p.projectId, entityType: 'notice-settings' },
      order: { createdAt: 'ASC' },
    });
    expect(audit).toHaveLength(2);
    expect(audit[0]).toMatchObject({
      action: 'update',
      before: { submitted: true, ruleOverdue: true },
      after: { submitted: false, ruleOverdue: false },
    });
    // Saving the same choice again records nothing new.
    await request(http)
      .put(settingsUrl())
      .set(p.as('engineer'))
      .send({ ...ALL_ON, submitted: false, ruleOverdue: false })
      .expect(200);
    expect(
      await ds.getRepository(AuditEvent).count({
        where: { projectId: p.projectId, entityType: 'notice-settings' },
      }),
    ).toBe(2);
  });

  let amber: Body;
  let red: Body;

  it('an engineer who switched submit notices off gets none; the red one still arrives', async () => {
    amber = await submit(1003, fairQ, 'C1');
    expect(amber.triggerLevel).toBe('amber');
    const queued = await noticesOf(ds, p.projectId, 'round-submitted');
    expect(queued).toHaveLength(1);
    expect(queued[0].to).toEqual([second.email]);

    red = await submit(1006, poorQ, 'C3');
    expect(red.triggerLevel).toBe('red');
    const after = await noticesOf(ds, p.projectId, 'round-submitted');
    expect(after).toHaveLength(2);
    expect([...after[1].to].sort()).toEqual([p.emailOf('engineer'), second.email].sort());
    expect(after[1].subject).toMatch(/^Red — To confirm: /);

    // In the SMTP fake: the engineer who switched them off has the red one only.
    const mine = await until(
      () => mailFor(p.emailOf('engineer')),
      (m) => m.length > 0,
    );
    const others = await until(
      () => mailFor(second.email),
      (m) => m.length === 2,
    );
    expect(mine.map((m) => m.subject)).toEqual([expect.stringMatching(/^Red — To confirm: .* round 2 /)]);
    expect(others.map((m) => String(m.subject).replace(/^Red — /, '')).sort()).toEqual([
      expect.stringMatching(/^To confirm: .* round 1 /),
      expect.stringMatching(/^To confirm: .* round 2 /),
    ]);
  });

  it('a geologist who switched return notices off is not told of the return', async () => {
    const review = (await request(http).get(`${p.base}/rounds/${amber.id}/review`).set(second.as).expect(200))
      .body as Body;
    await request(http)
      .post(`${p.base}/rounds/${amber.id}/return`)
      .set(second.as)
      .send({ version: review.version, comments: [{ section: 'ground', text: 'Check the inflow.' }] })
      .expect(200);
    expect(await noticesOf(ds, p.projectId, 'round-returned')).toHaveLength(0);
  });

  it('tells of a rule past its time by the clock the check is given: not before, once after, honouring settings', async () => {
    const third = await submit(1009, fairQ, 'C1');
    expect(third.triggerLevel).toBe('amber');
    // The red round's red rule is acknowledged by its owner; its amber rule is not.
    const redReview = (
      await request(http).get(`${p.base}/rounds/${red.id}/review`).set(second.as).expect(200)
    ).body as Body;
    const redRule = (redReview.rules as Body[]).find((r) => r.level === 'red')!;
    await request(http)
      .post(`${p.base}/rounds/${red.id}/triggers/${redRule.ruleId}/acknowledge`)
      .set(second.as)
      .send({ actionTaken: 'Probe holes drilled, dry.', note: '' })
      .expect(200);

    const jobs = app.get(JobsService);
    const handler = app.get(JobHandlers).get(RULE_DUE_JOB)!;
    const mine = new Set([amber.id, red.id, third.id]);
    const worker = `notices-test-${code}`;
    /**
     * Runs the timeframe checks that are due by `clock` for this file's rounds; any other test's jobs the
     * claim took are given back untouched (their own due time restored).
     */
    const checkAt = async (clock: Date): Promise<Job[]> => {
      const claimed = await jobs.claim(worker, 500, clock, [RULE_DUE_JOB]);
      const ours = claimed.filter((j) => mine.has(String(j.payload.roundId)));
      for (const j of claimed.filter((x) => !ours.includes(x)))
        await jobs.release(j.id, worker, j.nextAttemptAt);
      for (const j of ours) {
        await handler(j.payload, { job: j, attempt: j.attempts, signal: new AbortController().signal });
        await jobs.complete(j.id, worker, clock);
      }
      return ours;
    };

    // Five hours on: no rule's six hours are up, nothing runs and nothing is queued.
    expect(await checkAt(new Date(Date.now() + 5 * HOUR))).toHaveLength(0);
    expect(await noticesOf(ds, p.projectId, 'round-rule-overdue')).toHaveLength(0);

    // Seven hours on: every check of the three rounds runs once.
    const ran = await checkAt(new Date(Date.now() + 7 * HOUR));
    // Round 1 (returned since: checked against its old revision, so silent): amber; round 2: amber and red;
    // round 3: amber.
    expect(ran).toHaveLength(4);
    const overdue = await noticesOf(ds, p.projectId, 'round-rule-overdue');
    // Round 2's amber rule (red round: a red notice, to everyone it concerns) and round 3's amber rule (the
    // engineer who switched overdue notices off is left out). The acknowledged red rule is silent.
    expect(overdue).toHaveLength(2);
    const bySubject = new Map(overdue.map((n) => [n.subject.includes('round 2 ') ? 2 : 3, n]));
    expect(bySubject.get(2)!.subject).toMatch(/^Red — Overdue: /);
    expect([...bySubject.get(2)!.to].sort()).toEqual([p.emailOf('engineer'), second.email].sort());
    expect(bySubject.get(2)!.text).toMatch(/Rule: Q.*\(amber\)/);
    expect(bySubject.get(3)!.subject).toMatch(/^Overdue: /);
    expect(bySubject.get(3)!.to).toEqual([second.email]);

    // Run again (a retry, another process): nothing new.
    expect(await checkAt(new Date(Date.now() + 8 * HOUR))).toHaveLength(0);
    expect(await noticesOf(ds, p.projectId, 'round-rule-overdue')).toHaveLength(2);
  });

  it('only members have notice settings in a project (another project is not found)', async () => {
    const other = await makeProject(app, { code: `${code}X` });
    await request(http).get(`${other.base}/notice-settings`).set(p.as('engineer')).expect(404);
    await request(http).put(`${other.base}/notice-settings`).set(p.as('engineer')).send(ALL_ON).expect(404);
  });
});

/** An SMTP server of this file's own, to count deliveries by Message-ID and to take down (STARTTLS off). */
class OwnSmtp {
  readonly mails: ParsedMail[] = [];
  private server: SMTPServer | null = null;
  port = 0;

  async start(port = 0): Promise<void> {
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

  /** How many times each Message-ID arrived. */
  times(messageIds: string[]): number[] {
    return messageIds.map((id) => this.mails.filter((m) => m.messageId === id).length);
  }
}

describe('Review notices with two API processes and a mail server outage (e2e, own SMTP server)', () => {
  const smtp = new OwnSmtp();
  let a: INestApplication;
  let b: INestApplication;
  let p: TestProject;
  const sentBy = { a: 0, b: 0 };
  const code2 = `${code}P`;
  const submit = rounds(
    () => a.getHttpServer() as App,
    () => p,
  );

  beforeAll(async () => {
    await smtp.start();
    const config = (c: AppConfig): AppConfig => ({
      ...c,
      mail: { ...c.mail, driver: 'smtp', host: '127.0.0.1', port: smtp.port },
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
    // Two apps, as two API processes would be: each its own pool, mail transport and jobs worker.
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
    // No time allowed: each submit also makes its rule's timeframe check due at once (two notices a round).
    p = await makeProject(a, {
      code: code2,
      rules: [{ watch: 'q', comparison: '<', threshold: 20, level: 'amber', timeAllowedHours: 0 }],
    });
  });

  afterAll(async () => {
    await Promise.all([a?.close(), b?.close()]);
    await smtp.stop();
  });

  it('sends each submit notice and each overdue notice once, whichever process runs the job', async () => {
    const ds = a.get(DataSource);
    for (let i = 0; i < 6; i++) await submit(1003 + 3 * i, fairQ, 'C1');
    const notices = await until(
      () => noticesOf(ds, p.projectId),
      (n) => n.length >= 12,
    );
    const kinds = notices.map((n) => n.kind);
    expect(kinds.filter((k) => k === 'round-submitted')).toHaveLength(6);
    expect(kinds.filter((k) => k === 'round-rule-overdue')).toHaveLength(6);
    const ids = notices.map((n) => n.messageId);
    await until(
      () => smtp.times(ids),
      (t) => t.every((n) => n >= 1),
    );
    const jobs = await until(
      () =>
        ds.query<Array<{ state: string; attempts: number }>>(
          `SELECT state, attempts FROM jobs WHERE dedupe_key IN (${ids.map(() => '?').join(', ')})`,
          notices.map((n) => `notice:${n.id}`),
        ),
      (js) => js.length === 12 && js.every((j) => j.state === 'done'),
    );
    expect(jobs.every((j) => j.attempts === 1)).toBe(true);
    expect(smtp.times(ids)).toEqual(ids.map(() => 1));
    // Every notice went to this project's engineer, with the link and the caution.
    const mine = smtp.mails.filter((m) => ids.includes(m.messageId ?? ''));
    expect(mine.every((m) => (m.text ?? '').includes(`/projects/${p.projectId}/rounds/`))).toBe(true);
    expect(mine.every((m) => (m.text ?? '').includes('the responsible engineer decides'))).toBe(true);
    console.log(
      `notices e2e: 12 review notices from 6 submits, each delivered once (process A sent ${sentBy.a}, B ${sentBy.b})`,
    );
  });

  it('keeps a submit notice while the mail server is down and delivers it once when it is back', async () => {
    const ds = a.get(DataSource);
    const port = smtp.port;
    await smtp.stop();
    const before = (await noticesOf(ds, p.projectId)).map((n) => n.id);
    await submit(1030, fairQ, 'C1');
    const fresh = await until(
      async () => (await noticesOf(ds, p.projectId)).filter((n) => !before.includes(n.id)),
      (n) => n.length === 2,
    );
    const waiting = await until(
      () =>
        ds.query<Array<{ state: string; attempts: number; last_error: string | null }>>(
          'SELECT state, attempts, last_error FROM jobs WHERE dedupe_key IN (?, ?)',
          fresh.map((n) => `notice:${n.id}`),
        ),
      (js) => js.length === 2 && js.every((j) => j.attempts >= 3 && j.state !== 'done'),
    );
    expect(waiting.every((j) => j.state === 'pending' || j.state === 'running')).toBe(true);
    expect(waiting.some((j) => /ECONNREFUSED/.test(j.last_error ?? ''))).toBe(true);
    const ids = fresh.map((n) => n.messageId);
    expect(smtp.times(ids)).toEqual([0, 0]);
    expect(await ds.getRepository(Notice).count({ where: { id: In(fresh.map((n) => n.id)) } })).toBe(2);

    await smtp.start(port);
    await until(
      () => smtp.times(ids),
      (t) => t.every((n) => n >= 1),
    );
    await until(
      () =>
        ds.query<Array<{ state: string }>>(
          'SELECT state FROM jobs WHERE dedupe_key IN (?, ?)',
          fresh.map((n) => `notice:${n.id}`),
        ),
      (js) => js.every((j) => j.state === 'done'),
    );
    expect(smtp.times(ids)).toEqual([1, 1]);
    const sent = await ds.getRepository(Notice).find({ where: { id: In(fresh.map((n) => n.id)) } });
    expect(sent.every((n) => n.sentAt !== null)).toBe(true);
  });
});
