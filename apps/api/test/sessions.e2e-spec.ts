import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { makeProject, signIn, TEST_PASSWORD, type TestProject } from './factories';
import { createTestApp } from './test-app';

// Issue 18, item 6: tokens can be revoked — sign out everywhere, a new password, removal from the last project.
type Body = Record<string, any>;
const code = `SE${Date.now() % 1e5}`;

describe('sessions: revoking tokens (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    p = await makeProject(app, { code });
  });
  afterAll(async () => app.close());

  const tokenOf = async (role: 'geologist' | 'viewer' | 'supervisor', password = TEST_PASSWORD) =>
    (await signIn(http, [role], p.emailOf, password))[role];
  const me = (token: string) => request(http).get('/api/auth/me').set('Authorization', `Bearer ${token}`);

  it('sign out everywhere ends every session of the account, the calling one included; a new sign-in works', async () => {
    const tablet = await tokenOf('geologist');
    const laptop = await tokenOf('geologist');
    await me(tablet).expect(200);
    await request(http)
      .post('/api/auth/sign-out-everywhere')
      .set('Authorization', `Bearer ${laptop}`)
      .expect(204);
    for (const t of [tablet, laptop]) {
      const res = await me(t).expect(401);
      expect(res.body.message).toMatch(/session has ended/);
    }
    await me(await tokenOf('geologist')).expect(200);
    // another account is untouched
    await me(p.as('engineer').Authorization.slice(7)).expect(200);
  });

  it('a new password: the current one is asked again; other sessions end, this one gets a new token', async () => {
    const other = await tokenOf('viewer');
    const here = await tokenOf('viewer');
    const wrong = await request(http)
      .post('/api/auth/password')
      .set('Authorization', `Bearer ${here}`)
      .send({ currentPassword: 'not-the-password', newPassword: 'a-new-password-2026' })
      .expect(400);
    expect(Object.keys(wrong.body.fields as object)).toEqual(['currentPassword']);
    await me(here).expect(200); // a wrong current password changes nothing
    const short = await request(http)
      .post('/api/auth/password')
      .set('Authorization', `Bearer ${here}`)
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'short' })
      .expect(400);
    expect(Object.keys(short.body.fields as object)).toEqual(['newPassword']);
    const res = await request(http)
      .post('/api/auth/password')
      .set('Authorization', `Bearer ${here}`)
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'a-new-password-2026' })
      .expect(200);
    expect(res.headers['cache-control']).toBe('no-store');
    await me(other).expect(401);
    await me(here).expect(401);
    await me((res.body as Body).accessToken as string).expect(200);
    await request(http)
      .post('/api/auth/login')
      .send({ email: p.emailOf('viewer'), password: TEST_PASSWORD })
      .expect(401);
    await me(await tokenOf('viewer', 'a-new-password-2026')).expect(200);
  });

  it("on a project's route the account and the membership are read together, afresh at every request: a role change and a revoked token count at the very next one", async () => {
    // `npm run load` (issue 20 item 4): one statement reads both, nothing is kept between requests.
    const supervisor = await tokenOf('supervisor');
    const project = () => request(http).get(p.base).set('Authorization', `Bearer ${supervisor}`);
    expect(((await project().expect(200)).body as Body).role).toBe('supervisor');
    const team = (await request(http).get(`${p.base}/team`).set(p.as('admin')).expect(200)).body as Body;
    const member = (team.members as Body[]).find((m) => m.role === 'supervisor')!;
    const memberUrl = `${p.base}/members/${member.memberId as string}`;
    await request(http).patch(memberUrl).set(p.as('admin')).send({ role: 'viewer' }).expect(200);
    expect(((await project().expect(200)).body as Body).role).toBe('viewer');
    await request(http).patch(memberUrl).set(p.as('admin')).send({ role: 'supervisor' }).expect(200);
    expect(((await project().expect(200)).body as Body).role).toBe('supervisor');
    await request(http)
      .post('/api/auth/sign-out-everywhere')
      .set('Authorization', `Bearer ${supervisor}`)
      .expect(204);
    expect(((await project().expect(401)).body as Body).message).toMatch(/session has ended/);
  });

  it('removed from their last project, a member has no session left', async () => {
    const supervisor = await tokenOf('supervisor');
    const team = (await request(http).get(`${p.base}/team`).set(p.as('admin')).expect(200)).body as Body;
    const member = (team.members as Body[]).find((m) => m.role === 'supervisor')!;
    await request(http)
      .delete(`${p.base}/members/${member.memberId as string}`)
      .set(p.as('admin'))
      .expect(200);
    await me(supervisor).expect(401);
    // on the project's own route too (account and membership read in one statement)
    await request(http).get(p.base).set('Authorization', `Bearer ${supervisor}`).expect(401);
  });

  it('two apps in one process, each with its own secret, accept only their own tokens (passport strategy per app)', async () => {
    // stack-notes §12: passport's registry is process-wide; with one strategy name the second app's
    // strategy replaced the first's (app A then accepted B's tokens and refused its own).
    const other = await createTestApp((c) => ({
      ...c,
      auth: { ...c.auth, jwtSecret: `another-secret-${code}-0123456789` },
    }));
    try {
      const otherHttp = other.getHttpServer() as App;
      const email = p.emailOf('supervisor');
      const tokenOn = async (server: App) =>
        (
          (await request(server).post('/api/auth/login').send({ email, password: TEST_PASSWORD }).expect(200))
            .body as { accessToken: string }
        ).accessToken;
      const mine = await tokenOn(http);
      const theirs = await tokenOn(otherHttp);
      await me(mine).expect(200);
      await me(theirs).expect(401);
      await request(otherHttp).get('/api/auth/me').set('Authorization', `Bearer ${theirs}`).expect(200);
      await request(otherHttp).get('/api/auth/me').set('Authorization', `Bearer ${mine}`).expect(401);
    } finally {
      await other.close();
    }
    // The first app keeps working after the second has shut down (its strategy left the registry).
    await me(p.as('engineer').Authorization.slice(7)).expect(200);
  });

  it('a missing, malformed or foreign token reads as words a person can act on (401)', async () => {
    const none = await request(http).get('/api/auth/me').expect(401);
    expect(none.body.message).toBe('Please sign in to continue.');
    const junk = await request(http)
      .get('/api/auth/me')
      .set('Authorization', 'Bearer not.a.token')
      .expect(401);
    expect(junk.body.message).toBe('Please sign in to continue.');
    const basic = await request(http)
      .get('/api/auth/me')
      .set('Authorization', 'Basic Zm9vOmJhcg==')
      .expect(401);
    expect(basic.body.code).toBe('UNAUTHENTICATED');
  });
});
