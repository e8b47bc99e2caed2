import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { APP_CONFIG, type AppConfig } from '../src/config/app-config';
import { Job } from '../src/infrastructure/jobs/job.entity';
import { JobsWorker } from '../src/infrastructure/jobs/jobs.worker';
import { ProjectMember } from '../src/modules/projects/project-member.entity';
import { hashPassword } from '../src/modules/users/password';
import { User } from '../src/modules/users/user.entity';
import { latestAudit, makeProject as makeTestProject, signIn, TEST_PASSWORD, type Role } from './factories';
import { createTestApp } from './test-app';

const ROLES: Role[] = ['admin', 'geologist', 'engineer', 'supervisor', 'viewer'];

type Body = Record<string, any>;
/** A suffix that keeps this run's codes and addresses apart from earlier runs against the same database. */
const run = `${Date.now() % 1_000_000}`;

/** Waits for a condition with a bounded loop of short pauses (no fixed sleeps). */
async function until<T>(probe: () => Promise<T> | T, ok: (v: T) => boolean, ms = 15_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await probe();
    if (ok(v)) return v;
    if (Date.now() > end) throw new Error(`condition not reached within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

describe('Team and invitations (e2e, real MariaDB, the jobs worker and the SMTP fake)', () => {
  let app: INestApplication;
  let http: App;
  let projectId: string;
  let base: string;
  const tokens: Record<string, string> = {};
  let ownEmail: (role: Role) => string;
  const as = (role: string) => ({ Authorization: `Bearer ${tokens[role]}` });
  const bearer = (t: string) => ({ Authorization: `Bearer ${t}` });

  const lastAudit = (entityId: string) => latestAudit(app, entityId);

  /** What the SMTP fake received for an address (the invited person's inbox). */
  const mailFor = (to: string): Body[] => {
    const dir = app.get<AppConfig>(APP_CONFIG).mail.localInboxDir!;
    return readdirSync(dir)
      .filter((f) => f.endsWith('.json'))
      .map((f) => JSON.parse(readFileSync(path.join(dir, f), 'utf8')) as Body)
      .filter((m) => (m.to as string[]).includes(to));
  };
  /** Waits for the worker to deliver the invitation e-mail, and returns the token from its link. */
  const tokenFor = async (to: string, count = 1): Promise<string> => {
    const messages = await until(
      () => mailFor(to),
      (m) => m.length >= count,
    );
    const newest = messages.sort((x, y) => String(y.receivedAt).localeCompare(String(x.receivedAt)))[0];
    return /\/invitation\/([A-Za-z0-9_-]+)/.exec(newest.text as string)![1];
  };
  const login = async (email: string, password: string): Promise<string> =>
    (
      (await request(http).post('/api/auth/login').send({ email, password }).expect(200)).body as {
        accessToken: string;
      }
    ).accessToken;
  const makeUser = async (label: string, isOperator = false): Promise<{ user: User; token: string }> => {
    const user = await app
      .get(DataSource)
      .getRepository(User)
      .save({
        email: `${label}.${run}@roundbook.test`,
        name: `Invented ${label}`,
        passwordHash: await hashPassword('a-long-enough-pw'),
        isOperator,
      });
    return { user, token: await login(user.email, 'a-long-enough-pw') };
  };
  /** A project of the test's own, made through the API by the given account (its admin). */
  const makeProject = async (token: string, code: string): Promise<string> =>
    (
      (
        await request(http)
          .post('/api/projects')
          .set(bearer(token))
          .send({ code, name: `Invented project ${code}`, timeZone: 'Europe/Oslo' })
          .expect(201)
      ).body as { id: string }
    ).id;

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    // A project of this file's own with its five users; its admin also runs the instance (the operator),
    // as the demo's admin does.
    const own = await makeTestProject(app, { code: `IV${run}` });
    Object.assign(tokens, await signIn(http, ROLES, own.emailOf, TEST_PASSWORD));
    await app
      .get(DataSource)
      .getRepository(User)
      .update({ email: own.emailOf('admin') }, { isOperator: true });
    ownEmail = own.emailOf;
    projectId = own.projectId;
    base = own.base;
  });

  afterAll(async () => {
    await app.close();
  });

  describe('team', () => {
    it('invites by e-mail; the SMTP fake receives the link; accepting creates the account and the membership', async () => {
      const email = `new.geologist.${Date.now()}@roundbook.test`;
      await request(http)
        .post(`${base}/invitations`)
        .set(as('engineer'))
        .send({ email, role: 'geologist' })
        .expect(403);
      const invited = await request(http)
        .post(`${base}/invitations`)
        .set(as('admin'))
        .send({ email: email.toUpperCase(), name: 'Invented Newcomer', role: 'geologist' })
        .expect(201);
      // Queued with the invitation in one transaction; the worker sends it.
      expect(invited.body).toMatchObject({
        email,
        role: 'geologist',
        emailSent: false,
        emailStatus: 'queued',
      });

      const token = await tokenFor(email);
      const [message] = mailFor(email);
      expect(message.subject).toBe(`You are invited to Invented test project IV${run} in Roundbook`);
      expect(message.text).toContain('Invented Newcomer');
      // Issue 19, item 15: the role in the screens' words, the expiry in the project's time zone.
      expect(message.text).toContain('as the role “Geologist” (records the rounds)');
      expect(message.text).toMatch(
        /valid until \d{1,2} [A-Z][a-z]{2} \d{4}, \d{2}:\d{2} \(Europe\/Zurich time\)/,
      );
      expect(message.text).not.toMatch(/UTC/);
      const team0 = await request(http).get(`${base}/team`).set(as('admin')).expect(200);
      expect((team0.body.invitations as Body[]).find((i) => i.email === email)).toMatchObject({
        emailSent: true,
        emailStatus: 'sent',
      });

      const info = await request(http).get(`/api/invitations/${token}`).expect(200);
      expect(info.body).toEqual({
        email,
        name: 'Invented Newcomer', // what the admin typed, to prefill the form
        role: 'geologist',
        expiresAt: expect.any(String),
        projectName: `Invented test project IV${run}`,
      });
      const short = await request(http)
        .post(`/api/invitations/${token}/accept`)
        .send({ name: 'Invented Newcomer', password: 'short' })
        .expect(400);
      expect(short.body.fields).toEqual({ password: 'Use at least 10 characters.' });
      const accepted = await request(http)
        .post(`/api/invitations/${token}/accept`)
        .send({ name: 'Invented Newcomer', password: 'a-long-enough-pw' })
        .expect(200);
      expect(accepted.body).toMatchObject({ projectId, newAccount: true, session: { user: { email } } });
      const newToken = accepted.body.session.accessToken as string;
      const projects = await request(http).get('/api/projects').set(bearer(newToken)).expect(200);
      expect((projects.body as Body[]).map((p) => [p.id, p.role])).toEqual([[projectId, 'geologist']]);
      await request(http).get(`/api/invitations/${token}`).expect(404); // used once

      const team = await request(http).get(`${base}/team`).set(as('viewer')).expect(200);
      const member = (team.body.members as Body[]).find((m) => m.email === email)!;
      expect(member.role).toBe('geologist');

      const promoted = await request(http)
        .patch(`${base}/members/${member.memberId}`)
        .set(as('admin'))
        .send({ role: 'engineer' })
        .expect(200);
      expect((promoted.body.members as Body[]).find((m) => m.email === email)!.role).toBe('engineer');
      expect(await lastAudit(member.userId as string)).toMatchObject({
        action: 'change-role',
        before: { role: 'geologist' },
        after: { role: 'engineer' },
      });

      const removed = await request(http)
        .delete(`${base}/members/${member.memberId}`)
        .set(as('admin'))
        .expect(200);
      expect((removed.body.members as Body[]).map((m) => m.email)).not.toContain(email);
      // Their last project: their sessions end too (issue 18 item 6; sessions.e2e-spec.ts)
      await request(http).get(`${base}`).set(bearer(newToken)).expect(401);
    });

    it('keeps the last admin, and refuses to invite an existing member', async () => {
      const team = await request(http).get(`${base}/team`).set(as('admin')).expect(200);
      const admin = (team.body.members as Body[]).find((m) => m.role === 'admin')!;
      const res = await request(http)
        .patch(`${base}/members/${admin.memberId}`)
        .set(as('admin'))
        .send({ role: 'viewer' })
        .expect(409);
      expect(res.body.message).toMatch(/at least one admin/);
      await request(http).delete(`${base}/members/${admin.memberId}`).set(as('admin')).expect(409);
      const dup = await request(http)
        .post(`${base}/invitations`)
        .set(as('admin'))
        .send({ email: ownEmail('viewer'), role: 'viewer' })
        .expect(409);
      expect(dup.body.fields).toEqual({ email: 'Already a member.' });
    });

    it('answers the invitation normally while the mail server is down (e-mail queued, retried), and the e-mail follows once it is back', async () => {
      // No worker may reach the mail server meanwhile: stop this app's worker; the "down" app's worker
      // talks to a closed port and retries quickly.
      const worker = app.get(JobsWorker);
      await worker.stop();
      const down = await createTestApp((c) => ({
        ...c,
        mail: { ...c.mail, port: 1 },
        jobs: { ...c.jobs, backoffBaseMs: 20, backoffMaxMs: 100, maxAttempts: 1000 },
      }));
      const email = `later.${Date.now()}@roundbook.test`;
      let invitationId: string;
      try {
        const res = await request(down.getHttpServer() as App)
          .post(`${base}/invitations`)
          .set(as('admin'))
          .send({ email, role: 'viewer' })
          .expect(201);
        expect(res.body).toMatchObject({ email, emailSent: false, emailStatus: 'queued' });
        invitationId = res.body.id as string;
        const ds = app.get(DataSource);
        const noticeId = (
          await ds.query<Array<{ notice_id: string }>>('SELECT notice_id FROM invitations WHERE id = ?', [
            invitationId,
          ])
        )[0].notice_id;
        const job = await until(
          () => ds.getRepository(Job).findOneByOrFail({ dedupeKey: `notice:${noticeId}` }),
          (j) => j.attempts >= 3,
        );
        expect(job.state).not.toBe('done');
        expect(job.lastError).toMatch(/ECONNREFUSED|connect/i);
      } finally {
        await down.close();
      }
      expect(mailFor(email)).toHaveLength(0);
      const team = await request(http).get(`${base}/team`).set(as('admin')).expect(200);
      expect((team.body.invitations as Body[]).find((i) => i.email === email)).toMatchObject({
        emailSent: false,
        emailStatus: 'queued',
      });
      worker.start(); // the mail server answers this app
      await tokenFor(email);
      expect(mailFor(email)).toHaveLength(1);
      const resent = await request(http)
        .post(`${base}/invitations/${invitationId}/resend`)
        .set(as('admin'))
        .expect(200);
      expect(resent.body.emailStatus).toBe('queued');
      await tokenFor(email, 2);
      expect(mailFor(email)).toHaveLength(2);
      await request(http).delete(`${base}/invitations/${invitationId}`).set(as('admin')).expect(204);
    });
  });

  describe('issue 18 item 1: mail readable across projects; invitations can be taken over', () => {
    it('GET /api/local/mail and /api/local/jobs by a project admin who is not the operator → 403; the operator reads them', async () => {
      const lead = await makeUser('lead');
      await makeProject(lead.token, `LM${run}`);
      // Any account could create a project, become its admin and read every e-mail; not any more.
      const refused = await request(http).get('/api/local/mail').set(bearer(lead.token)).expect(403);
      expect(refused.body.message).toMatch(/operator/);
      await request(http).get('/api/local/jobs').set(bearer(lead.token)).expect(403);
      expect((await request(http).get('/api/local/access').set(bearer(lead.token)).expect(200)).body).toEqual(
        {
          localMode: true,
          operator: false,
        },
      );
      expect((await request(http).get('/api/local/access').set(as('admin')).expect(200)).body).toEqual({
        localMode: true,
        operator: true,
      });
      await request(http).get('/api/local/mail').set(as('geologist')).expect(403);
      await request(http).get('/api/local/mail').set(as('admin')).expect(200); // this project's admin, the operator
      const jobs = await request(http).get('/api/local/jobs').set(as('admin')).expect(200);
      expect(jobs.body.counts).toEqual({
        pending: expect.any(Number),
        running: expect.any(Number),
        done: expect.any(Number),
        dead: expect.any(Number),
      });
    });

    it('POST /api/invitations/{token}/accept by someone else → refused; only the invited address joins', async () => {
      const owner = await makeUser('owner');
      const p = await makeProject(owner.token, `TK${run}`);
      const email = `invitee.${run}@roundbook.test`;
      await request(http)
        .post(`/api/projects/${p}/invitations`)
        .set(bearer(owner.token))
        .send({ email, role: 'engineer' })
        .expect(201);
      const token = await tokenFor(email);
      // Signed in as another account (a demo geologist), with any name and password: refused, nothing written.
      const other = await request(http)
        .post(`/api/invitations/${token}/accept`)
        .set(as('geologist'))
        .send({ name: 'Someone Else', password: 'attacker-chosen-pw' })
        .expect(403);
      expect(other.body.message).toContain(email);
      expect(await app.get(DataSource).getRepository(User).existsBy({ email })).toBe(false);

      // An address that already has an account: never accepted by name and password, only signed in as it.
      const existing = await makeUser('existing');
      await request(http)
        .post(`/api/projects/${p}/invitations`)
        .set(bearer(owner.token))
        .send({ email: existing.user.email, role: 'viewer' })
        .expect(201);
      const t2 = await tokenFor(existing.user.email);
      const anon = await request(http)
        .post(`/api/invitations/${t2}/accept`)
        .send({ name: 'Someone Else', password: 'attacker-chosen-pw' })
        .expect(409);
      expect(anon.body.message).toMatch(/Sign in/);
      await request(http).post(`/api/invitations/${t2}/accept`).set(as('viewer')).send({}).expect(403);
      await login(existing.user.email, 'a-long-enough-pw'); // its password unchanged
      const members = app.get(DataSource).getRepository(ProjectMember);
      expect(await members.existsBy({ projectId: p, userId: existing.user.id })).toBe(false);
      const joined = await request(http)
        .post(`/api/invitations/${t2}/accept`)
        .set(bearer(existing.token))
        .send({})
        .expect(200);
      expect(joined.body).toEqual({ projectId: p, newAccount: false });
      expect(await members.findOneByOrFail({ projectId: p, userId: existing.user.id })).toMatchObject({
        role: 'viewer',
      });
    });

    it('a revoked token is no one: after sign-out everywhere it cannot accept for its account (issue 18 item 6)', async () => {
      const owner = await makeUser('owner-rv');
      const p = await makeProject(owner.token, `RV${run}`);
      const invitee = await makeUser('revoked');
      await request(http)
        .post(`/api/projects/${p}/invitations`)
        .set(bearer(owner.token))
        .send({ email: invitee.user.email, role: 'viewer' })
        .expect(201);
      const t = await tokenFor(invitee.user.email);
      await request(http).post('/api/auth/sign-out-everywhere').set(bearer(invitee.token)).expect(204);
      // The old token read as no one: the address has an account, so it must sign in first (before: joined).
      const stale = await request(http)
        .post(`/api/invitations/${t}/accept`)
        .set(bearer(invitee.token))
        .send({})
        .expect(409);
      expect(stale.body.message).toMatch(/Sign in/);
      const members = app.get(DataSource).getRepository(ProjectMember);
      expect(await members.existsBy({ projectId: p, userId: invitee.user.id })).toBe(false);
      const fresh = await login(invitee.user.email, 'a-long-enough-pw');
      await request(http).post(`/api/invitations/${t}/accept`).set(bearer(fresh)).send({}).expect(200);
      expect(await members.existsBy({ projectId: p, userId: invitee.user.id })).toBe(true);
    });

    it('the token reused → refused (single use, and a resent link replaces the old one)', async () => {
      const owner = await makeUser('owner2');
      const p = await makeProject(owner.token, `RU${run}`);
      const email = `once.${run}@roundbook.test`;
      const inv = await request(http)
        .post(`/api/projects/${p}/invitations`)
        .set(bearer(owner.token))
        .send({ email, role: 'geologist', name: 'Invented Once' })
        .expect(201);
      const first = await tokenFor(email);
      await request(http)
        .post(`/api/projects/${p}/invitations/${inv.body.id}/resend`)
        .set(bearer(owner.token))
        .expect(200);
      const second = await tokenFor(email, 2);
      expect(second).not.toBe(first);
      await request(http).get(`/api/invitations/${first}`).expect(404);
      await request(http)
        .post(`/api/invitations/${first}/accept`)
        .send({ password: 'a-long-enough-pw' })
        .expect(404);
      const ok = await request(http)
        .post(`/api/invitations/${second}/accept`)
        .send({ password: 'a-long-enough-pw' })
        .expect(200);
      expect(ok.body.session.user).toMatchObject({ email, name: 'Invented Once' });
      // Used: refused again, whether anonymous or signed in as the invited address itself.
      await request(http)
        .post(`/api/invitations/${second}/accept`)
        .send({ name: 'Again', password: 'another-long-pw' })
        .expect(404);
      await request(http)
        .post(`/api/invitations/${second}/accept`)
        .set(bearer(ok.body.session.accessToken as string))
        .send({})
        .expect(404);
      await login(email, 'a-long-enough-pw');
    });

    it('two projects invite one new address and both links are accepted at once: one account, the other link says sign in first and still works after (issue 18 item 4)', async () => {
      // Replays: POST /api/invitations/{token}/accept for two projects' invitations to one new address, at
      // the same moment, both without a session. Both transactions find no account and create one; the
      // second's insert hit the unique e-mail key and answered 500.
      const owner = await makeUser('owner-race');
      const projects = [
        await makeProject(owner.token, `RA${run}`),
        await makeProject(owner.token, `RB${run}`),
      ];
      const email = `race.${run}@roundbook.test`;
      for (const p of projects)
        await request(http)
          .post(`/api/projects/${p}/invitations`)
          .set(bearer(owner.token))
          .send({ email, role: 'geologist', name: 'Invented Racer' })
          .expect(201);
      await tokenFor(email, 2);
      const links = mailFor(email).map((m) => /\/invitation\/([A-Za-z0-9_-]+)/.exec(m.text as string)![1]);
      expect(new Set(links).size).toBe(2);

      const answers = await Promise.all(
        links.map((t) =>
          request(http).post(`/api/invitations/${t}/accept`).send({ password: 'a-long-enough-pw' }),
        ),
      );
      expect(answers.map((a) => a.status).sort()).toEqual([200, 409]);
      const refused = answers.findIndex((a) => a.status === 409);
      expect(answers[refused].body.message).toMatch(/already has a Roundbook account\. Sign in/);

      // One account and one membership; the refused link wrote nothing and is still open.
      const db = app.get(DataSource);
      const accounts = await db.getRepository(User).find({ where: { email } });
      expect(accounts).toHaveLength(1);
      expect(await db.getRepository(ProjectMember).count({ where: { userId: accounts[0].id } })).toBe(1);
      await request(http).get(`/api/invitations/${links[refused]}`).expect(200);

      // Signed in with the account just made, the refused link joins the second project.
      const session = await login(email, 'a-long-enough-pw');
      await request(http)
        .post(`/api/invitations/${links[refused]}/accept`)
        .set(bearer(session))
        .send({})
        .expect(200);
      expect(await db.getRepository(ProjectMember).count({ where: { userId: accounts[0].id } })).toBe(2);
    });

    it('an invitation does not reveal whether the address has an account, nor its holder’s name', async () => {
      const owner = await makeUser('owner3');
      const p = await makeProject(owner.token, `NR${run}`);
      const holder = await makeUser('holder');
      const fresh = `nobody.${run}@roundbook.test`;
      const a = await request(http)
        .post(`/api/projects/${p}/invitations`)
        .set(bearer(owner.token))
        .send({ email: holder.user.email, role: 'viewer' })
        .expect(201);
      const b = await request(http)
        .post(`/api/projects/${p}/invitations`)
        .set(bearer(owner.token))
        .send({ email: fresh, role: 'viewer' })
        .expect(201);
      expect(Object.keys(a.body as Body).sort()).toEqual(Object.keys(b.body as Body).sort());
      expect(a.body).toMatchObject({ name: '', emailStatus: 'queued' });
      expect(b.body).toMatchObject({ name: '', emailStatus: 'queued' });
      const team = await request(http).get(`/api/projects/${p}/team`).set(bearer(owner.token)).expect(200);
      expect(JSON.stringify(team.body)).not.toContain(holder.user.name);
      const info = await request(http)
        .get(`/api/invitations/${await tokenFor(holder.user.email)}`)
        .expect(200);
      expect(info.body).not.toHaveProperty('accountExists');
      expect(info.body.name).toBe('');
    });

    it('PROJECT_CREATION=operators: only instance operators create projects', async () => {
      const strict = await createTestApp((c) => ({ ...c, projectCreation: 'operators' }));
      try {
        const h = strict.getHttpServer() as App;
        const member = await makeUser('member');
        const operator = await makeUser('operator', true);
        const body = (code: string) => ({ code, name: `Invented ${code}`, timeZone: 'Europe/Oslo' });
        // /api/auth/me says so beforehand, so the web offers New project only to those it lets through.
        const meOf = async (token: string) =>
          (await request(h).get('/api/auth/me').set(bearer(token)).expect(200)).body as {
            canCreateProjects: boolean;
          };
        expect((await meOf(member.token)).canCreateProjects).toBe(false);
        expect((await meOf(operator.token)).canCreateProjects).toBe(true);
        expect(
          (
            (await request(http).get('/api/auth/me').set(bearer(member.token)).expect(200)).body as {
              canCreateProjects: boolean;
            }
          ).canCreateProjects,
        ).toBe(true);
        const refused = await request(h)
          .post('/api/projects')
          .set(bearer(member.token))
          .send(body(`PO${run}`))
          .expect(403);
        expect(refused.body.message).toMatch(/create/);
        await request(h)
          .post('/api/projects')
          .set(bearer(operator.token))
          .send(body(`PK${run}`))
          .expect(201);
      } finally {
        await strict.close();
      }
    });
  });
});
