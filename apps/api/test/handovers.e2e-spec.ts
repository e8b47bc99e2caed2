// Issue 15, items 3–5: compose a handover from the data, send it (saved first; PDF and e-mail by job through
// the notices outbox to the SMTP fake), acknowledge by the named incoming supervisor only, Received and
// each heading's history. On a project of this file's own.
import { readdirSync, readFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import type { INestApplication } from '@nestjs/common';
import { simpleParser, type ParsedMail } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { APP_CONFIG, type AppConfig } from '../src/config/app-config';
import { NoticesService } from '../src/infrastructure/mail/notices.service';
import { HandoversService } from '../src/modules/handovers/handovers.service';
import { ProjectMember } from '../src/modules/projects/project-member.entity';
import { hashPassword } from '../src/modules/users/password';
import { User } from '../src/modules/users/user.entity';
import { latestAudit, makeProject, saveBody, signIn, TEST_PASSWORD, type TestProject } from './factories';
import { createTestApp } from './test-app';

// pdf-parse 1.1.4 works in plain Jest on Node 20 (stack-notes §12); its index runs a self-test, so the lib.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const pdfParse = require('pdf-parse/lib/pdf-parse.js') as (data: Buffer) => Promise<{ text: string }>;

type Body = Record<string, any>;
const code = `HO${String(Date.now() % 1e6)}`;
const CAUTION =
  'This handover supports the face-to-face briefing at shift change and does not replace it. The competent person on site decides whether the ground is safe to enter; nobody enters unsupported ground.';
/** The red hazard as the e-mail and the PDF list it: level as a word, kind, range, description. */
const HAZARD_LINE =
  'Red — Wedge, 1+004.0 – 1+006.0: Invented: wedge of two joint sets in the right shoulder.';
/** The look-ahead as the e-mail lists it (round 2's fault, from its frozen assessment). */
const LOOK_AHEAD_LINE =
  'fault 1 (round 2), from the face centre: reaches the crown 1.7 m ahead of the face, in the next round — crown at 1+007.7, invert at 1+004.3 (passed)';
const flat = (s: string) => s.replace(/\s+/g, ' ');

/** Waits for a condition with a bounded loop of short pauses (no fixed sleeps). */
async function until<T>(probe: () => Promise<T> | T, ok: (v: T) => boolean, ms = 20_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await probe();
    if (ok(v)) return v;
    if (Date.now() > end) throw new Error(`condition not reached within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

describe('Handovers (e2e, real MariaDB, S3 fake, jobs worker and SMTP fake)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  let incoming: { id: string; email: string; token: string };
  let outgoingId: string;
  const classId = (c: string) => p.classes.find((x) => x.code === c)!.id as string;

  const mailDir = () => app.get<AppConfig>(APP_CONFIG).mail.localInboxDir!;
  const mailFor = (to: string): Body[] =>
    readdirSync(mailDir())
      .filter((f) => f.endsWith('.json'))
      .map((f) => JSON.parse(readFileSync(path.join(mailDir(), f), 'utf8')) as Body)
      .filter((m) => (m.to as string[]).includes(to));

  /** Opens a round at the face, saves its record with class C1 and Q 11.25 (and joints), and submits it. */
  const mapRound = async (faceChainage: number, joints: Body[] = []): Promise<Body> => {
    const opened = (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage })
        .expect(201)
    ).body as Body;
    const saved = (
      await request(http)
        .put(`${p.base}/rounds/${opened.id}`)
        .set(p.as('geologist'))
        .send(saveBody(opened, { recommendedClassId: classId('C1'), nextRoundLength: 3, joints }))
        .expect(200)
    ).body as Body;
    return (
      await request(http)
        .post(`${p.base}/rounds/${saved.id}/submit`)
        .set(p.as('geologist'))
        .send({ version: saved.version })
        .expect(200)
    ).body as Body;
  };

  const compose = (body: Body, role: 'supervisor' | 'admin' | 'engineer' = 'supervisor') =>
    request(http).post(`${p.base}/handovers`).set(p.as(role)).send(body);
  const validBody = (): Body => ({
    shiftDate: '2026-12-03',
    shift: 'day',
    incomingUserId: incoming.id,
    headings: [
      {
        headingId: p.headingId,
        cycleStage: 'mucking',
        notes: 'Scaling done at the crown; mucking half way.',
      },
    ],
    generalNotes: 'Loader 2 is in the workshop.',
    extraRecipients: [`site.office.${code.toLowerCase()}@roundbook.test`],
  });

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    // Q = 60/4 × 1.5/2 × 1/1 = 11.25 (Barton et al. 1974) [computed here]: the amber rule Q < 20 fires.
    p = await makeProject(app, {
      code,
      rules: [{ watch: 'q', comparison: '<', threshold: 20, level: 'amber', timeAllowedHours: 4 }],
    });
    const ds = app.get(DataSource);
    // A second supervisor (the incoming shift's).
    const email = `incoming.${code.toLowerCase()}@roundbook.test`;
    const user = await ds
      .getRepository(User)
      .save({ email, name: `Invented incoming ${code}`, passwordHash: await hashPassword(TEST_PASSWORD) });
    await ds
      .getRepository(ProjectMember)
      .save({ projectId: p.projectId, userId: user.id, role: 'supervisor' });
    const token = (await signIn(http, ['supervisor'], () => email, TEST_PASSWORD)).supervisor;
    incoming = { id: user.id, email, token };
    outgoingId = (await ds.getRepository(User).findOneByOrFail({ email: p.emailOf('supervisor') })).id;

    // Round 1 at 1+003.0 confirmed as C1 with a next round of 3 m; round 2 at 1+006.0 handed in.
    const first = await mapRound(1003);
    await request(http)
      .post(`${p.base}/rounds/${first.id}/confirm`)
      .set(p.as('engineer'))
      .send({
        version: first.version,
        classId: classId('C1'),
        roundLength: 3,
        comments: '',
        reason: '',
        password: TEST_PASSWORD,
      })
      .expect(200);
    // Round 2 maps a fault 240/60 through the face centre, dipping back against the drive (060): on the
    // 3 m radius profile it reaches the crown 3/tan 60° = 1.732 m ahead and the invert 1.732 m behind
    // (methods.md §6) [computed here].
    await mapRound(1006, [
      {
        id: '6f1c1a52-2f0e-4d7a-9a43-0c5b7d1e0a01',
        kind: 'fault',
        orientationText: '240/60',
        notation: 'dip-direction/dip',
        setLabel: null,
        spacingM: null,
        persistenceM: 20,
        apertureMm: 40,
        jr: 1,
        jrc: null,
        jrcMethod: null,
        infill: 'soft clay gouge',
        ja: 8,
        water: 'dripping',
        thicknessM: 0.4,
        notes: '',
      },
    ]);
    // An open red hazard on the register (raised after the submits, so the rounds' alerts stay as they are).
    await request(http)
      .post(`${p.base}/headings/${p.headingId}/hazards`)
      .set(p.as('geologist'))
      .send({
        kind: 'wedge',
        fromChainage: 1006,
        toChainage: 1004,
        level: 'red',
        description: 'Invented: wedge of two joint sets in the right shoulder.',
      })
      .expect(201);
  });

  afterAll(async () => {
    await app.close();
  });

  let sent: Body;

  it('opens a draft from the data: last handed-in face, last confirmed round with its class and length, alerts', async () => {
    const url = `${p.base}/handovers/draft?headingIds=${p.headingId}`;
    await request(http).get(url).set(p.as('geologist')).expect(403);
    await request(http).get(`${p.base}/handovers/draft?headingIds=nope`).set(p.as('supervisor')).expect(400);
    const draft = (await request(http).get(url).set(p.as('supervisor')).expect(200)).body as Body;
    expect(draft.headings).toHaveLength(1);
    expect(draft.headings[0]).toMatchObject({
      headingId: p.headingId,
      code: 'TH',
      faceChainage: 1006,
      stage: 'full-face',
      lastRoundNumber: 2,
      lastConfirmed: { roundNumber: 1, faceChainage: 1003, classCode: 'C1', nextRoundLength: 3 },
      triggerLevel: 'amber',
      cycleStage: null,
      notes: '',
    });
    expect(draft.headings[0].hazards).toEqual([
      expect.objectContaining({
        kind: 'wedge',
        fromChainage: 1004,
        toChainage: 1006,
        level: 'red',
        description: 'Invented: wedge of two joint sets in the right shoulder.',
      }),
    ]);
    // Look-ahead from the frozen assessment of round 2, counted in the confirmed next round length (3 m).
    expect(draft.headings[0].lookAheadRoundLength).toBe(3);
    expect(draft.headings[0].lookAhead).toEqual([
      expect.objectContaining({
        label: 'fault 1',
        roundNumber: 2,
        firstAt: 'crown',
        roundsAhead: 1,
        traceKnown: false,
      }),
    ]);
    const reach = draft.headings[0].lookAhead[0] as Body;
    expect(reach.crownChainage).toBeCloseTo(1007.732, 3);
    expect(reach.invertChainage).toBeCloseTo(1004.268, 3);
    expect(reach.nearestAhead).toBeCloseTo(1.732, 3);
    expect(reach.invertAhead).toBeCloseTo(-1.732, 3);
    expect(draft.headings[0].alerts).toEqual([
      expect.objectContaining({ level: 'amber', ownerRole: 'engineer', action: 'Tell the engineer.' }),
    ]);
    // Whom it can go to: the project's other supervisors (not the caller).
    expect((draft.supervisors as Body[]).map((s) => s.userId)).toEqual([incoming.id]);
    expect(draft.caution).toBe(CAUTION);
  });

  it('refuses a handover to someone who is not a supervisor, to oneself, or of a foreign heading; engineers cannot send', async () => {
    const viewerId = (
      await app
        .get(DataSource)
        .getRepository(User)
        .findOneByOrFail({ email: p.emailOf('viewer') })
    ).id;
    const notSupervisor = await compose({ ...validBody(), incomingUserId: viewerId }).expect(400);
    expect(notSupervisor.body.fields).toEqual({ incomingUserId: 'Not a supervisor of this project.' });
    await compose({ ...validBody(), incomingUserId: outgoingId }).expect(400);
    await compose({
      ...validBody(),
      headings: [{ headingId: '00000000-0000-4000-8000-000000000000', cycleStage: 'drilling' }],
    }).expect(404);
    await compose({ ...validBody(), headings: [{ headingId: p.headingId, cycleStage: 'resting' }] }).expect(
      400,
    );
    await compose(validBody(), 'engineer').expect(403);
  });

  it('saves and sends: the SMTP fake receives HTML, text and a PDF with the chainage, the class and the caution', async () => {
    const res = await compose(validBody()).expect(201);
    sent = res.body as Body;
    expect(sent).toMatchObject({
      status: 'sent',
      shiftDate: '2026-12-03',
      shift: 'day',
      incoming: { userId: incoming.id, email: incoming.email },
      outgoing: { userId: outgoingId },
      headings: [
        {
          faceChainage: 1006,
          cycleStage: 'mucking',
          lastConfirmed: { classCode: 'C1' },
          hazards: [expect.objectContaining({ kind: 'wedge', level: 'red' })],
        },
      ],
      acknowledgedAt: null,
    });
    expect(sent.recipients).toEqual([incoming.email, `site.office.${code.toLowerCase()}@roundbook.test`]);
    expect(await latestAudit(app, sent.id as string)).toMatchObject({
      action: 'send',
      entityType: 'handover',
    });

    const [mail] = await until(
      () => mailFor(incoming.email),
      (m) => m.length > 0,
    );
    expect(mail.subject).toBe(`Handover TH, day shift 3 Dec 2026 — Invented test project ${code}`);
    expect(mail.cc).toEqual([`site.office.${code.toLowerCase()}@roundbook.test`]);
    for (const part of [String(mail.text), String(mail.html)]) {
      expect(part).toContain('1+006.0');
      expect(part).toContain('C1 — Spot bolts');
      expect(part).toContain('Mucking out');
      expect(part).toContain('Scaling done at the crown');
      expect(part).toContain('Amber: ');
      expect(part).toContain(HAZARD_LINE);
      expect(part).toContain(LOOK_AHEAD_LINE);
    }
    expect(flat(String(mail.text))).toContain(CAUTION);
    expect(String(mail.html)).toContain('max-width:560px');
    expect(String(mail.html)).toContain('face-to-face briefing');
    expect(mail.attachments).toEqual([
      expect.objectContaining({
        index: 0,
        contentType: 'application/pdf',
        filename: 'handover-TH-2026-12-03-day.pdf',
      }),
    ]);
    const pdf = readFileSync(path.join(mailDir(), `${mail.id}.att0`));
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const text = flat((await pdfParse(pdf)).text);
    expect(text).toContain('1+006.0'); // face of the last round handed in
    expect(text).toContain('1+003.0'); // the last confirmed round
    expect(text).toContain('C1 — Spot bolts');
    expect(text).toContain('3 m');
    expect(text).toContain('Mucking out');
    expect(text).toContain('Open hazards');
    expect(text).toContain(HAZARD_LINE);
    expect(text).toContain(CAUTION);
    // The look-ahead table: its header, the feature, its crown chainage, distance and round.
    for (const cell of [
      'Look-ahead',
      'Ahead of the face',
      'fault 1 (round 2), from the face centre',
      '1+007.7',
      '1+004.3 (passed)',
      '1.7 m (crown)',
      'in the next round',
      'Coming rounds counted at 3 m each (the next round length confirmed).',
    ])
      expect(text).toContain(cell);
    // The trigger summary's arrow is spelled out (Open Sans has no glyph for →), the words around it intact.
    expect(text).toContain('Amber: Q < 20 -> amber — Tell the engineer. (owner: Engineer)');
    expect(String(mail.text)).toContain('Q < 20 → amber'); // the e-mail keeps the arrow

    // Listed with the handover: the stored PDF downloads, the e-mail reads as sent.
    const got = (await request(http).get(`${p.base}/handovers/${sent.id}`).set(p.as('viewer')).expect(200))
      .body as Body;
    expect(got).toMatchObject({ pdfReady: true, emailStatus: 'sent' });
    const link = (
      await request(http).get(`${p.base}/handovers/${sent.id}/pdf`).set(p.as('viewer')).expect(200)
    ).body as Body;
    const downloaded = Buffer.from(await (await fetch(link.url as string)).arrayBuffer());
    expect(downloaded.equals(pdf)).toBe(true);
  });

  it('is acknowledged by the named incoming supervisor only, once, with the comment, time and person recorded', async () => {
    const url = `${p.base}/handovers/${sent.id}/acknowledge`;
    const byOutgoing = await request(http).post(url).set(p.as('supervisor')).send({}).expect(403);
    expect(byOutgoing.body.message).toContain(`Invented incoming ${code}`);
    await request(http).post(url).set(p.as('admin')).send({}).expect(403);
    await request(http).post(url).set(p.as('engineer')).send({}).expect(403);
    const ack = await request(http)
      .post(url)
      .set({ Authorization: `Bearer ${incoming.token}` })
      .send({ comment: 'Is the probe rig back tonight?' })
      .expect(200);
    expect(ack.body).toMatchObject({
      status: 'acknowledged',
      acknowledgedBy: { userId: incoming.id },
      acknowledgeComment: 'Is the probe rig back tonight?',
    });
    expect(Date.parse(ack.body.acknowledgedAt as string)).toBeGreaterThanOrEqual(
      Date.parse(sent.sentAt as string),
    );
    expect(await latestAudit(app, sent.id as string)).toMatchObject({
      action: 'acknowledge',
      actorId: incoming.id,
      after: { status: 'acknowledged', comment: 'Is the probe rig back tonight?' },
    });
    await request(http)
      .post(url)
      .set({ Authorization: `Bearer ${incoming.token}` })
      .send({})
      .expect(409);
  });

  it('lists Received (waiting first) for the incoming supervisor and the heading’s history (newest first)', async () => {
    const second = (await compose({ ...validBody(), shift: 'night', extraRecipients: [] }).expect(201))
      .body as Body;
    const received = (
      await request(http)
        .get('/api/handovers/received')
        .set({ Authorization: `Bearer ${incoming.token}` })
        .expect(200)
    ).body as Body[];
    expect(received.map((h) => [h.id, h.status])).toEqual([
      [second.id, 'sent'],
      [sent.id, 'acknowledged'],
    ]);
    const outgoingReceived = (
      await request(http).get('/api/handovers/received').set(p.as('supervisor')).expect(200)
    ).body as Body[];
    expect(outgoingReceived).toEqual([]);
    const history = (
      await request(http).get(`${p.base}/headings/${p.headingId}/handovers`).set(p.as('viewer')).expect(200)
    ).body as Body[];
    expect(history.map((h) => h.id)).toEqual([second.id, sent.id]);
    // The Board shows the heading's latest handover and that it waits for acknowledgement.
    const project = (await request(http).get(p.base).set(p.as('viewer')).expect(200)).body as Body;
    expect((project.headings as Body[]).find((h) => h.id === p.headingId)!.lastHandover).toEqual({
      sentAt: second.sentAt,
      acknowledgedAt: null,
      ackDueAt: second.ackDueAt,
      overdue: false,
    });
  });

  it('flags an unacknowledged handover overdue after the project’s time, and tells the outgoing supervisor and the engineers once', async () => {
    const ds = app.get(DataSource);
    const service = app.get(HandoversService);
    const projectUrl = p.base;
    const before = (await request(http).get(projectUrl).set(p.as('admin')).expect(200)).body as Body;
    expect(before.handoverAckMinutes).toBe(60); // our default
    const tooShort = await request(http)
      .patch(projectUrl)
      .set(p.as('admin'))
      .send({ handoverAckMinutes: 2, version: before.version })
      .expect(400);
    expect(JSON.stringify(tooShort.body)).toContain('at least 5 minutes');
    await request(http)
      .patch(projectUrl)
      .set(p.as('supervisor'))
      .send({ handoverAckMinutes: 30, version: before.version })
      .expect(403);
    await request(http)
      .patch(projectUrl)
      .set(p.as('admin'))
      .send({ handoverAckMinutes: 30, version: before.version })
      .expect(200);

    const h = (await compose({ ...validBody(), extraRecipients: [] }).expect(201)).body as Body;
    const sentAt = Date.parse(h.sentAt as string);
    expect(Date.parse(h.ackDueAt as string) - sentAt).toBe(30 * 60_000);
    expect(h).toMatchObject({ overdue: false, overdueNotified: false });
    const overdueMails = () =>
      mailFor(p.emailOf('supervisor')).filter((m) => String(m.subject).startsWith('Not acknowledged: '));
    expect(overdueMails()).toHaveLength(0);

    // Judged by a clock 29 minutes on: not yet due, nothing is sent.
    await service.overdue(h.id as string, new Date(sentAt + 29 * 60_000));
    expect(
      (await request(http).get(`${p.base}/handovers/${h.id}`).set(p.as('viewer')).expect(200)).body,
    ).toMatchObject({ overdue: false, overdueNotified: false });

    // Thirty-one minutes on: the due time is moved back (as if the half hour had passed) and the job made due.
    await ds.query('UPDATE handovers SET ack_due_at = ? WHERE id = ?', [new Date(Date.now() - 60_000), h.id]);
    await ds.query('UPDATE jobs SET next_attempt_at = ? WHERE dedupe_key = ?', [
      new Date(),
      `handover-overdue:${h.id}`,
    ]);
    const [mail] = await until(overdueMails, (m) => m.length > 0);
    expect(mail.to).toEqual([p.emailOf('supervisor')]);
    expect(mail.cc).toEqual([p.emailOf('engineer')]);
    expect(String(mail.text)).toContain(`Invented incoming ${code} has not acknowledged the handover`);
    expect(String(mail.text)).toContain(`/projects/${p.projectId}/headings/${p.headingId}`);
    expect(flat(String(mail.text))).toContain(CAUTION);
    expect(await latestAudit(app, h.id as string)).toMatchObject({ action: 'overdue', actorId: null });

    // Flagged in the history and on the Board.
    const history = (
      await request(http).get(`${p.base}/headings/${p.headingId}/handovers`).set(p.as('viewer')).expect(200)
    ).body as Body[];
    expect(history[0]).toMatchObject({ id: h.id, overdue: true, overdueNotified: true });
    const board = (await request(http).get(p.base).set(p.as('viewer')).expect(200)).body as Body;
    expect((board.headings as Body[]).find((x) => x.id === p.headingId)!.lastHandover).toMatchObject({
      sentAt: h.sentAt,
      overdue: true,
    });

    // Run again (a retry, a second process): no second notice.
    await service.overdue(h.id as string);
    const notices = await ds.query<Array<{ n: string }>>(
      "SELECT COUNT(*) AS n FROM notices WHERE kind = 'handover-overdue' AND project_id = ?",
      [p.projectId],
    );
    expect(Number(notices[0].n)).toBe(1);

    // Acknowledged late: no longer overdue (the notice stays on record).
    const ack = await request(http)
      .post(`${p.base}/handovers/${h.id}/acknowledge`)
      .set({ Authorization: `Bearer ${incoming.token}` })
      .send({})
      .expect(200);
    expect(ack.body).toMatchObject({ overdue: false, overdueNotified: true });
  });
});

/** An SMTP server of this file's own, to take down and bring back (STARTTLS off, stack-notes §7). */
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
}

describe('Handovers with the mail server down (e2e, own SMTP server)', () => {
  const smtp = new OwnSmtp();
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  let incomingId: string;
  const code2 = `HD${String(Date.now() % 1e6)}`;

  beforeAll(async () => {
    await smtp.start();
    const port = smtp.port;
    await smtp.stop(); // down from the start; the same port comes back later
    smtp.port = port;
    app = await createTestApp((c) => ({
      ...c,
      mail: { ...c.mail, driver: 'smtp', host: '127.0.0.1', port },
      jobs: {
        ...c.jobs,
        workerEnabled: true,
        pollIntervalMs: 20,
        maxAttempts: 1000,
        backoffBaseMs: 20,
        backoffMaxMs: 150,
      },
    }));
    http = app.getHttpServer() as App;
    p = await makeProject(app, { code: code2 });
    const ds = app.get(DataSource);
    const user = await ds.getRepository(User).save({
      email: `incoming.${code2.toLowerCase()}@roundbook.test`,
      name: `Invented incoming ${code2}`,
      passwordHash: await hashPassword(TEST_PASSWORD),
    });
    await ds
      .getRepository(ProjectMember)
      .save({ projectId: p.projectId, userId: user.id, role: 'supervisor' });
    incomingId = user.id;
  });

  afterAll(async () => {
    await app.close();
    await smtp.stop();
  });

  it('saves the handover (201) while SMTP is down; the e-mail waits and is delivered exactly once when it is back', async () => {
    const ds = app.get(DataSource);
    const res = await request(http)
      .post(`${p.base}/handovers`)
      .set(p.as('supervisor'))
      .send({
        shiftDate: '2026-12-03',
        shift: 'night',
        incomingUserId: incomingId,
        headings: [{ headingId: p.headingId, cycleStage: 'drilling' }],
      })
      .expect(201);
    const id = res.body.id as string;
    expect(res.body).toMatchObject({ status: 'sent', emailStatus: 'queued' });

    // The PDF is made and the notice queued; its job keeps failing against the dead port and stays pending.
    const noticeId = (
      await until(
        () =>
          ds.query<Array<{ notice_id: string | null }>>('SELECT notice_id FROM handovers WHERE id = ?', [id]),
        (r) => r[0]?.notice_id != null,
      )
    )[0].notice_id as string;
    const waiting = await until(
      () =>
        ds.query<Array<{ state: string; attempts: number; last_error: string | null }>>(
          'SELECT state, attempts, last_error FROM jobs WHERE dedupe_key = ?',
          [`notice:${noticeId}`],
        ),
      (r) => r.length === 1 && r[0].attempts >= 3,
    );
    expect(['pending', 'running']).toContain(waiting[0].state);
    expect(waiting[0].last_error ?? '').toMatch(/ECONNREFUSED/);
    expect(smtp.mails).toHaveLength(0);
    expect(
      (await request(http).get(`${p.base}/handovers/${id}`).set(p.as('viewer')).expect(200)).body,
    ).toMatchObject({ emailStatus: 'queued', pdfReady: true });

    // Back: delivered once, with the PDF attached; the job is done and nothing is sent again.
    await smtp.start(smtp.port);
    await until(
      () =>
        ds.query<Array<{ state: string }>>('SELECT state FROM jobs WHERE dedupe_key = ?', [
          `notice:${noticeId}`,
        ]),
      (r) => r[0]?.state === 'done',
    );
    const mine = smtp.mails.filter((m) => (m.subject ?? '').includes(code2));
    expect(mine).toHaveLength(1);
    expect(mine[0].attachments.map((a) => a.contentType)).toEqual(['application/pdf']);
    expect(
      (await request(http).get(`${p.base}/handovers/${id}`).set(p.as('viewer')).expect(200)).body,
    ).toMatchObject({ emailStatus: 'sent' });
    await app.get(NoticesService).deliver(noticeId); // a rerun (a second process): already stamped sent
    expect(smtp.mails.filter((m) => (m.subject ?? '').includes(code2))).toHaveLength(1);
  });
});
