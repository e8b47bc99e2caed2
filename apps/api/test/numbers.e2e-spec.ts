// Issue 10 "Trust the numbers" through the API: a heading driven against the chainage, water once, the
// governing discontinuity, and the ground description refused when it is not of the project's scale.
import { randomUUID } from 'node:crypto';
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { makeProject, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const code = `NB${String(Date.now() % 1e6)}`;

const ground = (extra: Body = {}) => ({
  units: [{ name: 'Invented banded gneiss', sharePercent: 100, weatheringGrade: 'WII', strengthGrade: 'R4' }],
  pointLoadIs50: 3,
  pointLoadFactor: 22,
  inflowLpm: 6,
  inflowLengthM: 3,
  waterDescription: '',
  overbreakM3: 0.5,
  notes: '',
  ...extra,
});
const fault = (id: string) => ({
  id,
  kind: 'fault',
  orientationText: '060/60',
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
});

describe('Trust the numbers (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    // Driven toward 240 from an intermediate adit at 2+000, against the chainage.
    p = await makeProject(app, {
      code,
      heading: { startChainage: 2000, driveTrend: 240, chainageSense: 'decreasing' },
      rules: [{ watch: 'crown-crossing-within', threshold: 20, level: 'amber' }],
    });
  });

  afterAll(async () => {
    await app.close();
  });

  const body = (r: Body, extra: Body = {}) => ({
    version: r.version,
    faceChainage: r.faceChainage,
    previousChainage: r.previousChainage,
    roundLength: r.roundLength,
    shiftDate: r.shiftDate,
    shift: r.shift,
    distantParts: '',
    ground: ground(),
    joints: [],
    qInput: { rqd: 40, jn: 9, jr: 1, ja: 8, jw: 1, srf: 2.5 },
    rmrInput: null,
    gsiObserved: null,
    recommendedClassId: null,
    nextRoundLength: null,
    recommendationReason: '',
    ...extra,
  });

  it('records ten rounds driven against the chainage with positive lengths; the look-ahead chainages decrease ahead of the face [common practice of route surveying; methods.md §6]', async () => {
    const faces: number[] = [];
    let last: Body = {};
    for (let i = 0; i < 10; i++) {
      const next = (
        await request(http)
          .get(`${p.base}/headings/${p.headingId}/rounds/next?stage=full-face`)
          .set(p.as('geologist'))
          .expect(200)
      ).body as Body;
      // previous face − planned 3 m, since chainage decreases in the drive direction
      expect(next.suggestedFaceChainage).toBeCloseTo(next.previousChainage - 3, 9);
      const opened = (
        await request(http)
          .post(`${p.base}/headings/${p.headingId}/rounds`)
          .set(p.as('geologist'))
          .send({ stage: 'full-face', faceChainage: next.suggestedFaceChainage })
          .expect(201)
      ).body as Body;
      expect(opened.roundLength).toBe(3);
      const faultId = randomUUID();
      last = (
        await request(http)
          .put(`${p.base}/rounds/${opened.id}`)
          .set(p.as('geologist'))
          .send(
            body(opened, {
              joints: [fault(faultId)],
              qInput: { rqd: 40, jn: 9, jr: 1, ja: 8, jw: 1, srf: 2.5, governingJointId: faultId },
            }),
          )
          .expect(200)
      ).body as Body;
      expect(last.roundLength).toBe(3);
      faces.push(last.faceChainage as number);
    }
    expect(faces).toEqual([1997, 1994, 1991, 1988, 1985, 1982, 1979, 1976, 1973, 1970]);
    // The fault 060/60 (dipping toward the face of a drive to 240) mapped at the centre of a 6 m circle reaches the crown 3/tan 60° = 1.732 m ahead,
    // at chainage 1970 − 1.732 (below the face) [computed here].
    const reach = (last.assessment.lookAhead as Body[])[0];
    expect(reach.distance.crown).toBeCloseTo(3 / Math.tan(Math.PI / 3), 6);
    expect(reach.chainage.crown).toBeCloseTo(1970 - 3 / Math.tan(Math.PI / 3), 6);
    expect(reach.chainage.crown).toBeLessThan(1970);
    expect(last.triggerFirings[0].detail).toMatch(/reaches the crown 1\.7 m ahead/);
    // The governing fault is named and agrees with the typed Jr/Ja: no Jr/Ja warning.
    expect(last.assessment.governing).toMatchObject({ source: 'named', jr: 1, ja: 8 });
    expect((last.warnings as string[]).filter((w) => /typed, but the governing/.test(w))).toEqual([]);
    // The Rounds table lists the furthest face along the drive first: the lowest chainage here.
    const page = (
      await request(http).get(`${p.base}/headings/${p.headingId}/rounds`).set(p.as('viewer')).expect(200)
    ).body as Body;
    expect((page.items as Body[]).map((r) => r.faceChainage).slice(0, 3)).toEqual([1970, 1973, 1976]);
  });

  it('asks for the inflow length instead of using the round length (before: 6 l/min × 10 / 3 m = 20)', async () => {
    const next = (
      await request(http)
        .get(`${p.base}/headings/${p.headingId}/rounds/next?stage=full-face`)
        .set(p.as('geologist'))
        .expect(200)
    ).body as Body;
    const r = (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage: next.suggestedFaceChainage })
        .expect(201)
    ).body as Body;
    const saved = (
      await request(http)
        .put(`${p.base}/rounds/${r.id}`)
        .set(p.as('geologist'))
        .send(body(r, { ground: ground({ inflowLengthM: null }) }))
        .expect(200)
    ).body as Body;
    expect(saved.inflowPer10m).toBeNull();
    expect(saved.assessment.missing).toHaveProperty(['ground.inflowLengthM']);
  });

  it('refuses grades outside the project scale, shares that do not make 100 % and a governing joint not on the round, naming the field (ISRM 1981 grades, from memory)', async () => {
    const next = (
      await request(http)
        .get(`${p.base}/headings/${p.headingId}/rounds/next?stage=full-face`)
        .set(p.as('geologist'))
        .expect(200)
    ).body as Body;
    const r = (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage: next.suggestedFaceChainage })
        .expect(201)
    ).body as Body;
    const put = (extra: Body) =>
      request(http).put(`${p.base}/rounds/${r.id}`).set(p.as('geologist')).send(body(r, extra));
    const w9 = await put({
      ground: ground({
        units: [{ name: 'x', sharePercent: 100, weatheringGrade: 'W9', strengthGrade: 'R4' }],
      }),
    }).expect(400);
    expect(Object.keys(w9.body.fields as object)).toEqual(['ground.units.0.weatheringGrade']);
    const shares = await put({
      ground: ground({
        units: [
          { name: 'a', sharePercent: 60, weatheringGrade: 'WII', strengthGrade: 'R4' },
          { name: 'b', sharePercent: 30, weatheringGrade: 'WII', strengthGrade: 'R4' },
        ],
      }),
    }).expect(400);
    expect(shares.body.fields['ground.units']).toMatch(/add up to 90 %/);
    const governing = await put({
      qInput: { rqd: 40, jn: 9, jr: 1, ja: 8, jw: 1, srf: 2.5, governingJointId: randomUUID() },
    }).expect(400);
    expect(Object.keys(governing.body.fields as object)).toEqual(['qInput.governingJointId']);
  });
});
