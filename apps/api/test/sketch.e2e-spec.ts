import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { latestAudit, makeProject, saveBody, testJoint, type TestProject } from './factories';
import { createTestApp } from './test-app';

// Issue 13, item 2: the face sketch is saved with the round under its optimistic lock, checked by the
// domain's restoreSketch (bad document → 400 with the reason, too big → 413), and frozen at submit.
type Body = Record<string, any>;
const code = `SK${Date.now() % 1e5}`;

const trace = (id: string, jointId: string | null = null) => ({
  id,
  kind: 'trace',
  mode: 'polyline',
  points: [
    [-2.5, 1.2],
    [0.4, 3.1],
    [2.2, 4.8],
  ],
  link: jointId === null ? null : { jointId },
});
const sketchOf = (...elements: Body[]) => ({ schemaVersion: 2, frame: 'face-m', elements });

describe('round sketch: saved with the round, validated, frozen (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  let round: Body;

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    p = await makeProject(app, { code });
  });
  afterAll(async () => app.close());

  let face = 1003;
  beforeEach(async () => {
    face += 3;
    const created = (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage: face })
        .expect(201)
    ).body as Body;
    round = (
      await request(http)
        .put(`${p.base}/rounds/${created.id}`)
        .set(p.as('geologist'))
        .send(saveBody(created, { joints: [testJoint('120/60')] }))
        .expect(200)
    ).body as Body;
  });

  const save = (body: Body) =>
    request(http).put(`${p.base}/rounds/${round.id}`).set(p.as('geologist')).send(body);

  it('a new round has no sketch; a saved one comes back as saved, linked to the joint by its id', async () => {
    expect(round.sketch).toBeNull();
    const jointId = round.joints[0].id as string;
    const doc = sketchOf(trace('t1', jointId), {
      id: 'w1',
      kind: 'water',
      at: [1, 2],
      state: 'flowing',
      inflowLpm: 12,
    });
    const saved = (await save({ version: round.version, sketch: doc }).expect(200)).body as Body;
    expect(saved.sketch).toEqual(doc);
    expect(saved.version).toBe(round.version + 1);
    // a save that leaves the sketch out keeps it
    const other = (await save({ version: saved.version, distantParts: 'crown' }).expect(200)).body as Body;
    expect(other.sketch).toEqual(doc);
    const read = (await request(http).get(`${p.base}/rounds/${round.id}`).set(p.as('viewer')).expect(200))
      .body as Body;
    expect(read.sketch.elements[0].link).toEqual({ jointId });
    // the audit keeps a summary of the change, not the drawing
    const audit = await latestAudit(app, round.id);
    expect(audit.after).toMatchObject({ sketch: '2 element(s)' });
  });

  it('upgrades a version 1 document on the way in', async () => {
    const v1 = {
      schemaVersion: 1,
      traces: [
        {
          id: 'old',
          points: [
            [0, 1],
            [1, 2],
          ],
          jointId: null,
        },
      ],
    };
    const saved = (await save({ version: round.version, sketch: v1 }).expect(200)).body as Body;
    expect(saved.sketch).toEqual(
      sketchOf({
        id: 'old',
        kind: 'trace',
        mode: 'freehand',
        points: [
          [0, 1],
          [1, 2],
        ],
        link: null,
      }),
    );
  });

  it('refuses a bad document with 400 and the reason, and keeps what was there', async () => {
    const good = (await save({ version: round.version, sketch: sketchOf(trace('t1')) }).expect(200))
      .body as Body;
    const cases: Array<[unknown, RegExp]> = [
      [{ schemaVersion: 7, frame: 'face-m', elements: [] }, /version 7 is not known/],
      [
        sketchOf({
          ...trace('t2'),
          points: [
            [0, 0],
            [0, 900],
          ],
        }),
        /outside the sketch/,
      ],
      [sketchOf(trace('t2'), trace('t2')), /used twice/],
      [sketchOf({ id: 'x', kind: 'scribble' }), /one of trace, label, water, overbreak/],
      ['a sketch', /document object/],
    ];
    for (const [sketch, reason] of cases) {
      const res = await save({ version: good.version, sketch }).expect(400);
      expect(res.body.message).toMatch(reason);
    }
    const read = (await request(http).get(`${p.base}/rounds/${round.id}`).set(p.as('viewer')).expect(200))
      .body as Body;
    expect(read.sketch).toEqual(good.sketch);
    expect(read.version).toBe(good.version);
  });

  it('refuses a sketch over 512 KB with 413', async () => {
    // 1,900 traces of 20 points each: about 740 KB of JSON, within the 1 MB round body
    const mm = (v: number) => Math.round(v * 1000) / 1000;
    const elements = Array.from({ length: 1900 }, (_, i) => ({
      ...trace(`t${i}`),
      points: Array.from({ length: 20 }, (_v, k) => [mm(-2.123 + k * 0.1), mm(1.654 + (i % 40) * 0.1)]),
    }));
    expect(JSON.stringify(sketchOf(...elements)).length).toBeGreaterThan(512 * 1024);
    expect(JSON.stringify(sketchOf(...elements)).length).toBeLessThan(1000 * 1024);
    const res = await save({ version: round.version, sketch: sketchOf(...elements) }).expect(413);
    expect(res.body.message).toMatch(/at most 512 KB/);
  });

  it('a stale version is refused with 409 and the sketch is not overwritten', async () => {
    const first = (await save({ version: round.version, sketch: sketchOf(trace('mine')) }).expect(200))
      .body as Body;
    const res = await save({ version: round.version, sketch: sketchOf(trace('theirs')) }).expect(409);
    expect(res.body.code).toBe('STALE_VERSION');
    expect(res.body.details.current.sketch.elements[0].id).toBe('mine');
    expect(first.sketch.elements[0].id).toBe('mine');
  });

  it('a viewer cannot save a sketch; the sketch is frozen in the revision at submit', async () => {
    await request(http)
      .put(`${p.base}/rounds/${round.id}`)
      .set(p.as('viewer'))
      .send({ version: round.version, sketch: sketchOf(trace('v')) })
      .expect(403);
    const c1 = p.classes.find((c) => c.code === 'C1')!;
    const ready = (
      await save({
        version: round.version,
        sketch: sketchOf(trace('frozen')),
        recommendedClassId: c1.id,
        nextRoundLength: 3,
      }).expect(200)
    ).body as Body;
    const submitted = (
      await request(http)
        .post(`${p.base}/rounds/${round.id}/submit`)
        .set(p.as('geologist'))
        .send({ version: ready.version })
        .expect(200)
    ).body as Body;
    expect(submitted.status).toBe('submitted');
    // no more edits once submitted
    await save({ version: submitted.version, sketch: sketchOf() }).expect(409);
    const revisions = (
      await request(http).get(`${p.base}/rounds/${round.id}/revisions`).set(p.as('viewer')).expect(200)
    ).body as Body[];
    expect(revisions).toHaveLength(1);
    expect(revisions[0].record.sketch).toEqual(sketchOf(trace('frozen')));
  });
});
