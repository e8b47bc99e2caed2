// The hazard register of a heading (issue 15 item 1), on a project of this file's own (factories.ts).
import { randomUUID } from 'node:crypto';
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { HazardsService } from '../src/modules/hazards/hazards.service';
import { latestAudit, makeProject, saveBody, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const code = `HZ${String(Date.now() % 1e6)}`;

describe('Hazards: the register of a heading (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  let hazards: string;
  let round: Body;

  const raise = (body: Body, role: Parameters<TestProject['as']>[0] = 'geologist') =>
    request(http).post(hazards).set(p.as(role)).send(body);

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    p = await makeProject(app, {
      code,
      rules: [
        {
          watch: 'open-red-hazard',
          level: 'red',
          action: 'Keep the crew out of the marked range until it is made safe.',
          ownerRole: 'supervisor',
          timeAllowedHours: 1,
        },
      ],
    });
    hazards = `${p.base}/headings/${p.headingId}/hazards`;
    // The heading starts at 1000 and its face is at 1006 after two rounds.
    for (const face of [1003, 1006]) {
      round = (
        await request(http)
          .post(`${p.base}/headings/${p.headingId}/rounds`)
          .set(p.as('geologist'))
          .send({ stage: 'full-face', faceChainage: face })
          .expect(201)
      ).body as Body;
    }
  });

  afterAll(async () => {
    await app.close();
  });

  it('raises hazards directly and from a round, lists open ones red first then by chainage, audits the raise', async () => {
    const amber = await raise({
      kind: 'water',
      fromChainage: 1004,
      toChainage: 1001,
      level: 'amber',
      description: 'Dripping joints in the left wall, invented test data.',
    }).expect(201);
    expect(amber.body).toMatchObject({
      kind: 'water',
      fromChainage: 1001, // the ends put in the drive order
      toChainage: 1004,
      origin: 'direct',
      roundId: null,
      status: 'open',
      raisedByName: `Test geologist ${code}`,
      photoIds: [],
      version: 1,
    });
    const fromRound = await raise(
      {
        kind: 'wedge',
        fromChainage: 1005,
        toChainage: 1006,
        level: 'amber',
        description: 'Wedge of two sets in the crown at the face.',
        roundId: round.id,
      },
      'engineer',
    ).expect(201);
    expect(fromRound.body).toMatchObject({ origin: 'round', roundId: round.id, roundNumber: 2 });
    const audit = await latestAudit(app, fromRound.body.id as string);
    expect(audit).toMatchObject({ entityType: 'hazard', action: 'create' });
    expect(audit.after).toMatchObject({ kind: 'wedge', level: 'amber', roundId: round.id });

    const list = (await request(http).get(hazards).set(p.as('viewer')).expect(200)).body as Body[];
    expect(list.map((h) => [h.kind, h.fromChainage])).toEqual([
      ['water', 1001],
      ['wedge', 1005],
    ]);
    const open = await app.get(HazardsService).openForHeading(p.headingId);
    expect(open.map((h) => h.id)).toEqual(list.map((h) => h.id));
  });

  it('refuses a bad chainage, a round of another heading, a photo that is not there and a viewer', async () => {
    const base = { kind: 'loose-ground', level: 'amber', description: 'Loose slabs in the crown.' };
    const behind = await raise({ ...base, fromChainage: 990, toChainage: 1002 }).expect(400);
    expect(behind.body.fields.fromChainage).toMatch(/behind the start of heading TH \(1\+000\.0\)/);
    const far = await raise({ ...base, fromChainage: 1005, toChainage: 10050 }).expect(400);
    expect(far.body.fields.toChainage).toMatch(
      /more than 100 m ahead of the face of heading TH \(1\+006\.0\)/,
    );
    const text = await raise({ ...base, fromChainage: 'ten', toChainage: 1002 }).expect(400);
    expect(text.body.fields).toHaveProperty('fromChainage');
    const noRound = await raise({ ...base, fromChainage: 1002, toChainage: 1003, origin: 'round' }).expect(
      400,
    );
    expect(noRound.body.fields).toEqual({ roundId: 'Give the round’s id.' });
    const strangerRound = await raise({
      ...base,
      fromChainage: 1002,
      toChainage: 1003,
      roundId: randomUUID(),
    }).expect(400);
    expect(strangerRound.body.fields.roundId).toMatch(/this heading/);
    const photo = await raise({
      ...base,
      fromChainage: 1002,
      toChainage: 1003,
      photoIds: [randomUUID()],
    }).expect(400);
    expect(photo.body.fields.photoIds).toMatch(/not found/);
    await raise({ ...base, fromChainage: 1002, toChainage: 1003 }, 'viewer').expect(403);
    const list = (await request(http).get(hazards).set(p.as('viewer')).expect(200)).body as Body[];
    expect(list.some((h) => h.kind === 'loose-ground')).toBe(false); // nothing was saved
  });

  it('returns the first hazard on a retry with the same Idempotency-Key', async () => {
    const key = randomUUID();
    const body = {
      kind: 'overbreak',
      fromChainage: 1002,
      toChainage: 1002,
      level: 'green',
      description: 'About 1 m³ overbreak in the right shoulder.',
    };
    const first = await raise(body).set('Idempotency-Key', key).expect(201);
    const again = await raise(body).set('Idempotency-Key', key).expect(201);
    expect(again.body.id).toBe(first.body.id);
  });

  it('lets engineers, supervisors and admins close a hazard with a reason (audited); a geologist gets 403', async () => {
    const h = (
      await raise({
        kind: 'misfire',
        fromChainage: 1006,
        toChainage: 1006,
        level: 'red',
        description: 'Suspected misfire in the lifter holes.',
      }).expect(201)
    ).body as Body;
    const closeUrl = `${hazards}/${h.id}/close`;
    await request(http)
      .post(closeUrl)
      .set(p.as('geologist'))
      .send({ reason: 'Made safe.', version: h.version })
      .expect(403);
    const noReason = await request(http)
      .post(closeUrl)
      .set(p.as('supervisor'))
      .send({ reason: '   ', version: h.version })
      .expect(400);
    expect(noReason.body.fields).toHaveProperty('reason');
    await request(http)
      .post(closeUrl)
      .set(p.as('supervisor'))
      .send({ reason: 'Holes washed out and recharged by the shot firer.', version: h.version + 1 })
      .expect(409);
    const closed = await request(http)
      .post(closeUrl)
      .set(p.as('supervisor'))
      .send({ reason: 'Holes washed out and recharged by the shot firer.', version: h.version })
      .expect(200);
    expect(closed.body).toMatchObject({
      status: 'closed',
      closedByName: `Test supervisor ${code}`,
      closeReason: 'Holes washed out and recharged by the shot firer.',
      closedAt: expect.any(String),
    });
    expect(await latestAudit(app, h.id as string)).toMatchObject({
      action: 'close',
      before: { status: 'open' },
      after: { status: 'closed', closeReason: 'Holes washed out and recharged by the shot firer.' },
    });
    await request(http)
      .post(closeUrl)
      .set(p.as('engineer'))
      .send({ reason: 'Again.', version: closed.body.version })
      .expect(409);
    await request(http)
      .patch(`${hazards}/${h.id}`)
      .set(p.as('engineer'))
      .send({ level: 'amber', version: closed.body.version })
      .expect(409);
    const list = (await request(http).get(`${hazards}?status=open`).set(p.as('viewer')).expect(200))
      .body as Body[];
    expect(list.some((x) => x.id === h.id)).toBe(false);
    const all = (await request(http).get(hazards).set(p.as('viewer')).expect(200)).body as Body[];
    expect(all[all.length - 1]).toMatchObject({ id: h.id, status: 'closed' }); // closed ones after the open
  });

  it('fires the open-red-hazard rule on the next round assessment, and clears once the hazard is closed', async () => {
    const save = async (r: Body) =>
      (
        await request(http)
          .put(`${p.base}/rounds/${r.id}`)
          .set(p.as('geologist'))
          .send(saveBody(r))
          .expect(200)
      ).body as Body;
    round = await save(round);
    expect(round.triggerFirings).toEqual([]);
    const red = (
      await raise(
        {
          kind: 'loose-ground',
          fromChainage: 1000,
          toChainage: 1002,
          level: 'red',
          description: 'Loose blocks over the walkway behind the face.',
        },
        'engineer',
      ).expect(201)
    ).body as Body;
    // Changing the level and range is audited as a change, not a copy.
    const changed = (
      await request(http)
        .patch(`${hazards}/${red.id}`)
        .set(p.as('engineer'))
        .send({ toChainage: 1003, version: red.version })
        .expect(200)
    ).body as Body;
    expect(await latestAudit(app, red.id as string)).toMatchObject({
      action: 'update',
      before: { toChainage: 1002 },
      after: { toChainage: 1003 },
    });
    round = await save(round);
    expect(round.triggerLevel).toBe('red');
    expect(round.triggerFirings).toEqual([
      expect.objectContaining({
        level: 'red',
        summary: 'Any open red hazard on the heading → red',
        detail: 'Open red hazard: loose ground 1+000.0–1+003.0 (3.0 m behind this face)',
        ownerRole: 'supervisor',
      }),
    ]);
    await request(http)
      .post(`${hazards}/${red.id}/close`)
      .set(p.as('engineer'))
      .send({ reason: 'Scaled and bolted; checked by the engineer.', version: changed.version })
      .expect(200);
    round = await save(round);
    expect(round.triggerLevel).toBe('green');
  });

  it('keeps one project’s hazards from another’s members (404 on a heading of another project)', async () => {
    const other = await makeProject(app, { code: `${code}X` });
    await request(http)
      .get(`${other.base}/headings/${p.headingId}/hazards`)
      .set(other.as('viewer'))
      .expect(404);
  });
});
