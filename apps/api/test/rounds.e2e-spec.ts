import { randomUUID } from 'node:crypto';
import type { INestApplication } from '@nestjs/common';
import { parsePlane, qValue } from '@roundbook/geomath';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { AuditEvent } from '../src/modules/audit/audit-event.entity';
import { Heading } from '../src/modules/headings/heading.entity';
import { Round } from '../src/modules/rounds/round.entity';
import { makeProject, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
/** Codes and names of this run's own headings, unique so that screens listing them stay unambiguous. */
const stamp = String(Date.now() % 1e7);

const emptyGround = {
  units: [{ name: 'Invented grey gneiss', sharePercent: 100, weatheringGrade: 'WII', strengthGrade: 'R4' }],
  pointLoadIs50: 4.2,
  pointLoadFactor: 22,
  inflowLpm: 12,
  inflowLengthM: 6,
  waterDescription: 'Drips from the crown joints',
  overbreakM3: 1.5,
  notes: '',
};
const joint = (orientationText: string, notation = 'dip-direction/dip', kind = 'joint') => ({
  kind,
  orientationText,
  notation,
  setLabel: null,
  spacingM: 0.4,
  persistenceM: 3,
  apertureMm: 0.5,
  jr: 1.5,
  jrc: null,
  jrcMethod: null,
  infill: '',
  ja: 2,
  water: 'damp',
  thicknessM: null,
  notes: '',
});

describe('Rounds (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  let projectId: string;
  let heading: Heading;
  let as: TestProject['as'];
  let base: string;

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    // A project of this file's own, with the demo's support classes and the trigger rules these tests read:
    // Q < 0.1 is red, Q < 1 amber, inflow over 25 l/min per 10 m amber.
    p = await makeProject(app, {
      code: `RD${stamp}`,
      heading: {
        profileWidth: 5,
        profileHeight: 5,
        axisHeight: 2.5,
        stages: ['full-face', 'top-heading'],
      },
      classes: [
        { code: 'SC-A', name: 'Spot bolting', maxRoundLength: 4, qMin: 10, rmrMin: 65, rmrMax: 100 },
        {
          code: 'SC-B',
          name: 'Systematic bolting',
          maxRoundLength: 3.5,
          qMin: 1,
          qMax: 10,
          rmrMin: 44,
          rmrMax: 64,
        },
        {
          code: 'SC-C',
          name: 'Bolts and sprayed concrete',
          maxRoundLength: 2.5,
          qMin: 0.1,
          qMax: 1,
          rmrMin: 23,
          rmrMax: 43,
        },
        {
          code: 'SC-D',
          name: 'Fibre sprayed concrete and spiles',
          maxRoundLength: 1.5,
          qMin: 0.01,
          qMax: 0.1,
          rmrMin: 0,
          rmrMax: 22,
        },
        { code: 'SC-E', name: 'Steel sets', maxRoundLength: 1, qMin: 0.001, qMax: 0.01 },
      ],
      rules: [
        { watch: 'q', comparison: '<', threshold: 0.1, level: 'red' },
        { watch: 'q', comparison: '<', threshold: 1, level: 'amber' },
        { watch: 'inflow-per-10m', comparison: '>', threshold: 25, level: 'amber' },
      ],
    });
    projectId = p.projectId;
    as = p.as;
    base = p.base;
    heading = await app.get(DataSource).getRepository(Heading).findOneByOrFail({ id: p.headingId });
  });

  afterAll(async () => {
    await app.close();
  });

  const classes = async (): Promise<Body[]> =>
    (await request(http).get(`${base}/support-classes`).set(as('viewer')).expect(200)).body.classes as Body[];

  it('offers the next round number and the previous chainage from the heading start, to geologists only', async () => {
    const next = await request(http)
      .get(`${base}/headings/${heading.id}/rounds/next?stage=full-face`)
      .set(as('geologist'))
      .expect(200);
    expect(next.body).toEqual({
      stage: 'full-face',
      roundNumber: 1,
      previousChainage: 1000,
      plannedRoundLength: 3,
      allowedRoundLength: null,
      allowedByClassCode: null,
      suggestedFaceChainage: 1003,
    });
    await request(http)
      .get(`${base}/headings/${heading.id}/rounds/next?stage=full-face`)
      .set(as('viewer'))
      .expect(403);
    await request(http)
      .post(`${base}/headings/${heading.id}/rounds`)
      .set(as('engineer'))
      .send({ stage: 'full-face', faceChainage: 1003 })
      .expect(403);
    const bad = await request(http)
      .post(`${base}/headings/${heading.id}/rounds`)
      .set(as('geologist'))
      .send({ stage: 'bench', faceChainage: 1003 })
      .expect(400);
    expect(bad.body.fields).toEqual({ stage: 'Choose one of: full-face, top-heading.' });
  });

  it('records a round: joints read in their notation (bad ones kept with the reason), ratings computed by geomath, suggested class, warnings', async () => {
    const created = await request(http)
      .post(`${base}/headings/${heading.id}/rounds`)
      .set(as('geologist'))
      .send({ stage: 'full-face', faceChainage: 1003.5 })
      .expect(201);
    const round = created.body as Body;
    expect(round).toMatchObject({
      roundNumber: 1,
      previousChainage: 1000,
      roundLength: 3.5,
      status: 'draft',
      version: 1,
      mappedByName: `Test geologist RD${stamp}`,
    });
    expect(round.warnings).toEqual(['The round length 3.5 m is over the planned 3 m.']);
    expect(['day', 'night']).toContain(round.shift);

    // methods.md §4.4 example 4 [computed here]: RQD 5 → 10 in the formula; Q = (10/12)(1/4)(1/2.5) = 0.08333, extremely poor.
    const qInput = { rqd: 5, jn: 12, jr: 1, ja: 4, jw: 1, srf: 2.5 };
    const saved = await request(http)
      .put(`${base}/rounds/${round.id}`)
      .set(as('geologist'))
      .send({
        version: 1,
        faceChainage: 1003.5,
        previousChainage: 1000,
        roundLength: 3.5,
        shiftDate: '2026-11-30',
        shift: 'night',
        distantParts: 'Upper right crown seen from 6 m',
        ground: emptyGround,
        joints: [
          joint('130/50'),
          joint('N30E 40SE', 'dip-direction/dip', 'bedding'),
          joint('040/50', 'strike/dip-rhr'),
          joint('50/130', 'dip/dip-direction'),
          joint('n45w 80ne', 'dip-direction/dip', 'fault'),
          joint('N30E 40NE'),
        ],
        qInput,
        rmrInput: null,
        gsiObserved: null,
        recommendedClassId: null,
        nextRoundLength: null,
        recommendationReason: '',
      })
      .expect(200);
    const r = saved.body as Body;
    expect(r.version).toBe(2);
    const joints = r.joints as Body[];
    for (const [i, text, notation] of [
      [0, '130/50', 'dip-direction/dip'],
      [1, 'N30E 40SE', 'dip-direction/dip'],
      [2, '040/50', 'strike/dip-rhr'],
      [3, '50/130', 'dip/dip-direction'],
      [4, 'n45w 80ne', 'dip-direction/dip'],
    ] as const) {
      const plane = parsePlane(text, { notation });
      expect(joints[i]).toMatchObject({
        dipDirection: Number(plane.dipDirection.toFixed(2)),
        dip: Number(plane.dip.toFixed(2)),
        orientationError: null,
      });
    }
    expect(joints[0]).toMatchObject({ dipDirection: 130, dip: 50 }); // Brady & Brown 2004 App. A plane 130/50
    expect(joints[2]).toMatchObject({ dipDirection: 130, dip: 50 }); // RHR strike 040 → dip direction 130 (methods.md §1.1)
    expect(joints[1]).toMatchObject({ dipDirection: 120, dip: 40 }); // methods.md §1.1: N30E 40SE → 120/40
    expect(joints[5]).toMatchObject({ orientationText: 'N30E 40NE', dipDirection: null, dip: null }); // contradictory: kept, not dropped
    expect(joints[5].orientationError).toMatch(/NE/);

    expect(r.ratings.q).toMatchObject({ label: 'extremely poor', error: null, parts: { rqdUsed: 10 } });
    expect(r.ratings.q.value).toBeCloseTo(0.0833333, 6);
    expect(r.ratings.q.value).toBe(qValue(qInput).q);
    expect(r.inflowPer10m).toBeCloseTo(20, 9); // 12 l/min over 6 m → 20 l/min per 10 m
    const all = await classes();
    expect(r.suggestedClassIds).toEqual([all.find((c) => c.code === 'SC-D')!.id]); // SC-D covers Q 0.01–0.1
    // This project's trigger rules: Q < 0.1 is red, Q < 1 amber, inflow over 25 l/min per 10 m amber.
    expect(r.triggerLevel).toBe('red');
    expect((r.triggerFirings as Body[])[0]).toMatchObject({
      level: 'red',
      summary: 'Q < 0.1 → red',
      detail: 'Q 0.083 < 0.1', // compared and printed at the same figures (issue 10: never "Q 0.1 < 0.1")
    });
    expect((r.triggerFirings as Body[]).map((f) => f.summary)).toEqual(
      expect.arrayContaining(['Q < 1 → amber']),
    );
    const listed = await request(http)
      .get(`${base}/headings/${heading.id}/rounds?stage=full-face`)
      .set(as('viewer'))
      .expect(200);
    expect((listed.body.items as Body[])[0]).toMatchObject({ roundNumber: 1, triggerLevel: 'red' });
  });

  it('reports a rating input outside its table without losing the rest of the record', async () => {
    const created = (
      await request(http)
        .post(`${base}/headings/${heading.id}/rounds`)
        .set(as('geologist'))
        .send({ stage: 'top-heading', faceChainage: 1002 })
        .expect(201)
    ).body as Body;
    const saved = await request(http)
      .put(`${base}/rounds/${created.id}`)
      .set(as('geologist'))
      .send({
        ...created,
        version: created.version,
        joints: [joint('200/35')],
        qInput: { rqd: 80, jn: 4, jr: 1.5, ja: 1, jw: 1, srf: 0.1 },
        ground: emptyGround,
      })
      .expect(400); // unknown fields (id, ratings…) are refused: the client sends the input shape only
    expect(saved.body.code).toBe('VALIDATION_FAILED');
    const input = {
      faceChainage: 1002,
      previousChainage: 1000,
      roundLength: 2,
      shiftDate: created.shiftDate,
      shift: created.shift,
      distantParts: '',
      ground: emptyGround,
      joints: [joint('200/35')],
      qInput: { rqd: 80, jn: 4, jr: 1.5, ja: 1, jw: 1, srf: 0.1 },
      rmrInput: null,
      gsiObserved: null,
      recommendedClassId: null,
      nextRoundLength: null,
      recommendationReason: '',
    };
    const ok = (
      await request(http)
        .put(`${base}/rounds/${created.id}`)
        .set(as('geologist'))
        .send({ ...input, version: created.version })
        .expect(200)
    ).body as Body;
    expect(ok.ratings.q.value).toBeNull();
    expect(ok.ratings.q.error).toMatch(/SRF/);
    expect(ok.joints).toHaveLength(1);
  });

  it('refuses a stale save with 409 and the current version, so the screen can show both', async () => {
    const list = (
      await request(http)
        .get(`${base}/headings/${heading.id}/rounds?stage=full-face`)
        .set(as('viewer'))
        .expect(200)
    ).body as Body;
    const id = (list.items as Body[])[0].id as string;
    const current = (await request(http).get(`${base}/rounds/${id}`).set(as('viewer')).expect(200))
      .body as Body;
    const stale = await request(http)
      .put(`${base}/rounds/${id}`)
      .set(as('geologist'))
      .send({
        version: 1,
        faceChainage: 1003.5,
        previousChainage: 1000,
        roundLength: 3.5,
        shiftDate: '2026-11-30',
        shift: 'night',
        distantParts: 'typed on an old screen',
        ground: emptyGround,
        joints: [],
        qInput: null,
        rmrInput: null,
        gsiObserved: null,
        recommendedClassId: null,
        nextRoundLength: null,
        recommendationReason: '',
      })
      .expect(409);
    expect(stale.body).toMatchObject({
      code: 'STALE_VERSION',
      details: { current: { id, version: current.version, distantParts: current.distantParts } },
    });
    const after = (await request(http).get(`${base}/rounds/${id}`).set(as('viewer')).expect(200))
      .body as Body;
    expect(after.joints).toHaveLength(6); // nothing overwritten
  });

  it('submits only a complete record, asks for a reason outside the suggestion, then locks it', async () => {
    const list = (
      await request(http)
        .get(`${base}/headings/${heading.id}/rounds?stage=full-face`)
        .set(as('viewer'))
        .expect(200)
    ).body as Body;
    const id = (list.items as Body[])[0].id as string;
    let r = (await request(http).get(`${base}/rounds/${id}`).set(as('geologist')).expect(200)).body as Body;
    const missing = await request(http)
      .post(`${base}/rounds/${id}/submit`)
      .set(as('geologist'))
      .send({ version: r.version })
      .expect(400);
    expect(Object.keys(missing.body.fields as object).sort()).toEqual([
      'joints',
      'nextRoundLength',
      'recommendedClassId',
    ]);
    expect(missing.body.fields.joints).toMatch(/joint 6/);

    const all = await classes();
    const scB = all.find((c) => c.code === 'SC-B')!;
    const input = (over: Body) => ({
      faceChainage: r.faceChainage,
      previousChainage: r.previousChainage,
      roundLength: r.roundLength,
      shiftDate: r.shiftDate,
      shift: r.shift,
      distantParts: r.distantParts,
      ground: r.ground,
      joints: (r.joints as Body[])
        .slice(0, 5)
        .map((j) => ({ ...joint(j.orientationText as string, j.notation as string, j.kind as string) })),
      qInput: r.qInput,
      rmrInput: r.rmrInput,
      gsiObserved: r.gsiObserved,
      recommendedClassId: scB.id,
      nextRoundLength: 3.5,
      recommendationReason: '',
      version: r.version,
      ...over,
    });
    r = (await request(http).put(`${base}/rounds/${id}`).set(as('geologist')).send(input({})).expect(200))
      .body as Body;
    const noReason = await request(http)
      .post(`${base}/rounds/${id}/submit`)
      .set(as('geologist'))
      .send({ version: r.version })
      .expect(400);
    expect(noReason.body.fields).toEqual({ recommendationReason: expect.stringMatching(/SC-B is outside/) });

    r = (
      await request(http)
        .put(`${base}/rounds/${id}`)
        .set(as('geologist'))
        .send(input({ nextRoundLength: 4 }))
        .expect(200)
    ).body as Body;
    const tooLong = await request(http)
      .post(`${base}/rounds/${id}/submit`)
      .set(as('geologist'))
      .send({ version: r.version })
      .expect(400);
    expect(tooLong.body.fields.nextRoundLength).toMatch(/SC-B allows rounds of up to 3.5 m/);

    r = (
      await request(http)
        .put(`${base}/rounds/${id}`)
        .set(as('geologist'))
        .send(
          input({
            version: r.version,
            recommendationReason: 'Joints are tight and dry; the Q inputs are conservative.',
          }),
        )
        .expect(200)
    ).body as Body;
    const submitted = await request(http)
      .post(`${base}/rounds/${id}/submit`)
      .set(as('geologist'))
      .send({ version: r.version })
      .expect(200);
    expect(submitted.body).toMatchObject({ status: 'submitted', recommendedClassId: scB.id });
    expect(submitted.body.submittedAt).toEqual(expect.any(String));

    const locked = await request(http)
      .put(`${base}/rounds/${id}`)
      .set(as('geologist'))
      .send(input({ version: submitted.body.version }))
      .expect(409);
    expect(locked.body.message).toMatch(/submitted/);
    const events = await app
      .get(DataSource)
      .getRepository(AuditEvent)
      .find({ where: { entityId: id }, order: { createdAt: 'ASC' } });
    expect(events.map((e) => e.action)).toEqual(expect.arrayContaining(['create', 'save', 'submit']));

    // The class is now in use: it can be retired but not deleted.
    const del = await request(http).delete(`${base}/support-classes/${scB.id}`).set(as('admin')).expect(409);
    expect(del.body.message).toMatch(/Retire it instead/);
  });

  it('suggests the next face at the smaller of the planned length and what the last round’s class allows (confirmed over recommended)', async () => {
    const rounds = app.get(DataSource).getRepository(Round);
    const last = await rounds.findOneOrFail({
      where: { headingId: heading.id, stage: 'full-face' },
      order: { roundNumber: 'DESC' },
    });
    const before = { recommendedClassId: last.recommendedClassId, confirmedClassId: last.confirmedClassId };
    const byCode = new Map((await classes()).map((c) => [c.code as string, c.id as string]));
    const next = async () =>
      (
        await request(http)
          .get(`${base}/headings/${heading.id}/rounds/next?stage=full-face`)
          .set(as('geologist'))
          .expect(200)
      ).body as Body;
    try {
      // SC-B allows 3.5 m, more than the planned 3 m: the planned length stands.
      await rounds.update(last.id, { recommendedClassId: byCode.get('SC-B')!, confirmedClassId: null });
      let n = await next();
      expect(n).toMatchObject({ allowedRoundLength: 3.5, allowedByClassCode: 'SC-B', plannedRoundLength: 3 });
      expect(n.suggestedFaceChainage).toBeCloseTo(Number(last.faceChainage) + 3, 9);
      // Recommended SC-C (2.5 m): the suggestion shortens to 2.5 m.
      await rounds.update(last.id, { recommendedClassId: byCode.get('SC-C')! });
      n = await next();
      expect(n).toMatchObject({ allowedRoundLength: 2.5, allowedByClassCode: 'SC-C' });
      expect(n.suggestedFaceChainage).toBeCloseTo(Number(last.faceChainage) + 2.5, 9);
      // The engineer confirmed SC-D (1.5 m): the confirmed class governs.
      await rounds.update(last.id, { confirmedClassId: byCode.get('SC-D')! });
      n = await next();
      expect(n).toMatchObject({ allowedRoundLength: 1.5, allowedByClassCode: 'SC-D' });
      expect(n.suggestedFaceChainage).toBeCloseTo(Number(last.faceChainage) + 1.5, 9);
    } finally {
      await rounds.update(last.id, before);
    }
  });

  it("shows the heading's face chainage, last round and rounds waiting for review on the Board", async () => {
    const res = await request(http).get('/api/projects').set(as('engineer')).expect(200);
    const mine = (res.body as Body[]).find((x) => x.id === projectId)!;
    const card = (mine.headings as Body[]).find((h) => h.id === heading.id)!;
    expect(card).toMatchObject({ faceChainage: 1003.5, roundsToConfirm: 1, triggerLevel: 'red' });
    expect(new Date(card.lastRoundAt as string).getTime()).toBeGreaterThan(Date.now() - 5 * 60_000);
    // Issue 19, item 13: a draft's face (a typo, say) does not move the heading's face; it is shown apart.
    await request(http)
      .post(`${base}/headings/${heading.id}/rounds`)
      .set(as('geologist'))
      .send({ stage: 'full-face', faceChainage: 1093.5 })
      .expect(201);
    const after = (await request(http).get('/api/projects').set(as('engineer')).expect(200)).body as Body[];
    const card2 = (after.find((x) => x.id === projectId)!.headings as Body[]).find(
      (h) => h.id === heading.id,
    )!;
    expect(card2).toMatchObject({ faceChainage: 1003.5, draftFaceChainage: 1093.5 });
  });

  it('finds readable joints of the heading over a chainage window', async () => {
    const res = await request(http)
      .get(`${base}/headings/${heading.id}/joints?fromChainage=990&toChainage=1010`)
      .set(as('viewer'))
      .expect(200);
    expect((res.body as Body[]).length).toBe(6); // 5 readable on round 1 + 1 on the top heading round
    expect((res.body as Body[]).every((j) => typeof j.dip === 'number')).toBe(true);
  });

  it('pages, sorts and filters a heading of 30,000 rounds in the database, on its index', async () => {
    const ds = app.get(DataSource);
    const { id: _id, version: _version, createdAt: _c, updatedAt: _u, ...shape } = heading;
    const big = await ds
      .getRepository(Heading)
      .save({ ...shape, code: `B${stamp}`, name: `Invented 30,000-round heading B${stamp}` });
    const geologist = await ds.query<Array<{ id: string }>>('SELECT id FROM users WHERE email = ?', [
      p.emailOf('geologist'),
    ]);
    // 30,000 invented rounds in one statement (MariaDB's sequence engine).
    await ds.query(
      `INSERT INTO rounds (id, project_id, heading_id, stage, round_number, face_chainage, previous_chainage, round_length, shift_date, shift,
         mapped_by, mapped_at, distant_parts, ground, q, rmr, recommendation_reason, status, version)
       SELECT UUID(), ?, ?, 'full-face', seq, 1000 + seq * 2.5, 1000 + (seq - 1) * 2.5, 2.5, DATE_ADD('2020-01-01', INTERVAL seq DIV 4 DAY),
         IF(seq % 2 = 0, 'day', 'night'), ?, NOW(3), '', '{}', POW(10, CAST(seq % 7 AS SIGNED) - 3), 20 + seq % 60, '', IF(seq % 10 = 0, 'submitted', 'draft'), 1
       FROM seq_1_to_30000`,
      [projectId, big.id, geologist[0].id],
    );
    const page = await request(http)
      .get(`${base}/headings/${big.id}/rounds?page=300&pageSize=100&sort=-faceChainage`)
      .set(as('viewer'))
      .expect(200);
    expect(page.body.total).toBe(30000);
    expect((page.body.items as Body[]).map((i) => i.roundNumber)).toEqual(
      Array.from({ length: 100 }, (_, i) => 100 - i),
    );
    const filtered = await request(http)
      .get(`${base}/headings/${big.id}/rounds?status=submitted&sort=q&pageSize=5`)
      .set(as('viewer'))
      .expect(200);
    expect(filtered.body.total).toBe(3000);
    expect(
      (filtered.body.items as Body[]).every((i) => i.status === 'submitted' && i.q <= 1e-3 + 1e-12),
    ).toBe(true);
    const windowed = await request(http)
      .get(`${base}/headings/${big.id}/rounds?fromChainage=2000&toChainage=2100`)
      .set(as('viewer'))
      .expect(200);
    expect(windowed.body.total).toBe(41); // chainages 2000.0 … 2100.0 every 2.5 m
    const plan = await ds.query<Array<{ key: string | null }>>(
      `EXPLAIN SELECT r.id FROM rounds r WHERE r.heading_id = ? ORDER BY r.face_chainage DESC LIMIT 100 OFFSET 29900`,
      [big.id],
    );
    expect(plan[0].key).toBe('IDX_rounds_heading_chainage');
    // The 30,000 invented rounds go again, so a rerun on the same database starts small.
    await ds.query('DELETE FROM rounds WHERE heading_id = ?', [big.id]);
    await ds.getRepository(Heading).delete({ id: big.id });
  });
  it('rounds opened at once on one heading are numbered one after the other, none refused', async () => {
    // Found by the cluster proof (npm run cluster:proof): a create that waited for the heading's lock read the
    // last round number from its snapshot and failed on the unique key (409) when three came at once.
    const q = await makeProject(app, { code: `RC${stamp}`, heading: { stages: ['full-face'] } });
    const ids = Array.from({ length: 12 }, () => randomUUID());
    const answers = await Promise.all(
      ids.map((id, i) =>
        request(http)
          .post(`${q.base}/headings/${q.headingId}/rounds`)
          .set(q.as('geologist'))
          .send({ id, stage: 'full-face', faceChainage: 1003 + i }),
      ),
    );
    expect(answers.map((a) => a.status)).toEqual(ids.map(() => 201));
    const numbers = answers.map((a) => (a.body as Body).roundNumber as number).sort((a, b) => a - b);
    expect(numbers).toEqual(ids.map((_, i) => i + 1));
  });
  it('rounds opened at once with Idempotency-Keys are all made, none refused for a deadlock', async () => {
    // Found by `npm run faults`: with keys, concurrent creates on one heading deadlocked (each locked the gap
    // of its unused key, then waited for the heading, then inserted its key into the other's gap) and
    // answered 503s under an ordinary load of four clients.
    const q = await makeProject(app, { code: `RK${stamp}`, heading: { stages: ['full-face'] } });
    const ids = Array.from({ length: 12 }, () => randomUUID());
    const answers = await Promise.all(
      ids.map((id, i) =>
        request(http)
          .post(`${q.base}/headings/${q.headingId}/rounds`)
          .set(q.as('geologist'))
          .set('Idempotency-Key', randomUUID())
          .send({ id, stage: 'full-face', faceChainage: 1003 + i }),
      ),
    );
    expect(answers.map((a) => a.status)).toEqual(ids.map(() => 201));
    const numbers = answers.map((a) => (a.body as Body).roundNumber as number).sort((a, b) => a - b);
    expect(numbers).toEqual(ids.map((_, i) => i + 1));
  });
});
