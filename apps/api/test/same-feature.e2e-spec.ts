// Issue 10 item 2 through the API on a project of its own: "same feature as" links a fault seen on three
// faces. The link is stored as the feature's first observation, refused when it points anywhere but an
// earlier round of the heading, carried in the frozen assessment, and the heading's look-ahead and the sets
// count the feature once (the rule: common practice; packages/domain features.ts).
import { randomUUID } from 'node:crypto';
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { makeProject, saveBody, testJoint, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const code = `SF${String(Date.now() % 1e6)}`;

describe('Same feature across rounds (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    p = await makeProject(app, { code });
  });

  afterAll(async () => {
    await app.close();
  });

  const open = async (faceChainage: number): Promise<Body> =>
    (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage })
        .expect(201)
    ).body as Body;
  const save = (r: Body, joints: Body[]) =>
    request(http)
      .put(`${p.base}/rounds/${r.id}`)
      .set(p.as('geologist'))
      .send(
        saveBody(r, {
          joints,
          recommendedClassId: p.classes.find((c) => c.code === 'C1')!.id,
          nextRoundLength: 3,
        }),
      );
  const submit = async (r: Body): Promise<Body> =>
    (
      await request(http)
        .post(`${p.base}/rounds/${r.id}/submit`)
        .set(p.as('geologist'))
        .send({ version: r.version })
        .expect(200)
    ).body as Body;

  // Each face: two joints of one set (about 090/60), a named persistent joint of that set, a fault 240/20
  // (its crown crossing 3/tan 20° = 8.24 m ahead of the face on this 6 m circular profile, so every
  // observation's crossing is still ahead of the last face) and an unlinked shear zone 240/25.
  const face = (links: { fault?: string; named?: string } = {}): Body[] => [
    testJoint('088/60', { id: randomUUID() }),
    testJoint('092/61', { id: randomUUID() }),
    testJoint('090/60', {
      id: randomUUID(),
      notes: 'Invented: the long open joint through the left shoulder',
      sameAsJointId: links.named ?? null,
    }),
    testJoint('240/20', {
      id: randomUUID(),
      kind: 'fault',
      thicknessM: 0.3,
      sameAsJointId: links.fault ?? null,
    }),
    testJoint('240/25', { id: randomUUID(), kind: 'shear-zone', thicknessM: 0.1 }),
  ];
  const rounds: Body[] = [];

  it('maps the fault on round 1 and links rounds 2 and 3 to it; a link to a later observation is stored as the first', async () => {
    const r1 = await open(1003);
    const j1 = face();
    rounds.push(await submit((await save(r1, j1).expect(200)).body as Body));
    const fault1 = j1[3].id as string;

    const r2 = await open(1006);
    const j2 = face({ fault: fault1, named: j1[2].id as string });
    const s2 = (await save(r2, j2).expect(200)).body as Body;
    expect((s2.joints as Body[]).map((j) => j.sameAsJointId)).toEqual([null, null, j1[2].id, fault1, null]);
    rounds.push(await submit(s2));

    // Round 3 picks round 2's observation: the API stores the feature's first (round 1's).
    const r3 = await open(1009);
    const j3 = face({ fault: j2[3].id as string, named: j2[2].id as string });
    const s3 = (await save(r3, j3).expect(200)).body as Body;
    expect((s3.joints as Body[])[3].sameAsJointId).toBe(fault1);
    expect((s3.joints as Body[])[2].sameAsJointId).toBe(j1[2].id);
    rounds.push(await submit(s3));

    // The heading's joints (the Orientation tab and the picker) carry the link.
    const window = (
      await request(http)
        .get(`${p.base}/headings/${p.headingId}/joints?fromChainage=1000&toChainage=1010`)
        .set(p.as('viewer'))
        .expect(200)
    ).body as Body[];
    expect(window.filter((j) => j.sameAsJointId === fault1)).toHaveLength(2);
  });

  it('refuses a link that is not an earlier round of this heading, with the joint named, and loses nothing', async () => {
    const r4 = await open(1012);
    const own = face();
    const bad = [
      { ...own[3], sameAsJointId: randomUUID() },
      { ...own[3], sameAsJointId: own[0].id },
      { ...own[3], sameAsJointId: 'not-an-id' },
    ];
    for (const [i, fault] of bad.entries()) {
      const res = await save(r4, [own[0], own[1], own[2], fault]).expect(400);
      expect(JSON.stringify(res.body)).toMatch(
        i === 2
          ? /Pick the earlier feature/
          : /Joint 4 is linked to (a feature that is not mapped|a joint of this same round)/,
      );
    }
    const after = (await request(http).get(`${p.base}/rounds/${r4.id}`).set(p.as('geologist')).expect(200))
      .body as Body;
    expect(after.joints).toEqual([]);
    expect(after.version).toBe(r4.version);
  });

  it('freezes the link in the submitted assessment and counts the named joint once in round 3’s sets', async () => {
    const fault1 = rounds[0].joints[3].id as string;
    const revisions = (
      await request(http).get(`${p.base}/rounds/${rounds[2].id}/revisions`).set(p.as('viewer')).expect(200)
    ).body as Body[];
    const frozen = revisions[0].assessment as Body;
    expect(frozen.features.find((f: Body) => f.kind === 'fault').sameAsJointId).toBe(fault1);
    expect(frozen.lookAhead.find((r: Body) => r.label === 'fault 1').featureKey).toBe(fault1);
    expect((revisions[0].record as Body).joints[3].sameAsJointId).toBe(fault1);
    // Sets within 25 m: 3 joints here + 2 × 2 set joints of rounds 1 and 2; the named joint's earlier
    // observations (rounds 1 and 2) are the same feature as this face's and are left out.
    expect(frozen.sets.linkedLeftOut).toBe(2);
    expect(frozen.sets.used).toBe(7);
  });

  it('lists the linked fault once in the handover look-ahead (latest observation), the unlinked shear zone three times', async () => {
    const draft = (
      await request(http)
        .get(`${p.base}/handovers/draft?headingIds=${p.headingId}`)
        .set(p.as('supervisor'))
        .expect(200)
    ).body as Body;
    const items = draft.headings[0].lookAhead as Body[];
    const faults = items.filter((i) => i.label.startsWith('fault'));
    expect(faults).toHaveLength(1);
    expect(faults[0].roundNumber).toBe(3);
    // Its crown crossing from round 3's face: 1009 + 3/tan 20° [computed here].
    expect(faults[0].crownChainage).toBeCloseTo(1009 + 3 / Math.tan((20 * Math.PI) / 180), 2);
    expect(
      items
        .filter((i) => i.label.startsWith('shear zone'))
        .map((i) => i.roundNumber)
        .sort(),
    ).toEqual([1, 2, 3]);
  });
});
