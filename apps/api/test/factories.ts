import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { AuditEvent } from '../src/modules/audit/audit-event.entity';
import { ProjectMember } from '../src/modules/projects/project-member.entity';
import { hashPassword } from '../src/modules/users/password';
import { User } from '../src/modules/users/user.entity';
import { DEMO_PASSWORD } from './test-app';

/** The password of the users a test project makes for itself. */
export const TEST_PASSWORD = 'rb-test-2026-pw';
const ROLES = ['admin', 'geologist', 'engineer', 'supervisor', 'viewer'] as const;

type Body = Record<string, any>;
export type Role = 'admin' | 'geologist' | 'engineer' | 'supervisor' | 'viewer';

/** Signs in users of each role: the demo users (from the seed) or those of a test project (by e-mail prefix). */
export async function signIn(
  http: App,
  roles: readonly Role[],
  emailOf: (role: Role) => string = (role) => `${role}@roundbook.test`,
  password = DEMO_PASSWORD,
): Promise<Record<Role, string>> {
  const tokens = {} as Record<Role, string>;
  for (const role of roles) {
    tokens[role] = (
      (
        await request(http)
          .post('/api/auth/login')
          .send({ email: emailOf(role), password })
          .expect(200)
      ).body as Body
    ).accessToken as string;
  }
  return tokens;
}

export interface TestProject {
  projectId: string;
  /** The e-mail of this project's own user of each role. */
  emailOf: (role: Role) => string;
  base: string;
  headingId: string;
  classes: Body[];
  as: (role: Role) => { Authorization: string };
}

/**
 * A project of the test file's own (so tiers and files do not depend on the demo seed's data or order):
 * its own five users (one per role), made by its admin through the API, one heading, a small
 * support-class library and the given trigger rules.
 */
export async function makeProject(
  app: INestApplication,
  options: {
    code: string;
    heading?: Partial<Record<string, unknown>>;
    classes?: Array<Record<string, unknown>>;
    rules?: Array<Record<string, unknown>>;
  },
): Promise<TestProject> {
  const http = app.getHttpServer() as App;
  const ds = app.get(DataSource);
  const emailOf = (role: Role) => `${role}.${options.code.toLowerCase()}@roundbook.test`;
  const passwordHash = await hashPassword(TEST_PASSWORD);
  const users = new Map<Role, User>();
  for (const role of ROLES) {
    users.set(
      role,
      await ds
        .getRepository(User)
        .save({ email: emailOf(role), name: `Test ${role} ${options.code}`, passwordHash }),
    );
  }
  const tokens = await signIn(http, ROLES, emailOf, TEST_PASSWORD);
  const as = (role: Role) => ({ Authorization: `Bearer ${tokens[role]}` });
  const project = (
    await request(http)
      .post('/api/projects')
      .set(as('admin'))
      .send({ code: options.code, name: `Invented test project ${options.code}`, timeZone: 'Europe/Zurich' })
      .expect(201)
  ).body as Body;
  const projectId = project.id as string;
  for (const role of ['geologist', 'engineer', 'supervisor', 'viewer'] as const) {
    await ds.getRepository(ProjectMember).save({ projectId, userId: users.get(role)!.id, role });
  }
  const base = `/api/projects/${projectId}`;
  const heading = (
    await request(http)
      .post(`${base}/headings`)
      .set(as('admin'))
      .send({
        code: 'TH',
        name: 'Invented test heading',
        startChainage: 1000,
        chainageStyle: 'km+m',
        chainageDecimals: 1,
        driveTrend: 60,
        gradientPercent: 0,
        profileShape: 'circular',
        profileWidth: 6,
        profileHeight: 6,
        axisHeight: 3,
        stages: ['full-face'],
        plannedRoundLength: 3,
        ...options.heading,
      })
      .expect(201)
  ).body as Body;
  const classes: Body[] = [];
  for (const c of options.classes ?? [
    { code: 'C1', name: 'Spot bolts', maxRoundLength: 4, qMin: 10 },
    { code: 'C2', name: 'Pattern bolts and mesh', maxRoundLength: 3, qMin: 1, qMax: 10 },
    { code: 'C3', name: 'Sprayed concrete and bolts', maxRoundLength: 2, qMin: 0.1, qMax: 1 },
  ]) {
    const library = (await request(http).post(`${base}/support-classes`).set(as('admin')).send(c).expect(201))
      .body as Body;
    classes.splice(0, classes.length, ...(library.classes as Body[]));
  }
  for (const rule of options.rules ?? []) {
    await request(http)
      .post(`${base}/trigger-rules`)
      .set(as('admin'))
      .send({ action: 'Tell the engineer.', ownerRole: 'engineer', timeAllowedHours: 4, ...rule })
      .expect(201);
  }
  return { projectId, emailOf, base, headingId: heading.id as string, classes, as };
}

/** A complete ground record for a test round. */
export const testGround = {
  units: [{ name: 'Invented banded gneiss', sharePercent: 100, weatheringGrade: 'WII', strengthGrade: 'R4' }],
  pointLoadIs50: 4,
  pointLoadFactor: 22,
  inflowLpm: 3,
  inflowLengthM: 3,
  waterDescription: '',
  overbreakM3: 0.5,
  notes: '',
};
/** A joint record for a test round, read from its orientation text. */
export const testJoint = (orientationText: string, extra: Body = {}) => ({
  kind: 'joint',
  orientationText,
  notation: 'dip-direction/dip',
  setLabel: null,
  spacingM: 0.5,
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
  ...extra,
});
/** Q = 60/4 × 1.5/2 × 1/1 = 11.25 (Barton et al. 1974) [computed here]: inside C1 (Q ≥ 10). */
export const testQInput = { rqd: 60, jn: 4, jr: 1.5, ja: 2, jw: 1, srf: 1 };
/** The whole body of a save of round `r` (as the API returned it), with `extra` on top. */
export const saveBody = (r: Body, extra: Body = {}) => ({
  version: r.version,
  faceChainage: r.faceChainage,
  previousChainage: r.previousChainage,
  roundLength: r.roundLength,
  shiftDate: r.shiftDate,
  shift: r.shift,
  distantParts: '',
  ground: testGround,
  joints: [],
  qInput: testQInput,
  rmrInput: null,
  gsiObserved: null,
  recommendedClassId: null,
  nextRoundLength: null,
  recommendationReason: '',
  ...extra,
});

/** The newest audit event of an entity (what the last change recorded). */
export async function latestAudit(app: INestApplication, entityId: string): Promise<AuditEvent> {
  const events = await app
    .get(DataSource)
    .getRepository(AuditEvent)
    .find({ where: { entityId }, order: { createdAt: 'DESC' }, take: 1 });
  return events[0];
}
