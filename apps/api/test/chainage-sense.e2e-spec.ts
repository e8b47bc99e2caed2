// Issue 10, items 8–10 through the API on a project of its own: a heading driven against the chainage on a
// curve. Ten rounds with positive lengths, a look-ahead whose chainages decrease ahead of the face, the drive
// at the face taken from the arc (in the round's assessment and in the rule try-out alike), and the Board
// following the sense and the latest evaluated round.
import { randomUUID } from 'node:crypto';
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { makeProject, saveBody, testJoint, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const code = `CS${String(Date.now() % 1e6)}`;
const rad = Math.PI / 180;

describe('Chainage sense on a curved heading (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    // From an intermediate adit at 2+000, driven toward 240 against the chainage, straight into a 25 m
    // right-hand arc (an invented tight curve, so that ten rounds turn the drive by 30/25 rad = 68.75°).
    p = await makeProject(app, {
      code,
      heading: {
        startChainage: 2000,
        driveTrend: 240,
        chainageSense: 'decreasing',
        alignmentSegments: [{ length: 100, radius: 25, side: 'right' }],
      },
      rules: [
        { watch: 'crown-crossing-within', threshold: 20, level: 'amber' },
        { watch: 'adverse-orientation', level: 'amber' },
      ],
    });
  });

  afterAll(async () => {
    await app.close();
  });

  const next = async (): Promise<Body> =>
    (
      await request(http)
        .get(`${p.base}/headings/${p.headingId}/rounds/next?stage=full-face`)
        .set(p.as('geologist'))
        .expect(200)
    ).body as Body;
  const open = async (faceChainage: number): Promise<Body> =>
    (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage })
        .expect(201)
    ).body as Body;
  const card = async (): Promise<Body> => {
    const projects = (await request(http).get('/api/projects').set(p.as('engineer')).expect(200))
      .body as Body[];
    return (projects.find((x) => x.id === p.projectId)!.headings as Body[]).find(
      (h) => h.id === p.headingId,
    )!;
  };

  let last: Body;

  it('records ten rounds against the chainage with positive lengths and previous faces by the sense [common practice of route surveying]', async () => {
    const faces: number[] = [];
    for (let i = 0; i < 10; i++) {
      const n = await next();
      expect(n.suggestedFaceChainage).toBeCloseTo(n.previousChainage - 3, 9);
      const r = await open(n.suggestedFaceChainage as number);
      expect(r.previousChainage).toBeCloseTo(2000 - 3 * i, 9);
      expect(r.roundLength).toBe(3);
      faces.push(r.faceChainage as number);
      if (i < 9) continue;
      // The last face: a set striking along the drive there, and a fault dipping back toward the tunnel.
      const faultId = randomUUID();
      last = (
        await request(http)
          .put(`${p.base}/rounds/${r.id}`)
          .set(p.as('geologist'))
          .send(
            saveBody(r, {
              joints: [
                testJoint('035/70', { id: randomUUID() }),
                testJoint('037/71', { id: randomUUID() }),
                testJoint('128.8/60', {
                  id: faultId,
                  kind: 'fault',
                  spacingM: null,
                  persistenceM: 20,
                  apertureMm: 30,
                  jr: 1,
                  ja: 8,
                  infill: 'soft clay gouge',
                  thicknessM: 0.3,
                }),
              ],
              setParameters: { windowM: 0, count: 1 },
            }),
          )
          .expect(200)
      ).body as Body;
      expect(last.roundLength).toBe(3);
    }
    expect(faces).toEqual([1997, 1994, 1991, 1988, 1985, 1982, 1979, 1976, 1973, 1970]);
  });

  it('gives look-ahead chainages that decrease ahead of the face: the fault reaches the crown 3/tan 60° = 1.732 m ahead, at 1970 − 1.732 (methods.md §6) [computed here]', () => {
    const reach = (last.assessment.lookAhead as Body[])[0];
    expect(reach.distance.crown).toBeCloseTo(3 / Math.tan(60 * rad), 2);
    expect(reach.chainage.crown).toBeCloseTo(1970 - 3 / Math.tan(60 * rad), 2);
    expect(reach.chainage.crown).toBeLessThan(1970);
    // The invert crossing lies behind the face: a larger chainage on this heading.
    expect(reach.chainage.invert).toBeGreaterThan(1970);
  });

  it('judges the set against the drive at the face (240° + 30/25 rad = 308.75°), not at the start; the rule try-out reads it the same way (Bieniawski 1989 Table 4.1 F; Roundbook 30°/60° rule) [computed here]', async () => {
    // The set of 035/70 and 037/71 strikes about 306°: 3° from the drive at the face → parallel, dip 45–90 →
    // very unfavourable. At the start's 240° it would strike 66° across the drive → perpendicular, against
    // the dip → fair.
    const adverse = (last.triggerFirings as Body[]).find((f) => /adverse/.test(f.summary as string));
    expect(adverse?.detail).toMatch(/S1 \(03[5-7]\/7[01]\) is very unfavourable for the drive/);
    const preview = (
      await request(http)
        .post(`${p.base}/trigger-rules/preview`)
        .set(p.as('engineer'))
        .send({
          watch: 'adverse-orientation',
          level: 'amber',
          action: 'Review.',
          ownerRole: 'engineer',
          timeAllowedHours: 4,
        })
        .expect(200)
    ).body as Body;
    // Before: the try-out read the heading's start drive (240°) and said "fault 1 (129/60) is very
    // unfavourable for the drive", missing the set the round's own assessment flagged.
    expect((preview.matches as Body[]).map((m) => m.detail)).toEqual([adverse!.detail]);
  });

  it('lists the furthest face first and puts the furthest face on the Board: the lowest chainage; the Board keeps the latest evaluated level (not green) when a newer round has no data yet', async () => {
    const page = (
      await request(http).get(`${p.base}/headings/${p.headingId}/rounds`).set(p.as('viewer')).expect(200)
    ).body as Body;
    expect((page.items as Body[]).map((r) => r.faceChainage).slice(0, 3)).toEqual([1970, 1973, 1976]);
    expect(last.triggerLevel).toBe('amber');
    // A newer round opened at 1967 with nothing recorded: its rules are not evaluated, it has no level.
    const empty = await open(1967);
    expect(empty.triggerLevel).toBeNull();
    // All rounds are drafts here, so the Board shows the draft face apart: the furthest along the drive.
    expect(await card()).toMatchObject({ draftFaceChainage: 1967, triggerLevel: 'amber' });
  });
});
