// Issue 10, item 11: the demo as a practitioner would read it (the seeded invented scenario).
import type { INestApplication } from '@nestjs/common';
import { jvFromSpacings, qClass, rqdFromJv } from '@roundbook/geomath';
import { DataSource, LessThanOrEqual } from 'typeorm';
import { Heading } from '../src/modules/headings/heading.entity';
import { Project } from '../src/modules/projects/project.entity';
import { Joint } from '../src/modules/rounds/joint.entity';
import { Round } from '../src/modules/rounds/round.entity';
import { createTestApp } from './test-app';

describe('The demo reads true (e2e, seeded scenario)', () => {
  let app: INestApplication;
  let ds: DataSource;
  const roundsOf = async (code: string, count: number) => {
    const project = await ds.getRepository(Project).findOneByOrFail({ code: 'BRH' });
    const heading = await ds.getRepository(Heading).findOneByOrFail({ projectId: project.id, code });
    const rounds = await ds.getRepository(Round).find({
      where: { headingId: heading.id, roundNumber: LessThanOrEqual(count) },
      order: { roundNumber: 'ASC' },
    });
    return { heading, rounds };
  };

  beforeAll(async () => {
    app = await createTestApp();
    ds = app.get(DataSource);
  });

  afterAll(async () => {
    await app.close();
  });

  it('drives the two headings in opposite directions from Adit 2: HR-D against the chainage, every round length positive [common practice]', async () => {
    const up = await roundsOf('HR-U', 18);
    const down = await roundsOf('HR-D', 10);
    expect(up.heading.chainageSense).toBe('increasing');
    expect(down.heading.chainageSense).toBe('decreasing');
    expect(down.rounds.map((r) => r.faceChainage)).toEqual([
      2447, 2444, 2441, 2438, 2435, 2432, 2429, 2426, 2423, 2420,
    ]);
    for (const r of [...up.rounds, ...down.rounds]) {
      expect(r.roundLength).toBeGreaterThan(0);
      expect(r.mappedAt.getTime()).toBeLessThan(Date.now());
    }
  });

  it('takes Jr/Ja of the fault rounds from the clay-gouge fault, named as governing: Q extremely poor where the gouge is thick (Barton et al. 1974; NGI 2015 Q classes)', async () => {
    const { rounds } = await roundsOf('HR-U', 18);
    const fault = rounds.filter((r) => r.roundNumber >= 13);
    for (const r of fault) {
      expect(r.qInput).toMatchObject({ jr: 1 });
      expect([8, 13]).toContain(r.qInput!.ja);
      const governing = await ds.getRepository(Joint).findOneByOrFail({ id: r.qInput!.governingJointId! });
      expect(governing).toMatchObject({ kind: 'fault', jr: 1, ja: r.qInput!.ja });
      expect(r.q!).toBeLessThan(1);
    }
    expect(fault.filter((r) => qClass(r.q!) === 'extremely poor').length).toBeGreaterThan(0);
    expect(fault.some((r) => r.triggerLevel === 'red')).toBe(true);
  });

  it('agrees with itself: RQD from Jv, Is50 × factor within the strength grade, most good-ground rounds green (Palmström 1982; ISRM 1981, from memory)', async () => {
    const { rounds } = await roundsOf('HR-U', 18);
    for (const r of rounds) {
      // Three sets at the recorded spacing: Jv = 3/s, RQD = 115 − 3.3 Jv (Palmström 1982), capped 0–100.
      const s = r.rmrInput!.spacingM;
      expect(r.qInput!.rqd).toBe(Math.round(rqdFromJv(jvFromSpacings([s, s, s]), 1982)));
      const warnings = r.assessment!.warnings.join(' ');
      expect(warnings).not.toMatch(/point load gives/);
      expect(warnings).not.toMatch(/not a value of the/);
    }
    const good = rounds.filter((r) => r.roundNumber < 13);
    expect(good.filter((r) => r.triggerLevel === 'green').length).toBeGreaterThan(good.length / 2);
  });
});
