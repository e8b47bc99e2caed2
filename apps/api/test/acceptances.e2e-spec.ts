import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { AuditEvent } from '../src/modules/audit/audit-event.entity';
import { makeProject, saveBody, testJoint, TEST_PASSWORD, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const code = `AC${String(Date.now() % 1e6)}`;

// Drive 060 (the factory heading): joints dipping about 70° toward 150 strike along the drive and dip
// steeply, very unfavourable (Bieniawski 1989, Table 4.1F) — the adverse-orientation rule fires.
// Named S1 by the geologist (three joints alone are not clustered into a set), with no pooling of nearby
// rounds' joints (window 0), so each round's set is its own joints.
const s1 = { setLabel: 'S1', setOverride: true };
const along = ['150/70', '152/68', '148/72'].map((o) => testJoint(o, s1));
const steeper = ['150/82', '151/83', '149/81'].map((o) => testJoint(o, s1));

describe('Accepting a standing condition (e2e, real MariaDB): range, reason, re-raise, withdraw, audit', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  const classId = (c: string) => p.classes.find((x) => x.code === c)!.id as string;

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    p = await makeProject(app, {
      code,
      rules: [
        { watch: 'adverse-orientation', level: 'red', timeAllowedHours: 2 },
        { watch: 'q', comparison: '<', threshold: 20, level: 'amber', timeAllowedHours: 8 },
      ],
    });
  });
  afterAll(async () => {
    await app.close();
  });

  const open = async (faceChainage: number) =>
    (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage })
        .expect(201)
    ).body as Body;
  const save = async (r: Body, extra: Body) =>
    (
      await request(http)
        .put(`${p.base}/rounds/${r.id}`)
        .set(p.as('geologist'))
        .send(
          saveBody(r, {
            recommendedClassId: classId('C1'),
            nextRoundLength: 2,
            setParameters: { windowM: 0, count: null },
            ...extra,
          }),
        )
        .expect(200)
    ).body as Body;
  const review = async (id: string) =>
    (await request(http).get(`${p.base}/rounds/${id}/review`).set(p.as('engineer')).expect(200)).body as Body;
  const accept = (roundId: string, ruleId: string, body: Body, role: 'engineer' | 'geologist' = 'engineer') =>
    request(http).post(`${p.base}/rounds/${roundId}/triggers/${ruleId}/accept`).set(p.as(role)).send(body);

  it('accepts the red adverse set for a range with a written reason; later rounds re-raise when it changes or the range ends', async () => {
    const first = await save(await open(1003), { joints: along });
    const submitted = (
      await request(http)
        .post(`${p.base}/rounds/${first.id}/submit`)
        .set(p.as('geologist'))
        .send({ version: first.version })
        .expect(200)
    ).body as Body;
    expect(submitted.triggerLevel).toBe('red');
    const before = await review(first.id);
    const adverse = (before.rules as Body[]).find((r) => r.level === 'red')!;
    expect(adverse).toMatchObject({ summary: expect.stringMatching(/adverse/), canAccept: true });

    // Refusals: the geologist may not; a red rule needs a written reason; a range or a date is needed.
    await accept(
      first.id,
      adverse.ruleId,
      { fromChainage: 1000, toChainage: 1015, reason: 'Fine.' },
      'geologist',
    ).expect(403);
    const short = await accept(first.id, adverse.ruleId, {
      fromChainage: 1000,
      toChainage: 1015,
      reason: 'Fine.',
    }).expect(400);
    expect(short.body.fields.reason).toMatch(/written reason/);
    const nowhere = await accept(first.id, adverse.ruleId, {
      reason: 'Set along the drive is covered by the C1 spot bolting and the crown mesh.',
    }).expect(400);
    expect(nowhere.body.fields.toChainage).toMatch(/range or the date/);
    const past = await accept(first.id, adverse.ruleId, {
      until: '2020-01-01',
      reason: 'Set along the drive is covered by the C1 spot bolting and the crown mesh.',
    }).expect(400);
    expect(past.body.fields.until).toMatch(/passed/);

    const reason = 'Set along the drive is covered by the C1 spot bolting and the crown mesh.';
    const accepted = (
      await accept(first.id, adverse.ruleId, { fromChainage: 1000, toChainage: 1015, reason }).expect(200)
    ).body as Body;
    // Listed as accepted; it no longer raises the round's level (the amber Q rule still does).
    expect(accepted.acceptedRules).toEqual([
      expect.objectContaining({
        ruleId: adverse.ruleId,
        level: 'red',
        reason,
        fromChainage: 1000,
        toChainage: 1015,
        acceptedByName: `Test engineer ${code}`,
        acceptedHere: true,
      }),
    ]);
    expect((accepted.rules as Body[]).map((r) => r.level)).toEqual(['amber']);
    const round1 = (await request(http).get(`${p.base}/rounds/${first.id}`).set(p.as('viewer')).expect(200))
      .body as Body;
    expect(round1.triggerLevel).toBe('amber');
    await accept(first.id, adverse.ruleId, { fromChainage: 1000, toChainage: 1015, reason }).expect(409);

    // Audited with the snapshot of what fired.
    const audit = await app
      .get(DataSource)
      .getRepository(AuditEvent)
      .findOneByOrFail({ entityId: first.id, action: 'accept-condition' });
    expect(audit.after).toMatchObject({
      ruleId: adverse.ruleId,
      reason,
      triggerLevel: 'amber',
      snapshot: { watch: 'adverse-orientation', classId: classId('C1') },
    });
    expect((audit.after as Body).snapshot.adverse).toHaveLength(1);

    await request(http)
      .post(`${p.base}/rounds/${first.id}/confirm`)
      .set(p.as('engineer'))
      .send({
        version: accepted.version,
        classId: classId('C1'),
        roundLength: 2,
        reason: '',
        comments: '',
        password: TEST_PASSWORD,
      })
      .expect(200);

    // The next round, same set, inside the range: accepted, not raising the level.
    let next = await save(await open(1006), { joints: along });
    expect(next.triggerLevel).toBe('amber');
    expect(next.assessment.triggers.accepted.map((a: Body) => a.ruleId)).toEqual([adverse.ruleId]);
    // The same set dipping steeper: raised again, with why.
    next = await save(next, { joints: steeper });
    expect(next.triggerLevel).toBe('red');
    expect(next.assessment.triggers.lapsed[0].why).toMatch(/dips steeper/);
    // Back to the accepted dip but past the range: raised again.
    next = await save(next, { joints: along, faceChainage: 1018 });
    expect(next.triggerLevel).toBe('red');
    expect(next.assessment.triggers.lapsed[0].why).toMatch(/past|outside/);
    // Another class recommended inside the range: raised again.
    next = await save(next, { joints: along, faceChainage: 1006, recommendedClassId: classId('C2') });
    expect(next.triggerLevel).toBe('red');
    expect(next.assessment.triggers.lapsed[0].why).toMatch(/support class/);
  });

  it('withdrawing the acceptance raises the rule again on the round it was taken on (audited)', async () => {
    const rounds = (
      await request(http).get(`${p.base}/headings/${p.headingId}/rounds`).set(p.as('engineer')).expect(200)
    ).body as Body;
    const first = (rounds.items as Body[]).find((r) => r.roundNumber === 1)!;
    const seen = await review(first.id);
    const acceptanceId = seen.acceptedRules[0].acceptanceId as string;
    await request(http)
      .post(`${p.base}/rounds/${first.id}/acceptances/${acceptanceId}/withdraw`)
      .set(p.as('geologist'))
      .expect(403);
    const after = (
      await request(http)
        .post(`${p.base}/rounds/${first.id}/acceptances/${acceptanceId}/withdraw`)
        .set(p.as('engineer'))
        .expect(200)
    ).body as Body;
    expect(after.acceptedRules).toEqual([]);
    expect((after.rules as Body[]).map((r) => r.level)).toEqual(['red', 'amber']);
    const round1 = (await request(http).get(`${p.base}/rounds/${first.id}`).set(p.as('viewer')).expect(200))
      .body as Body;
    expect(round1.triggerLevel).toBe('red');
    const audit = await app
      .get(DataSource)
      .getRepository(AuditEvent)
      .findOneByOrFail({ entityId: first.id, action: 'withdraw-acceptance' });
    expect(audit.after).toMatchObject({ acceptanceId, triggerLevel: 'red' });
  });
});
