import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { AuditEvent } from '../src/modules/audit/audit-event.entity';
import { makeProject, saveBody, testGround, testJoint, type TestProject } from './factories';
import { createTestApp } from './test-app';

// Issue 18, item 5: a partial body never erases what it does not mention; the audit keeps changes, not
// copies; autosaves of one person in a run are one event.
type Body = Record<string, any>;
const code = `PS${Date.now() % 1e5}`;

describe('round saves: partial bodies keep the rest, the audit keeps changes (e2e, real MariaDB)', () => {
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

  beforeEach(async () => {
    const created = (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage: 1003 })
        .expect(201)
    ).body as Body;
    round = (
      await request(http)
        .put(`${p.base}/rounds/${created.id}`)
        .set(p.as('geologist'))
        .send(
          saveBody(created, { joints: [testJoint('120/60'), testJoint('300/45')], distantParts: 'crown' }),
        )
        .expect(200)
    ).body as Body;
  });

  const save = (body: Body) =>
    request(http).put(`${p.base}/rounds/${round.id}`).set(p.as('geologist')).send(body);
  const events = (id: string) =>
    app
      .get(DataSource)
      .getRepository(AuditEvent)
      .find({ where: { entityId: id, action: 'save' }, order: { createdAt: 'ASC' } });

  it('a save of the version alone changes nothing: ground, joints, ratings and notes stay', async () => {
    const res = (await save({ version: round.version }).expect(200)).body as Body;
    expect(res.ground).toEqual(round.ground);
    expect(res.joints.map((j: Body) => j.id)).toEqual(round.joints.map((j: Body) => j.id));
    expect(res.qInput).toEqual(round.qInput);
    expect(res.distantParts).toBe('crown');
    expect(res.faceChainage).toBe(1003);
  });

  it('part of the ground: the fields given change, the rock units and the rest are kept', async () => {
    const res = (
      await save({ version: round.version, ground: { notes: 'Seepage on the left wall' } }).expect(200)
    ).body as Body;
    expect(res.ground.notes).toBe('Seepage on the left wall');
    expect(res.ground.units).toEqual(testGround.units);
    expect(res.ground.inflowLpm).toBe(testGround.inflowLpm);
    // null clears a nullable field, and only that one
    const cleared = (await save({ version: res.version, ground: { overbreakM3: null } }).expect(200))
      .body as Body;
    expect(cleared.ground.overbreakM3).toBeNull();
    expect(cleared.ground.notes).toBe('Seepage on the left wall');
  });

  it('`ground: []`, `ground: null`, `units: null` and null for a required field are 400 and change nothing', async () => {
    for (const body of [
      { ground: [] },
      { ground: null },
      { ground: { units: null } },
      { ground: { notes: null } },
      { joints: null },
      { faceChainage: null },
      { shiftDate: null },
    ]) {
      const res = await save({ version: round.version, ...body }).expect(400);
      expect(Object.keys(res.body.fields as object).join(' ')).toMatch(
        /ground|joints|faceChainage|shiftDate/,
      );
    }
    const now = (await request(http).get(`${p.base}/rounds/${round.id}`).set(p.as('geologist')).expect(200))
      .body as Body;
    expect(now.ground).toEqual(round.ground);
    expect(now.joints).toHaveLength(2);
    expect(now.version).toBe(round.version);
  });

  it('an empty joints list is the one way to remove every joint (said, not implied)', async () => {
    const res = (await save({ version: round.version, joints: [] }).expect(200)).body as Body;
    expect(res.joints).toEqual([]);
  });

  it('the audit keeps the fields that changed (a ground field, a joint by id), not whole copies', async () => {
    const [j1, j2] = round.joints as Body[];
    const before = await events(round.id);
    expect(before).toHaveLength(1); // the first save of the fixture
    const first = (await save({ version: round.version, ground: { notes: 'Wet' } }).expect(200)).body as Body;
    const second = (
      await save({
        version: first.version,
        joints: [
          { ...testJoint('120/60'), id: j1.id, notes: 'Slickensided' },
          { ...testJoint('300/45'), id: j2.id },
        ],
      }).expect(200)
    ).body as Body;
    const after = await events(round.id);
    // one event for the run: the fixture's save and both edits were made by the same person within minutes
    expect(after).toHaveLength(1);
    const e = after[0];
    expect(e.coalesced).toBe(2);
    expect(e.lastAt).not.toBeNull();
    expect((e.after as Body).ground).toMatchObject({ notes: 'Wet' });
    // a ground field changed: only that field is in the event, not the record
    expect(Object.keys((e.after as Body).ground as object)).not.toContain('waterDescription');
    expect(((e.after as Body).joints as Body)[j1.id]).toMatchObject({ notes: 'Slickensided' });
    expect(((e.after as Body).joints as Body)[j2.id]).toBeDefined(); // added by the fixture's first save
    expect(JSON.stringify(e.after).length).toBeLessThan(4000);
    expect(second.joints[0].notes).toBe('Slickensided');
  });

  it('a save that changes nothing records nothing', async () => {
    const n = (await events(round.id)).length;
    await save({ version: round.version }).expect(200);
    expect(await events(round.id)).toHaveLength(n);
  });
});
