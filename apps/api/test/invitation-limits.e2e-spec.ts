import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { Invitation } from '../src/modules/team/invitation.entity';
import { makeProject, type TestProject } from './factories';
import { createTestApp } from './test-app';

// Issue 18 item 6: "invitation e-mails are not rate-limited". Replayed: one project's admin sending
// invitation after invitation (new addresses, and the same address resent), and two projects writing to
// one address. Limits are counted from the queued notices (so they hold across processes), small here.
const run = Date.now() % 1e6;

describe('invitation e-mails are limited (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  let q: TestProject;

  beforeAll(async () => {
    app = await createTestApp((c) => ({
      ...c,
      auth: { ...c.auth, invitationEmailLimit: 3, invitationAddressLimit: 2 },
    }));
    http = app.getHttpServer() as App;
    p = await makeProject(app, { code: `IL${run % 1e4}` });
    q = await makeProject(app, { code: `IM${run % 1e4}` });
  });
  afterAll(async () => app.close());

  const invite = (project: TestProject, email: string) =>
    request(http)
      .post(`${project.base}/invitations`)
      .set(project.as('admin'))
      .send({ email, role: 'viewer' });
  const openInvitations = (projectId: string): Promise<number> =>
    app.get(DataSource).getRepository(Invitation).countBy({ projectId });

  it('a project sends at most the limit per hour; the next is 429 with the wait, and nothing is written', async () => {
    for (let i = 0; i < 3; i += 1) await invite(p, `many.${i}.${run}@roundbook.test`).expect(201);
    const before = await openInvitations(p.projectId);
    const refused = await invite(p, `many.3.${run}@roundbook.test`).expect(429);
    expect(refused.body.code).toBe('TOO_MANY_REQUESTS');
    expect(refused.body.message).toMatch(/3 invitation e-mails in the last hour/);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThanOrEqual(60);
    expect(await openInvitations(p.projectId)).toBe(before);
    const emails = (
      await app.get(DataSource).getRepository(Invitation).findBy({ projectId: p.projectId })
    ).map((r) => r.email);
    expect(emails).not.toContain(`many.3.${run}@roundbook.test`);
    // Another project is not held up by this one.
    await invite(q, `other.${run}@roundbook.test`).expect(201);
  });

  it('one address gets at most the limit per hour from all projects together (resends included)', async () => {
    const email = `target.${run}@roundbook.test`;
    const r = await makeProject(app, { code: `IN${run % 1e4}` });
    const fromR = await invite(r, email).expect(201); // the address's first e-mail
    await invite(q, email).expect(201); // its second, from another project
    const resent = await request(http)
      .post(`${r.base}/invitations/${fromR.body.id as string}/resend`)
      .set(r.as('admin'))
      .expect(429); // a third would be over the address's limit, though r itself has room
    expect(resent.body.message).toContain(email);
    expect(resent.body.message).toMatch(/2 invitation e-mails in the last hour/);
  });
});
