import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { APP_CONFIG, type AppConfig } from '../src/config/app-config';
import { AuditEvent } from '../src/modules/audit/audit-event.entity';
import { ProjectMember } from '../src/modules/projects/project-member.entity';
import { Round } from '../src/modules/rounds/round.entity';
import { User } from '../src/modules/users/user.entity';
import { makeProject, TEST_PASSWORD, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const code = `RV${String(Date.now() % 1e6)}`;
const CAUTION =
  'Roundbook computes and records; the responsible engineer decides under the project’s design and local regulations.';

/** Waits for a condition with a bounded loop of short pauses (no fixed sleeps). */
async function until<T>(probe: () => Promise<T> | T, ok: (v: T) => boolean, ms = 15_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await probe();
    if (ok(v)) return v;
    if (Date.now() > end) throw new Error(`condition not reached within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

const ground = {
  units: [{ name: 'Invented banded gneiss', sharePercent: 100, weatheringGrade: 'WII', strengthGrade: 'R4' }],
  pointLoadIs50: 4,
  pointLoadFactor: 22,
  inflowLpm: 3,
  inflowLengthM: 3,
  waterDescription: '',
  overbreakM3: 0.5,
  notes: '',
};
// Q = 60/4 × 1.5/2 × 1/1 = 11.25 (Barton et al. 1974) [computed here]: C1 (Q ≥ 10); the amber rule Q < 20 fires.
const fairQ = { rqd: 60, jn: 4, jr: 1.5, ja: 2, jw: 1, srf: 1 };
// Q = 10/9 × 1/4 × 1/2.5 ≈ 0.11 [computed here]: C3 (0.1–1); the red rule Q < 1 fires.
const poorQ = { rqd: 10, jn: 9, jr: 1, ja: 4, jw: 1, srf: 2.5 };

describe('Review: confirm, return, correct, the queue and the notices (e2e, real MariaDB, SMTP fake)', () => {
  let app: INestApplication;
  let http: App;
  let ds: DataSource;
  let p: TestProject;
  const classId = (c: string) => p.classes.find((x) => x.code === c)!.id as string;

  /** What the SMTP fake received for an address. */
  const mailFor = (to: string): Body[] => {
    const dir = app.get<AppConfig>(APP_CONFIG).mail.localInboxDir!;
    return readdirSync(dir)
      .filter((f) => f.endsWith('.json'))
      .map((f) => JSON.parse(readFileSync(path.join(dir, f), 'utf8')) as Body)
      .filter((m) => (m.to as string[]).includes(to));
  };
  const mailWith = (to: string, subject: RegExp) =>
    until(
      () => mailFor(to).filter((m) => subject.test(String(m.subject))),
      (m) => m.length > 0,
    );

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    ds = app.get(DataSource);
    p = await makeProject(app, {
      code,
      rules: [
        { watch: 'q', comparison: '<', threshold: 20, level: 'amber', timeAllowedHours: 4 },
        { watch: 'q', comparison: '<', threshold: 1, level: 'red', timeAllowedHours: 2 },
        { watch: 'support-class-change', level: 'amber', timeAllowedHours: 8 },
      ],
    });
  });

  afterAll(async () => {
    await app.close();
  });

  /** Opens a round, saves its record with the given Q and class, and (unless told not to) submits it. */
  const mapRound = async (faceChainage: number, q: Body, cls: string, submit = true): Promise<Body> => {
    const opened = (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage })
        .expect(201)
    ).body as Body;
    const saved = await saveRound(opened, q, cls);
    if (!submit) return saved;
    return (
      await request(http)
        .post(`${p.base}/rounds/${saved.id}/submit`)
        .set(p.as('geologist'))
        .send({ version: saved.version })
        .expect(200)
    ).body as Body;
  };
  const saveRound = async (r: Body, q: Body, cls: string, extra: Body = {}, status = 200): Promise<Body> =>
    (
      await request(http)
        .put(`${p.base}/rounds/${r.id}`)
        .set(p.as('geologist'))
        .send({
          version: r.version,
          faceChainage: r.faceChainage,
          previousChainage: r.previousChainage,
          roundLength: r.roundLength,
          shiftDate: r.shiftDate,
          shift: r.shift,
          distantParts: '',
          ground,
          joints: [],
          qInput: q,
          rmrInput: null,
          gsiObserved: null,
          recommendedClassId: classId(cls),
          nextRoundLength: 2,
          recommendationReason: '',
          ...extra,
        })
        .expect(status)
    ).body as Body;
  const getRound = async (id: string, role: 'engineer' | 'geologist' = 'engineer') =>
    (await request(http).get(`${p.base}/rounds/${id}`).set(p.as(role)).expect(200)).body as Body;
  const getReview = async (id: string, role: 'engineer' | 'geologist' | 'viewer' = 'engineer') =>
    (await request(http).get(`${p.base}/rounds/${id}/review`).set(p.as(role)).expect(200)).body as Body;
  const confirm = (r: Body, body: Body, role: 'engineer' | 'geologist' = 'engineer') =>
    request(http)
      .post(`${p.base}/rounds/${r.id}/confirm`)
      .set(p.as(role))
      .send({ version: r.version, comments: '', reason: '', password: TEST_PASSWORD, ...body });

  let first: Body;

  it('the whole cycle: submit → return with comments → resubmit → confirm another class with a reason and the password', async () => {
    const submitted = await mapRound(1003, fairQ, 'C1');
    expect(submitted).toMatchObject({ status: 'submitted', revision: 1, triggerLevel: 'amber' });
    // The project's engineers are told.
    const toConfirm = await mailWith(p.emailOf('engineer'), /^To confirm: TH round 1/);
    expect(toConfirm[0].subject).toContain(`Invented test project ${code}`);
    expect(toConfirm[0].text).toContain(`/projects/${p.projectId}/rounds/${submitted.id}`);
    expect(toConfirm[0].text).toContain(CAUTION);
    expect(toConfirm[0].html).toContain('Review the round');

    const review = await getReview(submitted.id);
    expect(review).toMatchObject({
      status: 'submitted',
      canConfirm: { allowed: true },
      canReturn: { allowed: true },
      caution: CAUTION,
    });
    expect((await getReview(submitted.id, 'geologist')).canConfirm).toMatchObject({
      allowed: false,
      reason: expect.stringMatching(/Only an engineer/),
    });

    // Returned with comments per section: a draft of a new revision; the comments stay until resolved.
    const returned = (
      await request(http)
        .post(`${p.base}/rounds/${submitted.id}/return`)
        .set(p.as('engineer'))
        .send({
          version: submitted.version,
          comments: [
            { section: 'ground', text: 'Say where the water comes from.' },
            { section: 'ratings', text: 'Check Jn: two sets and random?' },
          ],
        })
        .expect(200)
    ).body as Body;
    expect(returned).toMatchObject({ status: 'returned', revision: 2 });
    const seen = await getReview(submitted.id, 'geologist');
    expect(seen.openComments.map((c: Body) => [c.section, c.revision])).toEqual([
      ['ground', 1],
      ['ratings', 1],
    ]);
    const back = await mailWith(p.emailOf('geologist'), /^Returned: TH round 1/);
    expect(back[0].to).toEqual([p.emailOf('geologist')]);
    expect(back[0].text).toContain('Ground: Say where the water comes from.');
    expect(back[0].text).toContain(CAUTION);
    expect(back[0].text).toContain(`/projects/${p.projectId}/rounds/${submitted.id}`);

    // The geologist resolves one comment, edits and resubmits: the other stays open until resolved.
    const resolved = (
      await request(http)
        .post(`${p.base}/rounds/${submitted.id}/review/comments/${seen.openComments[0].id}/resolve`)
        .set(p.as('geologist'))
        .expect(200)
    ).body as Body;
    expect(resolved.openComments).toHaveLength(1);
    const edited = await saveRound(await getRound(submitted.id, 'geologist'), fairQ, 'C1', {
      ground: { ...ground, waterDescription: 'Drips from the crown joint' },
    });
    const resubmitted = (
      await request(http)
        .post(`${p.base}/rounds/${submitted.id}/submit`)
        .set(p.as('geologist'))
        .send({ version: edited.version })
        .expect(200)
    ).body as Body;
    expect(resubmitted).toMatchObject({ status: 'submitted', revision: 2 });
    // The next review shows the last return's comments: which were resolved (by whom) and which are open.
    const next = await getReview(submitted.id);
    expect(next.openComments.map((c: Body) => c.section)).toEqual(['ratings']);
    expect(next.returnComments.map((c: Body) => [c.section, c.resolvedByName])).toEqual([
      ['ground', `Test geologist ${code}`],
      ['ratings', null],
    ]);
    expect(next.returnComments[0].resolvedAt).toEqual(expect.any(String));

    // Refusals: a geologist cannot confirm; a class other than the recommendation needs a reason; the
    // sign-off needs the engineer's own password.
    await confirm(resubmitted, { classId: classId('C2'), roundLength: 2 }, 'geologist').expect(403);
    const noReason = await confirm(resubmitted, { classId: classId('C2'), roundLength: 2 }).expect(400);
    expect(noReason.body.fields.reason).toMatch(/C2 is not the recommended class/);
    const tooLong = await confirm(resubmitted, { classId: classId('C1'), roundLength: 4.5 }).expect(400);
    expect(tooLong.body.fields.reason).toMatch(/up to 4 m/);
    const wrong = await confirm(resubmitted, {
      classId: classId('C2'),
      roundLength: 2,
      reason: 'Crown joints open on the left side',
      password: 'not-the-password',
    }).expect(403);
    expect(wrong.body.fields.password).toBeDefined();
    expect((await getRound(submitted.id)).status).toBe('submitted');

    const confirmed = (
      await confirm(resubmitted, {
        classId: classId('C2'),
        roundLength: 2,
        reason: 'Crown joints open on the left side',
        comments: 'Bolt the left shoulder first.',
      }).expect(200)
    ).body as Body;
    expect(confirmed).toMatchObject({
      status: 'confirmed',
      revision: 2,
      recommendedClassId: classId('C1'),
      confirmedClassId: classId('C2'),
      confirmedRoundLength: 2,
      confirmation: {
        decision: 'confirm',
        classCode: 'C2',
        reason: 'Crown joints open on the left side',
        comments: 'Bolt the left shoulder first.',
        signedByName: `Test engineer ${code}`,
        signedRole: 'engineer',
        signedAt: expect.any(String),
      },
      canConfirm: { allowed: false },
    });
    // The heading's rounds list shows the confirmed class beside the recommended one.
    const listed = (
      await request(http).get(`${p.base}/headings/${p.headingId}/rounds`).set(p.as('viewer')).expect(200)
    ).body as Body;
    expect((listed.items as Body[]).find((i) => i.id === submitted.id)).toMatchObject({
      recommendedClassCode: 'C1',
      confirmedClassCode: 'C2',
    });
    expect(confirmed.decisions.map((d: Body) => d.decision)).toEqual(['return', 'confirm']);
    // The Board's heading card shows the confirmed class (not the recommended one).
    const projects = (await request(http).get('/api/projects').set(p.as('viewer')).expect(200))
      .body as Body[];
    const card = (projects.find((x) => x.id === p.projectId)!.headings as Body[]).find(
      (h) => h.id === p.headingId,
    )!;
    expect(card.confirmedClass).toMatchObject({ code: 'C2', roundNumber: 1, stage: 'full-face' });

    // Locked: the geologist's save is refused.
    const locked = await saveRound(await getRound(submitted.id, 'geologist'), fairQ, 'C1', {}, 409);
    expect(locked.message).toMatch(/confirmed/);

    // The geologist is told the class differs from the recommendation.
    const other = await mailWith(p.emailOf('geologist'), /^Confirmed with another class: TH round 1/);
    expect(other[0].text).toContain('Confirmed class: C2');
    expect(other[0].text).toContain('recommended: C1');
    expect(other[0].text).toContain(CAUTION);

    // Every revision stays readable, in order.
    const revisions = (
      await request(http).get(`${p.base}/rounds/${submitted.id}/revisions`).set(p.as('viewer')).expect(200)
    ).body as Body[];
    expect(revisions.map((r) => [r.event, r.revision, r.status])).toEqual([
      ['submit', 1, 'submitted'],
      ['return', 1, 'returned'],
      ['submit', 2, 'submitted'],
      ['confirm', 2, 'confirmed'],
    ]);
    expect(revisions[3].record.confirmedClassId).toBe(classId('C2'));
    expect(revisions[2].record.ground.waterDescription).toBe('Drips from the crown joint');
    expect(revisions[0].record.ground.waterDescription).toBe('');

    // Every decision is in the audit trail.
    const audit = await ds
      .getRepository(AuditEvent)
      .find({ where: { entityId: submitted.id }, order: { createdAt: 'ASC' } });
    const actions = audit.map((a) => a.action);
    expect(actions.filter((a) => ['submit', 'return', 'confirm', 'resolve-comment'].includes(a))).toEqual([
      'submit',
      'return',
      'resolve-comment',
      'submit',
      'confirm',
    ]);
    expect(audit.find((a) => a.action === 'confirm')!.after).toMatchObject({
      confirmedClassId: classId('C2'),
      reason: 'Crown joints open on the left side',
      signedRole: 'engineer',
    });
    first = confirmed;
  });

  it('the next round’s class-change rule compares with the confirmed class', async () => {
    // Round 2 recommends C1, as round 1 did; round 1 was confirmed as C2, so the class changes.
    const second = await mapRound(1006, fairQ, 'C1', false);
    expect(second.triggerFirings.map((f: Body) => f.summary).join(' | ')).toMatch(/Support class differs/);
    expect(first.confirmedClassId).toBe(classId('C2'));
  });

  it('refuses a confirm of a draft (409) and the mapper who became an engineer (separation of duties)', async () => {
    const draft = await mapRound(1009, fairQ, 'C1', false);
    await confirm(draft, { classId: classId('C1'), roundLength: 2 }).expect(409);

    const own = await mapRound(1012, fairQ, 'C1');
    const geologist = await ds.getRepository(User).findOneByOrFail({ email: p.emailOf('geologist') });
    const members = ds.getRepository(ProjectMember);
    await members.update({ projectId: p.projectId, userId: geologist.id }, { role: 'engineer' });
    try {
      const review = await getReview(own.id, 'geologist');
      expect(review.canConfirm).toMatchObject({
        allowed: false,
        reason: expect.stringMatching(/another engineer/),
      });
      const res = await confirm(own, { classId: classId('C1'), roundLength: 2 }, 'geologist').expect(403);
      expect(res.body.message).toMatch(/separation of duties/);
      // With the project's setting turned off (by its admin), the same person may confirm.
      const project = (await request(http).get(p.base).set(p.as('admin')).expect(200)).body as Body;
      expect(project.separationOfDuties).toBe(true); // on by default
      await request(http)
        .patch(p.base)
        .set(p.as('admin'))
        .send({ version: project.version, separationOfDuties: false })
        .expect(200);
      expect((await getReview(own.id, 'geologist')).canConfirm.allowed).toBe(true);
      const back = (await request(http).get(p.base).set(p.as('admin')).expect(200)).body as Body;
      await request(http)
        .patch(p.base)
        .set(p.as('admin'))
        .send({ version: back.version, separationOfDuties: true })
        .expect(200);
    } finally {
      await members.update({ projectId: p.projectId, userId: geologist.id }, { role: 'geologist' });
    }
    // The project's own engineer may.
    await confirm(own, { classId: classId('C1'), roundLength: 2 }).expect(200);
  });

  it('a correction after confirmation needs a reason and opens a new revision that is reviewed again', async () => {
    const r = await getRound(first.roundId);
    await request(http)
      .post(`${p.base}/rounds/${r.id}/correct`)
      .set(p.as('engineer'))
      .send({ version: r.version, reason: '' })
      .expect(400);
    const corrected = (
      await request(http)
        .post(`${p.base}/rounds/${r.id}/correct`)
        .set(p.as('engineer'))
        .send({ version: r.version, reason: 'Chainage was surveyed again' })
        .expect(200)
    ).body as Body;
    expect(corrected).toMatchObject({ status: 'draft', revision: 3, confirmedClassId: null });
    expect(corrected.decisions.map((d: Body) => d.decision)).toEqual(['return', 'confirm', 'correct']);
    expect(corrected.decisions[2].reason).toBe('Chainage was surveyed again');
    await request(http)
      .post(`${p.base}/rounds/${r.id}/correct`)
      .set(p.as('viewer'))
      .send({ version: corrected.version, reason: 'Viewers cannot' })
      .expect(403);
  });

  it('the queue: red first, then the oldest, with each fired rule’s time left', async () => {
    const older = await mapRound(1015, fairQ, 'C1');
    const red = await mapRound(1018, poorQ, 'C3');
    const newer = await mapRound(1021, fairQ, 'C1');
    expect(red.triggerLevel).toBe('red');
    // The older round has waited five hours: its four-hour rule is overdue.
    await ds
      .getRepository(Round)
      .update({ id: older.id }, { submittedAt: new Date(Date.now() - 5 * 3_600_000) });

    await request(http)
      .get('/api/review/queue')
      .set(p.as('geologist'))
      .expect(200, { items: [], caution: CAUTION });
    // An engineer with nothing waiting on that heading: an empty queue, not an error.
    await request(http)
      .get('/api/review/queue?headingId=00000000-0000-4000-8000-000000000000')
      .set(p.as('engineer'))
      .expect(200, { items: [], caution: CAUTION });
    await request(http).get('/api/review/queue?headingId=nope').set(p.as('engineer')).expect(400);
    const queue = (
      await request(http).get(`/api/review/queue?headingId=${p.headingId}`).set(p.as('engineer')).expect(200)
    ).body as Body;
    const ids = queue.items.map((i: Body) => i.roundId);
    expect(ids.indexOf(red.id)).toBe(0);
    expect(ids.indexOf(older.id)).toBeLessThan(ids.indexOf(newer.id));
    const item = (id: string) => queue.items.find((i: Body) => i.roundId === id) as Body;
    expect(item(red.id)).toMatchObject({
      projectCode: code,
      headingCode: 'TH',
      stage: 'full-face',
      chainageText: '1+018.0',
      geologistName: `Test geologist ${code}`,
      triggerLevel: 'red',
    });
    const redRule = item(red.id).rules.find((r: Body) => r.level === 'red');
    expect(redRule).toMatchObject({ timeAllowedHours: 2, overdue: false });
    expect(redRule.minutesLeft).toBeGreaterThan(110);
    const overdue = item(older.id).rules.find((r: Body) => r.timeAllowedHours === 4);
    expect(overdue.overdue).toBe(true);
    expect(overdue.minutesLeft).toBeLessThan(-55);
    expect(item(older.id).minutesWaiting).toBeGreaterThanOrEqual(299);
    expect(queue.caution).toBe(CAUTION);
  });

  it('a fired rule is acknowledged by the role that owns it, once per revision, and is then not overdue', async () => {
    const r = await mapRound(1024, fairQ, 'C1');
    await ds.getRepository(Round).update({ id: r.id }, { submittedAt: new Date(Date.now() - 5 * 3_600_000) });
    const before = await getReview(r.id);
    const amber = before.rules.find((x: Body) => x.timeAllowedHours === 4);
    expect(amber).toMatchObject({ overdue: true, acknowledgement: null, canAcknowledge: true });
    expect((await getReview(r.id, 'geologist')).rules[0].canAcknowledge).toBe(false);

    const url = `${p.base}/rounds/${r.id}/triggers/${amber.ruleId}/acknowledge`;
    await request(http)
      .post(url)
      .set(p.as('geologist'))
      .send({ actionTaken: 'Told the engineer', note: '' })
      .expect(403);
    await request(http).post(url).set(p.as('engineer')).send({ actionTaken: '', note: '' }).expect(400);
    const after = (
      await request(http)
        .post(url)
        .set(p.as('engineer'))
        .send({ actionTaken: 'Looked at the face; bolting pattern kept', note: 'Re-rate at the next round' })
        .expect(200)
    ).body as Body;
    expect(after.rules.find((x: Body) => x.ruleId === amber.ruleId)).toMatchObject({
      overdue: false,
      canAcknowledge: false,
      acknowledgement: {
        actionTaken: 'Looked at the face; bolting pattern kept',
        note: 'Re-rate at the next round',
        byName: `Test engineer ${code}`,
        role: 'engineer',
      },
    });
    await request(http).post(url).set(p.as('engineer')).send({ actionTaken: 'Again', note: '' }).expect(409);
    const queue = (
      await request(http).get(`/api/review/queue?headingId=${p.headingId}`).set(p.as('engineer')).expect(200)
    ).body as Body;
    const clock = queue.items
      .find((i: Body) => i.roundId === r.id)
      .rules.find((x: Body) => x.ruleId === amber.ruleId);
    expect(clock).toMatchObject({ overdue: false, acknowledgedAt: expect.any(String) });
    const audit = await ds
      .getRepository(AuditEvent)
      .findOneByOrFail({ entityId: r.id, action: 'acknowledge-trigger' });
    expect(audit.after).toMatchObject({ ruleId: amber.ruleId, level: 'amber' });
  });

  it('tells the engineers when a fired rule runs past its time unacknowledged (red first in the subject)', async () => {
    const main = p;
    p = await makeProject(app, {
      code: `${code}B`,
      rules: [{ watch: 'q', comparison: '<', threshold: 20, level: 'red', timeAllowedHours: 0 }],
    });
    try {
      const r = await mapRound(1003, fairQ, 'C1');
      expect(r.triggerLevel).toBe('red');
      const submitted = await mailWith(p.emailOf('engineer'), /^Red — To confirm: TH round 1/);
      expect(submitted[0].text).toContain('Red trigger level.');
      // No time allowed: the check runs at once, finds no acknowledgement and tells the engineers.
      const overdue = await mailWith(p.emailOf('engineer'), /^Red — Overdue: TH round 1/);
      expect(overdue).toHaveLength(1);
      expect(overdue[0].text).toContain('Rule: Q');
      expect(overdue[0].text).toContain(`/projects/${p.projectId}/rounds/${r.id}`);
      expect(overdue[0].text).toContain(CAUTION);
      expect(overdue[0].html).toContain('Open the round');
    } finally {
      p = main;
    }
  });
  it('the review says what changed since the previous round of the stage, from the frozen assessments', async () => {
    const main = p;
    p = await makeProject(app, { code: `${code}C`, rules: [] });
    try {
      const one = await mapRound(1003, fairQ, 'C1');
      const firstReview = await getReview(one.id);
      expect(firstReview.sincePrevious).toMatchObject({
        previousRoundId: null,
        changes: [],
        note: expect.stringMatching(/first round/),
      });
      // A draft round is not compared (nothing frozen yet).
      const two = await mapRound(1006, poorQ, 'C3', false);
      expect((await getReview(two.id)).sincePrevious).toBeNull();
      await request(http)
        .post(`${p.base}/rounds/${two.id}/submit`)
        .set(p.as('geologist'))
        .send({ version: two.version })
        .expect(200);
      const since = (await getReview(two.id, 'viewer')).sincePrevious as Body;
      expect(since).toMatchObject({
        previousRoundId: one.id,
        previousRoundNumber: 1,
        previousRevision: 1,
        note: '',
      });
      const of = (aspect: string) => (since.changes as Body[]).find((c) => c.aspect === aspect);
      expect(of('class')).toMatchObject({
        trend: 'changed',
        before: 'C1 (recommended)',
        after: 'C3 (recommended)',
      });
      // Q 11.25 → 0.11 (the comments beside fairQ and poorQ).
      expect(of('q')).toMatchObject({ trend: 'worse', before: '11', after: '0.11' });
      expect(of('water')).toMatchObject({ trend: 'same' });
    } finally {
      p = main;
    }
  });
});
