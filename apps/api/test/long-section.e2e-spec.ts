// The long section of a heading (issue 16 item 2), read on the seeded demo: its rounds along chainage and
// the traces of the demo's fault on the vertical section through the axis.
import type { INestApplication } from '@nestjs/common';
import { assessedHeading } from '@roundbook/domain';
import { driveOf, planeCrossings } from '@roundbook/geomath';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource, In } from 'typeorm';
import { Heading } from '../src/modules/headings/heading.entity';
import { Project } from '../src/modules/projects/project.entity';
import { Joint } from '../src/modules/rounds/joint.entity';
import { Round } from '../src/modules/rounds/round.entity';
import { signIn, type Role } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;

describe('Long section of a heading (e2e, seeded demo)', () => {
  let app: INestApplication;
  let ds: DataSource;
  let http: App;
  let tokens: Record<Role, string>;
  let heading: Heading;
  let url: string;

  beforeAll(async () => {
    app = await createTestApp();
    ds = app.get(DataSource);
    http = app.getHttpServer() as App;
    tokens = await signIn(http, ['viewer']);
    const project = await ds.getRepository(Project).findOneByOrFail({ code: 'BRH' });
    heading = await ds.getRepository(Heading).findOneByOrFail({ projectId: project.id, code: 'HR-U' });
    url = `/api/projects/${project.id}/headings/${heading.id}/long-section`;
  });

  afterAll(async () => {
    await app.close();
  });

  const read = async (): Promise<Body> => {
    const res = await request(http)
      .get(url)
      .set({ Authorization: `Bearer ${tokens.viewer}` });
    expect(res.status).toBe(200);
    return res.body as Body;
  };

  it('lists every round of the heading in chainage order, each with its Q, RMR89 and the length it covers', async () => {
    const body = await read();
    const rounds = await ds.getRepository(Round).find({ where: { headingId: heading.id } });
    expect(body.rounds).toHaveLength(rounds.length);
    const chainages = body.rounds.map((r: Body) => r.faceChainage as number);
    expect(chainages).toEqual([...chainages].sort((a, b) => a - b));
    for (const r of body.rounds as Body[]) {
      const db = rounds.find((x) => x.id === r.id)!;
      expect(r.q).toBe(db.q);
      expect(r.rmr).toBe(db.rmr);
      // Driven with increasing chainage: each round runs from its previous face forward.
      expect(r.faceChainage).toBeGreaterThan(r.fromChainage);
      if (db.ground.overbreakM3 !== null && db.roundLength) {
        expect(r.overbreakM3PerM).toBeCloseTo(db.ground.overbreakM3 / (r.faceChainage - r.fromChainage), 3);
      }
    }
    expect(body.rounds.some((r: Body) => r.rockUnit)).toBe(true);
    expect(body.crownHeight).toBeCloseTo(5.4 - 2.7, 6);
  });

  it("draws the demo's fault from its latest face, its crown and invert crossings those of geomath planeCrossings (methods.md §6)", async () => {
    const body = await read();
    const faults = await ds
      .getRepository(Joint)
      .find({ where: { headingId: heading.id, kind: In(['fault', 'shear-zone']) } });
    expect(faults.length).toBeGreaterThan(0);
    const traces = body.traces as Body[];
    expect(traces.length).toBeGreaterThan(0);
    // One trace per feature: every fault of the demo is linked to its first observation.
    const keys = new Set(faults.map((j) => j.sameAsJointId ?? j.id));
    expect(traces).toHaveLength(keys.size);
    for (const t of traces) {
      const joint = faults.find((j) => j.id === t.jointId)!;
      const round = await ds.getRepository(Round).findOneByOrFail({ id: joint.roundId });
      const c = planeCrossings({
        plane: { dipDirection: joint.dipDirection!, dip: joint.dip! },
        chainage: round.faceChainage,
        offset: joint.faceOffset ?? { right: 0, up: 0 },
        drive: driveOf(assessedHeading(heading, round.stage, round.faceChainage)),
        crownHeight: heading.profileHeight - heading.axisHeight,
        invertDepth: heading.axisHeight,
        halfWidth: heading.profileWidth / 2,
        chainageSense: heading.chainageSense,
      });
      expect(t.crownChainage).toBeCloseTo(c.crown!, 3);
      expect(t.invertChainage).toBeCloseTo(c.invert!, 3);
      // Independent of planeCrossings: on a near-level drive the trace on the vertical section through the
      // axis dips at the apparent dip, tan α = tan δ · |cos(dip direction − drive)| [common practice], so the
      // crown and invert crossings lie profile height / tan α apart (0.4 % gradient: within 1 %).
      const drive = assessedHeading(heading, round.stage, round.faceChainage).driveTrend;
      const rad = Math.PI / 180;
      const tanApparent =
        Math.tan(joint.dip! * rad) * Math.abs(Math.cos((joint.dipDirection! - drive) * rad));
      const apart = Math.abs(t.crownChainage - t.invertChainage);
      expect(apart).toBeGreaterThan((heading.profileHeight / tanApparent) * 0.99);
      expect(apart).toBeLessThan((heading.profileHeight / tanApparent) * 1.01);
      // Measured from today's face, and the coming round that reaches it: ⌈distance / round length⌉.
      expect(t.crownAhead).toBeCloseTo(t.crownChainage - body.faceChainage, 3);
      if (t.crownAhead > 0.001) {
        expect(t.crownRoundsAhead).toBe(Math.ceil(t.crownAhead / body.lookAheadRoundLength - 1e-9));
      } else {
        expect(t.crownRoundsAhead).toBeNull();
      }
    }
  });

  it('refuses a heading of another project and people outside the project', async () => {
    const other = await request(http)
      .get(url.replace(heading.id, '00000000-0000-4000-8000-000000000000'))
      .set({ Authorization: `Bearer ${tokens.viewer}` });
    expect(other.status).toBe(404);
    const anonymous = await request(http).get(url);
    expect(anonymous.status).toBe(401);
  });
});
