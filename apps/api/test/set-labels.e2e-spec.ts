// Issue 12, item 3: sets keep their names along the heading (the demo's HR-U, seeded invented scenario).
import { readFileSync } from 'node:fs';
import type { INestApplication } from '@nestjs/common';
import type { RoundAssessment } from '@roundbook/domain';
import { angleBetweenPlanes } from '@roundbook/geomath';
import type { Plane } from '@roundbook/geomath';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { scenarioFile } from '../src/database/seed/demo-seed';
import { Heading } from '../src/modules/headings/heading.entity';
import { Project } from '../src/modules/projects/project.entity';
import { Joint } from '../src/modules/rounds/joint.entity';
import { Round } from '../src/modules/rounds/round.entity';
import { signIn, testJoint, type Role } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
/** Acute angle between two planes' poles, degrees (geomath angleBetweenPlanes, methods.md). */
const apart = (a: Plane, b: Plane) => angleBetweenPlanes(a, b);

describe('Sets keep their names along the heading (e2e, demo HR-U)', () => {
  let app: INestApplication;
  let ds: DataSource;
  let http: App;
  let tokens: Record<Role, string>;
  // The scenario's own sets of HR-U (fixtures/demo/scenario.json): what each face was drawn from.
  const plan = (
    JSON.parse(readFileSync(scenarioFile(), 'utf8')) as {
      rounds: Array<{ heading: string; sets: Array<Plane & { label: string }> }>;
    }
  ).rounds.find((r) => r.heading === 'HR-U')!.sets;
  const nearestPlanSet = (mean: Plane) =>
    plan.reduce((best, s) => (apart(s, mean) < apart(best, mean) ? s : best)).label;

  beforeAll(async () => {
    app = await createTestApp();
    ds = app.get(DataSource);
    http = app.getHttpServer() as App;
    tokens = await signIn(http, ['geologist']);
  });
  afterAll(async () => {
    await app.close();
  });

  const hrU = async () => {
    const project = await ds.getRepository(Project).findOneByOrFail({ code: 'BRH' });
    const heading = await ds.getRepository(Heading).findOneByOrFail({ projectId: project.id, code: 'HR-U' });
    const rounds = await ds.getRepository(Round).find({
      where: { headingId: heading.id },
      order: { roundNumber: 'ASC' },
    });
    return { project, heading, rounds };
  };

  it('gives each label one set of the scenario on all 18 rounds: no label swaps between rounds (by size alone S1 named two different sets)', async () => {
    const { rounds } = await hrU();
    expect(rounds).toHaveLength(18);
    // label → the scenario set it named → the rounds where it did.
    const seen = new Map<string, Record<string, number[]>>();
    for (const r of rounds) {
      const sets = (r.assessment as RoundAssessment).sets.sets;
      expect(sets.length).toBeGreaterThanOrEqual(2);
      for (const s of sets) {
        const named = seen.get(s.label) ?? {};
        (named[nearestPlanSet(s.mean)] ??= []).push(r.roundNumber);
        seen.set(s.label, named);
      }
    }
    expect(seen.size).toBe(3);
    // A failure shows the rounds where a label named another set (before matching, S1 named the scenario's S1 and S3).
    for (const named of seen.values()) {
      const first = Object.keys(named)[0];
      expect(named).toEqual({ [first]: named[first] });
    }
  });

  it('stores on every joint the label its round matched (the history chart and reports read it)', async () => {
    const { rounds } = await hrU();
    const joints = await ds.getRepository(Joint).find({ where: { roundId: rounds[8].id } });
    const assessment = rounds[8].assessment as RoundAssessment;
    for (const j of joints.filter((x) => x.kind !== 'fault'))
      expect(j.setLabel).toBe(assessment.sets.membership[j.id] || null);
    // What the labels were matched against is kept with the assessment (the browser reads it back).
    expect(assessment.sets.matching?.rule).toMatch(/20°/);
    expect(assessment.sets.matching?.headingSets.map((s) => s.label).sort()).toEqual(['S1', 'S2', 'S3']);
  });

  it('keeps the labels when the draft round is saved again, and a joint far from every set stays random', async () => {
    const { project, rounds } = await hrU();
    const draft = rounds[17];
    expect(draft.status).toBe('draft');
    const as = { Authorization: `Bearer ${tokens.geologist}` };
    const got = (
      await request(http).get(`/api/projects/${project.id}/rounds/${draft.id}`).set(as).expect(200)
    ).body as Body;
    const before = new Map<string, string>(
      (got.assessment.sets.sets as Body[]).map((s) => [nearestPlanSet(s.mean as Plane), s.label as string]),
    );
    // The round's joints as they are (the fields of a saved joint record), and one more.
    const fields = [...Object.keys(testJoint('')), 'setOverride'];
    const joints = (got.joints as Body[]).map((j) => ({
      id: j.id as string,
      ...Object.fromEntries(fields.map((k) => [k, j[k]])),
    }));
    // A steep joint to the south-west (computed here: ≥ 60° from each of the three sets' poles in the scenario).
    for (const s of plan) expect(apart(s, { dipDirection: 220, dip: 80 })).toBeGreaterThan(60);
    const res = await request(http)
      .put(`/api/projects/${project.id}/rounds/${draft.id}`)
      .set(as)
      .send({
        version: got.version as number,
        joints: [...joints, testJoint('220/80', { setOverride: false })],
      });
    expect({ status: res.status, body: res.status === 200 ? null : (res.body as Body) }).toEqual({
      status: 200,
      body: null,
    });
    const after = res.body as Body;
    for (const s of after.assessment.sets.sets as Body[])
      expect(s.label).toBe(before.get(nearestPlanSet(s.mean as Plane)));
    const flat = (after.joints as Body[]).find((j) => j.orientationText === '220/80')!;
    expect(after.assessment.sets.membership[flat.id]).toBe('');
  });
});
