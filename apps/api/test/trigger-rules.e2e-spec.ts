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
});
