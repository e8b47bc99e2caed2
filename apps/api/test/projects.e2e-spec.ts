// Projects: a new project from scratch, its settings and its audit trail. Each test file makes its own
// project (factories.ts), so it needs nothing from the demo seed.
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { hashPassword } from '../src/modules/users/password';
import { User } from '../src/modules/users/user.entity';
import { latestAudit, makeProject, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const run = String(Date.now() % 1e6);

describe('Projects (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;

  const lastAudit = (entityId: string) => latestAudit(app, entityId);

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    p = await makeProject(app, { code: `PJ${run}` });
  });

  afterAll(async () => {
    await app.close();
  });

  it('lets a signed-in person create a project and become its admin; a taken code lands on the field', async () => {
    const ds = app.get(DataSource);
    const lead = await ds.getRepository(User).save({
      email: `lead.${run}@roundbook.test`,
      name: 'Invented Project Lead',
      passwordHash: await hashPassword('a-long-enough-pw'),
    });
    const token = (
      (
        await request(http)
          .post('/api/auth/login')
          .send({ email: lead.email, password: 'a-long-enough-pw' })
          .expect(200)
      ).body as Body
    ).accessToken as string;
    const bad = await request(http)
      .post('/api/projects')
      .set('Authorization', `Bearer ${token}`)
      .send({ code: `PJ${run}`, name: 'Clash', timeZone: 'Atlantis/Deep' })
      .expect(400);
    expect(bad.body.fields).toEqual({ timeZone: expect.stringMatching(/time zone/) });
    const taken = await request(http)
      .post('/api/projects')
      .set('Authorization', `Bearer ${token}`)
      .send({ code: `PJ${run}`, name: 'Clash', timeZone: 'Europe/Oslo' })
      .expect(409);
    expect(taken.body.fields).toEqual({ code: 'This code is already used.' });
    const created = await request(http)
      .post('/api/projects')
      .set('Authorization', `Bearer ${token}`)
      .send({
        code: `NP${run}`,
        name: 'Invented pressure shaft',
        client: 'Invented client',
        timeZone: 'America/Lima',
        groundScale: 'iso-14689',
      })
      .expect(201);
    expect(created.body).toMatchObject({
      role: 'admin',
      headings: [],
      distributionList: [],
      groundScale: 'iso-14689',
      qTableEdition: '2015',
    });
    const mine = await request(http).get('/api/projects').set('Authorization', `Bearer ${token}`).expect(200);
    expect((mine.body as Body[]).map((x) => [x.code, x.role])).toEqual([[`NP${run}`, 'admin']]);
    // The new admin can set it up straight away.
    await request(http)
      .post(`/api/projects/${created.body.id}/headings`)
      .set('Authorization', `Bearer ${token}`)
      .send({
        code: 'MAIN',
        name: 'Main drive',
        startChainage: 0,
        driveTrend: 10,
        gradientPercent: 12,
        profileShape: 'd-shaped',
        profileWidth: 4,
        profileHeight: 4.5,
        axisHeight: 2,
        stages: ['full-face'],
        plannedRoundLength: 2.5,
      })
      .expect(201);
  });

  it('keeps a distribution list of valid addresses and names a bad one', async () => {
    const current = (await request(http).get(p.base).set(p.as('admin')).expect(200)).body as Body;
    expect(current.distributionList).toEqual([]);
    const bad = await request(http)
      .patch(p.base)
      .set(p.as('admin'))
      .send({ distributionList: ['ok@site.test', 'not-an-address'], version: current.version })
      .expect(400);
    expect(Object.keys(bad.body.fields as object)).toEqual(['distributionList']);
    await request(http)
      .patch(p.base)
      .set(p.as('engineer'))
      .send({ distributionList: ['ok@site.test'], version: current.version })
      .expect(403);
    const ok = await request(http)
      .patch(p.base)
      .set(p.as('admin'))
      .send({
        distributionList: ['shift-office@site.test', 'night-shift@site.test'],
        version: current.version,
      })
      .expect(200);
    expect(ok.body.distributionList).toEqual(['shift-office@site.test', 'night-shift@site.test']);
    expect(await lastAudit(p.projectId)).toMatchObject({
      action: 'update',
      after: { distributionList: expect.arrayContaining(['night-shift@site.test']) },
    });
  });

  it('lists the audit trail with the names of the people who changed things', async () => {
    const res = await request(http).get(`${p.base}/audit?limit=5`).set(p.as('viewer')).expect(200);
    expect((res.body as Body[]).length).toBeGreaterThan(0);
    expect((res.body as Body[])[0]).toMatchObject({
      actorName: `Test admin PJ${run}`,
      entityType: 'project',
    });
  });
});
