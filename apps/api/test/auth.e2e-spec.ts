import type { INestApplication } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { AuditEvent } from '../src/modules/audit/audit-event.entity';
import { ProjectMember } from '../src/modules/projects/project-member.entity';
import { Project } from '../src/modules/projects/project.entity';
import { hashPassword } from '../src/modules/users/password';
import { User } from '../src/modules/users/user.entity';
import { makeProject, TEST_PASSWORD, type Role } from './factories';
import { createTestApp } from './test-app';

describe('sign-in, roles and project access (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  const tokens: Record<string, string> = {};
  let projectId: string;
  let otherProjectId: string;

  let emailOf: (role: Role) => string;
  const login = (email: string, password = TEST_PASSWORD) =>
    request(http).post('/api/auth/login').send({ email, password });

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    // A project of this file's own with one user per role (factories.ts); nothing from the demo seed.
    const own = await makeProject(app, { code: `AU${String(Date.now() % 1e6)}` });
    emailOf = own.emailOf;
    projectId = own.projectId;
    for (const role of ['admin', 'geologist', 'engineer', 'supervisor', 'viewer'] as const) {
      const res = await login(emailOf(role)).expect(200);
      tokens[role] = (res.body as { accessToken: string }).accessToken;
    }
    const ds = app.get(DataSource);
    // A second project this project's users are not members of, with its own member.
    const outsider = await ds.getRepository(User).save({
      email: `outsider-${Date.now()}@roundbook.test`,
      name: 'Invented Outsider',
      passwordHash: await hashPassword('outsider-pass-1'),
    });
    const other = await ds
      .getRepository(Project)
      .save({ code: `X${Date.now() % 1e6}`, name: 'Invented other project', distributionList: [] });
    otherProjectId = other.id;
    await ds.getRepository(ProjectMember).save({ projectId: other.id, userId: outsider.id, role: 'admin' });
    tokens.outsider = (
      (await login(outsider.email, 'outsider-pass-1').expect(200)).body as { accessToken: string }
    ).accessToken;
  });

  afterAll(async () => {
    await app.close();
  });

  it('signs in (e-mail in any case, spaces trimmed) and returns a token, its expiry and the user', async () => {
    const res = await login(`${emailOf('geologist').toUpperCase()} `).expect(200);
    expect(res.body).toMatchObject({ user: { email: emailOf('geologist') } });
    expect(typeof res.body.accessToken).toBe('string');
    expect(new Date(res.body.expiresAt as string).getTime()).toBeGreaterThan(Date.now());
    expect(res.body.user.passwordHash).toBeUndefined();
  });

  it('refuses a wrong password with 401 INVALID_CREDENTIALS and the same answer for an unknown e-mail', async () => {
    const wrong = await login(emailOf('geologist'), 'not-the-password').expect(401);
    const unknown = await login('nobody@roundbook.test', 'not-the-password').expect(401);
    expect(wrong.body).toEqual({ code: 'INVALID_CREDENTIALS', message: expect.any(String) });
    expect(unknown.body).toEqual(wrong.body);
  });

  it('answers a malformed sign-in with 400 and a message per field', async () => {
    const res = await request(http).post('/api/auth/login').send({ email: 'not-an-email' }).expect(400);
    expect(res.body.code).toBe('VALIDATION_FAILED');
    expect(Object.keys(res.body.fields as object).sort()).toEqual(['email', 'password']);
  });

  it('answers 401 without a token, with a bad token and with an expired token', async () => {
    const none = await request(http).get('/api/projects').expect(401);
    expect(none.body.code).toBe('UNAUTHENTICATED');
    await request(http).get('/api/projects').set('Authorization', 'Bearer not.a.token').expect(401);
    const jwt = app.get(JwtService);
    const expired = await jwt.signAsync({ sub: 'x', email: 'x', name: 'x' }, { expiresIn: '-10s' });
    const res = await request(http).get('/api/auth/me').set('Authorization', `Bearer ${expired}`).expect(401);
    expect(res.body.message).toMatch(/expired/i);
  });

  it('GET /api/auth/me returns the user and their memberships', async () => {
    const res = await request(http)
      .get('/api/auth/me')
      .set('Authorization', `Bearer ${tokens.engineer}`)
      .expect(200);
    expect(res.body).toMatchObject({
      email: emailOf('engineer'),
      memberships: [{ projectId, role: 'engineer' }],
    });
  });

  it('GET /api/projects lists only the caller’s projects with the caller’s role there', async () => {
    for (const role of ['admin', 'geologist', 'engineer', 'supervisor', 'viewer']) {
      const res = await request(http)
        .get('/api/projects')
        .set('Authorization', `Bearer ${tokens[role]}`)
        .expect(200);
      const list = res.body as Array<{ id: string; role: string; headings: unknown[] }>;
      expect(list.map((p) => [p.id, p.role])).toEqual([[projectId, role]]);
      expect(list[0].headings.map((h) => (h as { code: string }).code)).toEqual(['TH']);
    }
    const outsider = await request(http)
      .get('/api/projects')
      .set('Authorization', `Bearer ${tokens.outsider}`)
      .expect(200);
    expect((outsider.body as Array<{ id: string }>).map((p) => p.id)).toEqual([otherProjectId]);
  });

  it('answers 404 to a non-member, without revealing that the project exists', async () => {
    const res = await request(http)
      .get(`/api/projects/${projectId}`)
      .set('Authorization', `Bearer ${tokens.outsider}`)
      .expect(404);
    expect(res.body.code).toBe('NOT_FOUND');
    await request(http)
      .get(`/api/projects/${otherProjectId}`)
      .set('Authorization', `Bearer ${tokens.viewer}`)
      .expect(404);
    await request(http)
      .get('/api/projects/not-a-uuid')
      .set('Authorization', `Bearer ${tokens.viewer}`)
      .expect(404);
  });

  it('answers 403 to a viewer (and other non-admins) changing the project', async () => {
    for (const role of ['viewer', 'geologist', 'engineer', 'supervisor']) {
      const res = await request(http)
        .patch(`/api/projects/${projectId}`)
        .set('Authorization', `Bearer ${tokens[role]}`)
        .send({ client: 'changed', version: 1 })
        .expect(403);
      expect(res.body.code).toBe('FORBIDDEN');
    }
  });

  it('lets the admin change the project, records it in the audit trail, and refuses a stale version with 409', async () => {
    const ds = app.get(DataSource);
    const current = await request(http)
      .get(`/api/projects/${projectId}`)
      .set('Authorization', `Bearer ${tokens.admin}`)
      .expect(200);
    const version = current.body.version as number;
    const oldClient = current.body.client as string;
    const changed = await request(http)
      .patch(`/api/projects/${projectId}`)
      .set('Authorization', `Bearer ${tokens.admin}`)
      .send({ client: 'Invented client renamed', version })
      .expect(200);
    expect(changed.body).toMatchObject({ client: 'Invented client renamed', version: version + 1 });
    const events = await ds
      .getRepository(AuditEvent)
      .find({ where: { entityId: projectId }, order: { createdAt: 'DESC' } });
    expect(events[0]).toMatchObject({
      action: 'update',
      before: { client: oldClient },
      after: { client: 'Invented client renamed' },
    });
    const stale = await request(http)
      .patch(`/api/projects/${projectId}`)
      .set('Authorization', `Bearer ${tokens.admin}`)
      .send({ client: 'A second edit from an old screen', version })
      .expect(409);
    expect(stale.body).toMatchObject({ code: 'STALE_VERSION', details: { currentVersion: version + 1 } });
    // put it back for the other tests
    await request(http)
      .patch(`/api/projects/${projectId}`)
      .set('Authorization', `Bearer ${tokens.admin}`)
      .send({ client: oldClient, version: version + 1 })
      .expect(200);
  });

  it('rejects unknown fields and a bad time zone on the server, naming the field', async () => {
    const res = await request(http)
      .patch(`/api/projects/${projectId}`)
      .set('Authorization', `Bearer ${tokens.admin}`)
      .send({ timeZone: 'Mars/Olympus', version: 1, isAdmin: true })
      .expect(400);
    expect(Object.keys(res.body.fields as object).sort()).toEqual(['isAdmin', 'timeZone']);
  });
});

describe('sign-in rate limit (e2e)', () => {
  it('answers 429 after the configured number of attempts per minute', async () => {
    const app = await createTestApp((c) => ({ ...c, auth: { ...c.auth, loginRateLimit: 3 } }));
    const http = app.getHttpServer() as App;
    const email = `limited.${Date.now() % 1e6}@roundbook.test`;
    await app
      .get(DataSource)
      .getRepository(User)
      .save({ email, name: 'Invented Limited', passwordHash: await hashPassword(TEST_PASSWORD) });
    try {
      for (let i = 0; i < 3; i++) {
        await request(http).post('/api/auth/login').send({ email, password: 'wrong-password' }).expect(401);
      }
      const res = await request(http)
        .post('/api/auth/login')
        .send({ email, password: TEST_PASSWORD })
        .expect(429);
      expect(res.body.code).toBe('TOO_MANY_REQUESTS');
    } finally {
      await app.close();
    }
  });
});
