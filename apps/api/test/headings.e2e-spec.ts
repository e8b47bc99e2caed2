// Setup, headings: each test file makes its own project (factories.ts), so it needs nothing from the demo seed.
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { latestAudit, makeProject, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const code = `HD${String(Date.now() % 1e6)}`;

describe('Setup: headings (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;

  const lastAudit = (entityId: string) => latestAudit(app, entityId);

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    p = await makeProject(app, {
      code,
      heading: { profileShape: 'horseshoe', profileHeight: 6.2, startEasting: 4120, startNorthing: 7310 },
    });
  });

  afterAll(async () => {
    await app.close();
  });

  const horseshoe = {
    code: 'AD-2',
    name: 'Adit 2 access',
    startChainage: 0,
    driveTrend: 45,
    gradientPercent: -8,
    profileShape: 'horseshoe',
    profileWidth: 6,
    profileHeight: 6.2,
    axisHeight: 3.1,
    stages: ['top-heading', 'bench'],
    plannedRoundLength: 3,
  };

  it('lets every member read the headings, with their alignment and profile', async () => {
    const res = await request(http).get(`${p.base}/headings`).set(p.as('viewer')).expect(200);
    expect((res.body as Body[]).map((h) => h.code)).toEqual(['TH']);
    expect((res.body as Body[])[0]).toMatchObject({
      driveTrend: 60,
      profileShape: 'horseshoe',
      chainageStyle: 'km+m',
      startEasting: 4120,
    });
  });

  it('refuses non-admins with 403', async () => {
    for (const role of ['geologist', 'engineer', 'supervisor', 'viewer'] as const) {
      await request(http).post(`${p.base}/headings`).set(p.as(role)).send(horseshoe).expect(403);
    }
  });

  it('puts each server-side validation message on its field', async () => {
    const res = await request(http)
      .post(`${p.base}/headings`)
      .set(p.as('admin'))
      .send({ ...horseshoe, driveTrend: 360, stages: [], plannedRoundLength: 12 })
      .expect(400);
    expect(Object.keys(res.body.fields as object).sort()).toEqual([
      'driveTrend',
      'plannedRoundLength',
      'stages',
    ]);
    const axis = await request(http)
      .post(`${p.base}/headings`)
      .set(p.as('admin'))
      .send({ ...horseshoe, axisHeight: 7 })
      .expect(400);
    expect(axis.body.fields).toEqual({ axisHeight: expect.stringMatching(/within the height/) });
    const circle = await request(http)
      .post(`${p.base}/headings`)
      .set(p.as('admin'))
      .send({ ...horseshoe, profileShape: 'circular' })
      .expect(400);
    expect(circle.body.fields).toEqual({ profileHeight: expect.stringMatching(/equal width and height/) });
  });

  it('creates a heading, audits it, refuses a duplicate code, and updates with optimistic locking', async () => {
    const created = await request(http)
      .post(`${p.base}/headings`)
      .set(p.as('admin'))
      .send(horseshoe)
      .expect(201);
    const h = created.body as Body;
    expect(h).toMatchObject({ code: 'AD-2', version: 1, chainageDecimals: 1 });
    expect(await lastAudit(h.id as string)).toMatchObject({
      action: 'create',
      after: expect.objectContaining({ code: 'AD-2', driveTrend: 45 }),
    });
    const dup = await request(http).post(`${p.base}/headings`).set(p.as('admin')).send(horseshoe).expect(409);
    expect(dup.body.fields).toEqual({ code: expect.any(String) });

    const updated = await request(http)
      .patch(`${p.base}/headings/${h.id}`)
      .set(p.as('admin'))
      .send({ driveTrend: 47.5, version: 1 })
      .expect(200);
    expect(updated.body).toMatchObject({ driveTrend: 47.5, version: 2 });
    expect(await lastAudit(h.id as string)).toMatchObject({
      action: 'update',
      before: { driveTrend: 45 },
      after: { driveTrend: 47.5 },
    });
    const stale = await request(http)
      .patch(`${p.base}/headings/${h.id}`)
      .set(p.as('admin'))
      .send({ name: 'Old screen', version: 1 })
      .expect(409);
    expect(stale.body).toMatchObject({
      code: 'STALE_VERSION',
      details: { current: { driveTrend: 47.5, version: 2 } },
    });
  });

  it('asks for confirmation before changing the drive of a heading with rounds, then applies it', async () => {
    await request(http)
      .post(`${p.base}/headings/${p.headingId}/rounds`)
      .set(p.as('geologist'))
      .send({ stage: 'full-face', faceChainage: 1003 })
      .expect(201);
    const th = (
      (await request(http).get(`${p.base}/headings`).set(p.as('admin')).expect(200)).body as Body[]
    ).find((h) => h.code === 'TH')!;
    const ask = await request(http)
      .patch(`${p.base}/headings/${th.id}`)
      .set(p.as('admin'))
      .send({ driveTrend: 65, version: th.version })
      .expect(409);
    expect(ask.body).toMatchObject({
      code: 'NEEDS_CONFIRMATION',
      details: { fields: ['driveTrend'], rounds: 1 },
    });
    expect(ask.body.message).toMatch(/drive direction/);
    const done = await request(http)
      .patch(`${p.base}/headings/${th.id}`)
      .set(p.as('admin'))
      .send({ driveTrend: 65, version: th.version, confirmRecompute: true })
      .expect(200);
    expect(done.body.driveTrend).toBe(65);
    // A name change needs no confirmation.
    await request(http)
      .patch(`${p.base}/headings/${th.id}`)
      .set(p.as('admin'))
      .send({ name: 'Renamed test heading', version: done.body.version })
      .expect(200);
  });
});
