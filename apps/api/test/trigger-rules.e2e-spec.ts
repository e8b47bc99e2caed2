// Setup, trigger rules: each test file makes its own project (factories.ts), so it needs nothing from the demo
// seed. The demo's own rules and a preview over the demo's rounds are read in demo-numbers.e2e-spec.ts.
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { latestAudit, makeProject, saveBody, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const code = `TR${String(Date.now() % 1e6)}`;

describe('Setup: trigger rules (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;

  const lastAudit = (entityId: string) => latestAudit(app, entityId);

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    p = await makeProject(app, {
      code,
      rules: [
        { watch: 'q', comparison: '<', threshold: 1, level: 'amber' },
        { watch: 'q', comparison: '<', threshold: 0.1, level: 'red' },
      ],
    });
  });

  afterAll(async () => {
    await app.close();
  });

  it('lists the rules red first, each with its summary, to every member', async () => {
    const rules = (await request(http).get(`${p.base}/trigger-rules`).set(p.as('viewer')).expect(200))
      .body as Body[];
    expect(rules.map((r) => r.summary)).toEqual(['Q < 0.1 → red', 'Q < 1 → amber']);
  });

  it('lets engineers and admins edit rules, checks threshold against what is watched, and audits', async () => {
    const base = p.base;
    const as = p.as;
    await request(http).post(`${base}/trigger-rules`).set(as('geologist')).send({}).expect(403);
    const noThreshold = await request(http)
      .post(`${base}/trigger-rules`)
      .set(as('engineer'))
      .send({
        watch: 'rmr89',
        comparison: '<',
        level: 'red',
        action: 'Stop and call the designer.',
        ownerRole: 'engineer',
        timeAllowedHours: 1,
      })
      .expect(400);
    expect(noThreshold.body.fields).toEqual({ threshold: 'Give the threshold.' });
    const flagWithComparison = await request(http)
      .post(`${base}/trigger-rules`)
      .set(as('engineer'))
      .send({
        watch: 'open-red-hazard',
        comparison: '>',
        threshold: 1,
        level: 'red',
        action: 'Make it safe.',
        ownerRole: 'supervisor',
        timeAllowedHours: 1,
      })
      .expect(400);
    expect(Object.keys(flagWithComparison.body.fields as object).sort()).toEqual(['comparison', 'threshold']);

    const created = await request(http)
      .post(`${base}/trigger-rules`)
      .set(as('engineer'))
      .send({
        watch: 'rmr89',
        comparison: '<',
        threshold: 20,
        level: 'red',
        action: 'Stop and call the designer.',
        ownerRole: 'engineer',
        timeAllowedHours: 1,
      })
      .expect(201);
    const rule = created.body as Body;
    expect(rule.summary).toBe('RMR89 < 20 → red');
    const changed = await request(http)
      .patch(`${base}/trigger-rules/${rule.id}`)
      .set(as('admin'))
      .send({ threshold: 18, version: 1 })
      .expect(200);
    expect(changed.body).toMatchObject({ threshold: 18, version: 2 });
    expect(await lastAudit(rule.id as string)).toMatchObject({
      action: 'update',
      before: { threshold: 20 },
      after: { threshold: 18 },
    });
    await request(http).delete(`${base}/trigger-rules/${rule.id}`).set(as('engineer')).expect(204);
    expect(await lastAudit(rule.id as string)).toMatchObject({ action: 'delete' });
  });

  it('previews a rule on the project’s own rounds without saving it; the open-red-hazard rule reads the heading’s register', async () => {
    // Two rounds with Q: 60/4 × 1.5/2 × 1/1 = 11.25 and 10/12 × 1/8 × 0.66/2.5 ≈ 0.0275 (Barton et al. 1974, Q = RQD/Jn × Jr/Ja × Jw/SRF) [computed here].
    const qInputs = [
      { rqd: 60, jn: 4, jr: 1.5, ja: 2, jw: 1, srf: 1 },
      { rqd: 10, jn: 12, jr: 1, ja: 8, jw: 0.66, srf: 2.5 },
    ];
    for (const [i, qInput] of qInputs.entries()) {
      const r = (
        await request(http)
          .post(`${p.base}/headings/${p.headingId}/rounds`)
          .set(p.as('geologist'))
          .send({ stage: 'full-face', faceChainage: 1003 + 3 * i })
          .expect(201)
      ).body as Body;
      await request(http)
        .put(`${p.base}/rounds/${r.id}`)
        .set(p.as('geologist'))
        .send(saveBody(r, { qInput }))
        .expect(200);
    }
    const q = await request(http)
      .post(`${p.base}/trigger-rules/preview`)
      .set(p.as('engineer'))
      .send({
        watch: 'q',
        comparison: '<',
        threshold: 1,
        level: 'amber',
        action: 'Review.',
        ownerRole: 'engineer',
        timeAllowedHours: 4,
      })
      .expect(200);
    expect(q.body.evaluatedRounds).toBe(2);
    expect(q.body.matches).toEqual([
      expect.objectContaining({ headingCode: 'TH', roundNumber: 2, value: expect.closeTo(0.0275, 4) }),
    ]);
    const hazard = await request(http)
      .post(`${p.base}/trigger-rules/preview`)
      .set(p.as('admin'))
      .send({
        watch: 'open-red-hazard',
        level: 'red',
        action: 'Stop.',
        ownerRole: 'supervisor',
        timeAllowedHours: 1,
      })
      .expect(200);
    // Both rounds were assessed with the heading's register, which holds no hazard: evaluated, clear.
    expect(hazard.body).toMatchObject({ evaluatedRounds: 2, matches: [], notEvaluated: null });
    await request(http).post(`${p.base}/trigger-rules/preview`).set(p.as('geologist')).send({}).expect(403);
    const rules = (await request(http).get(`${p.base}/trigger-rules`).set(p.as('admin')).expect(200))
      .body as Body[];
    expect(rules.some((r) => r.action === 'Review.')).toBe(false); // nothing saved
  });

  it('keeps a rule that fires on a change from the last round, refuses the combinations it cannot have, and fires it on the round where Q falls (issue 11 item 3)', async () => {
    // A project of its own, so its rounds see no other rule.
    const c = await makeProject(app, { code: `${code}C` });
    const fall = {
      watch: 'q',
      comparison: '<',
      threshold: -50,
      fires: 'change',
      level: 'amber',
      action: 'Ask the engineer to look at the fall in Q.',
      ownerRole: 'engineer',
      timeAllowedHours: 4,
    };
    const send = (body: Body) =>
      request(http).post(`${c.base}/trigger-rules`).set(c.as('engineer')).send(body);
    // A fall is given as a negative change; '=' is no fall or rise; the class-change rule already compares.
    expect((await send({ ...fall, threshold: 50 }).expect(400)).body.fields).toEqual({
      threshold: 'A fall is a change of 0 or less: give it with a minus sign, e.g. −50.',
    });
    expect(Object.keys((await send({ ...fall, comparison: '=' }).expect(400)).body.fields as object)).toEqual(
      ['comparison'],
    );
    expect(
      (await send({ ...fall, watch: 'support-class-change', comparison: null, threshold: null }).expect(400))
        .body.fields,
    ).toEqual({
      fires: 'This rule already compares the class with the last round’s: it fires on the value only.',
    });
    expect((await send({ ...fall, fires: 'sometimes' }).expect(400)).body.message).toMatch(/fires/);

    const created = (await send({ ...fall, threshold: -80 }).expect(201)).body as Body;
    expect(created).toMatchObject({
      fires: 'change',
      summary: 'Q falls by more than 80 % from the last round → amber',
    });
    const edited = (
      await request(http)
        .patch(`${c.base}/trigger-rules/${created.id}`)
        .set(c.as('admin'))
        .send({ threshold: -50, version: created.version })
        .expect(200)
    ).body as Body;
    expect(edited).toMatchObject({
      fires: 'change',
      summary: 'Q falls by more than 50 % from the last round → amber',
    });
    expect(await lastAudit(created.id as string)).toMatchObject({
      action: 'update',
      before: { threshold: -80 },
      after: { threshold: -50 },
    });
    // Switching it back to the value with a negative threshold is refused: Q is 0.001 to 1000 there.
    await request(http)
      .patch(`${c.base}/trigger-rules/${created.id}`)
      .set(c.as('admin'))
      .send({ fires: 'value', version: edited.version })
      .expect(400);
    // A rule made without the choice fires on the value, as every rule did before.
    const plain = (await send({ ...fall, fires: undefined, threshold: 1 }).expect(201)).body as Body;
    expect(plain).toMatchObject({ fires: 'value', summary: 'Q < 1 → amber' });
    await request(http).delete(`${c.base}/trigger-rules/${plain.id}`).set(c.as('admin')).expect(204);

    // Three rounds: Q 11.25, then 0.0275 (a fall of 99.7 % at the printed 11 → 0.028), then 0.0275 again
    // (Barton et al. 1974, Q = RQD/Jn × Jr/Ja × Jw/SRF) [computed here].
    const qInputs = [
      { rqd: 60, jn: 4, jr: 1.5, ja: 2, jw: 1, srf: 1 },
      { rqd: 10, jn: 12, jr: 1, ja: 8, jw: 0.66, srf: 2.5 },
      { rqd: 10, jn: 12, jr: 1, ja: 8, jw: 0.66, srf: 2.5 },
    ];
    const saved: Body[] = [];
    for (const [i, qInput] of qInputs.entries()) {
      const r = (
        await request(http)
          .post(`${c.base}/headings/${c.headingId}/rounds`)
          .set(c.as('geologist'))
          .send({ stage: 'full-face', faceChainage: 1003 + 3 * i })
          .expect(201)
      ).body as Body;
      saved.push(
        (
          await request(http)
            .put(`${c.base}/rounds/${r.id}`)
            .set(c.as('geologist'))
            .send(saveBody(r, { qInput }))
            .expect(200)
        ).body as Body,
      );
    }
    // The first round of the stage has nothing to compare with: clear, so green.
    expect(saved[0]).toMatchObject({ triggerLevel: 'green', triggerFirings: [] });
    expect(saved[1].triggerLevel).toBe('amber');
    expect(saved[1].triggerFirings).toEqual([
      expect.objectContaining({
        summary: 'Q falls by more than 50 % from the last round → amber',
        detail:
          'Q fell by 99.7 % from the last round (11 → 0.028); the rule fires when it falls by more than 50 %',
      }),
    ]);
    // The same low Q again is no fall: the change rule is clear (a rule of the value would fire again).
    expect(saved[2]).toMatchObject({ triggerLevel: 'green', triggerFirings: [] });

    // The try-out finds the same one round.
    const tried = (
      await request(http).post(`${c.base}/trigger-rules/preview`).set(c.as('engineer')).send(fall).expect(200)
    ).body as Body;
    expect(tried).toMatchObject({ evaluatedRounds: 3, notEvaluated: null });
    expect(tried.matches).toEqual([expect.objectContaining({ roundNumber: 2, value: -99.7 })]);
  });
});
