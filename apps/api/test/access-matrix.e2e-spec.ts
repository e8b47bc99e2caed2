// Issue 20, item 1: the access matrix. Every route of the OpenAPI document, called by every actor, against
// the expected table in access-matrix.ts. A route missing from the table fails; so does a row for a route
// that no longer exists. Bodies are empty and ids unknown, so an allowed call ends in 400/404 and writes
// nothing; a refused one must end in 401 (no token) or 403/404 (signed in), never 5xx.
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { hashPassword } from '../src/modules/users/password';
import { User } from '../src/modules/users/user.entity';
import { ACTORS, EXPECTED_ACCESS, type Actor } from './access-matrix';
import { makeProject, signIn, TEST_PASSWORD, type TestProject } from './factories';
import { createTestApp } from './test-app';

const code = `AM${String(Date.now() % 1e6)}`;
const METHODS = ['get', 'post', 'put', 'patch', 'delete'] as const;

interface OpenApiDocument {
  paths: Record<string, Partial<Record<(typeof METHODS)[number], unknown>>>;
}
const document = JSON.parse(
  readFileSync(path.join(__dirname, '..', 'openapi.json'), 'utf8'),
) as OpenApiDocument;
// Routes that end the caller's sessions go last, so the tokens hold for every other route.
const REVOKING = ['POST /api/auth/sign-out-everywhere'];
const routes = Object.entries(document.paths)
  .flatMap(([route, ops]) =>
    METHODS.filter((m) => ops[m] !== undefined).map((m) => `${m.toUpperCase()} ${route}`),
  )
  .sort((a, b) => Number(REVOKING.includes(a)) - Number(REVOKING.includes(b)));

describe('Access matrix (e2e, every route × every actor)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  const tokens: Partial<Record<Actor, string>> = {};

  beforeAll(async () => {
    // The project is made on an instance where anyone may create projects; the matrix then runs on one
    // with the API's defaults for the two instance settings the table depends on.
    const maker = await createTestApp((c) => ({ ...c, projectCreation: 'anyone' }));
    p = await makeProject(maker, { code });
    await maker.close();
    app = await createTestApp((c) => ({ ...c, projectCreation: 'operators', localMode: true }));
    http = app.getHttpServer() as App;
    const users = app.get(DataSource).getRepository(User);
    const passwordHash = await hashPassword(TEST_PASSWORD);
    const outsider = `outsider.${code.toLowerCase()}@roundbook.test`;
    const operator = `operator.${code.toLowerCase()}@roundbook.test`;
    await users.save({ email: outsider, name: `Outsider ${code}`, passwordHash });
    await users.save({ email: operator, name: `Operator ${code}`, passwordHash, isOperator: true });
    const signedIn = await signIn(
      http,
      ['admin', 'geologist', 'engineer', 'supervisor', 'viewer'],
      p.emailOf,
      TEST_PASSWORD,
    );
    Object.assign(tokens, signedIn);
    const extra = await signIn(
      http,
      ['admin', 'viewer'],
      (r) => (r === 'admin' ? operator : outsider),
      TEST_PASSWORD,
    );
    tokens.operator = extra.admin;
    tokens.outsider = extra.viewer;
  });

  afterAll(async () => {
    await app.close();
  });

  it('has a row for every route of the OpenAPI document, and no row for a route that is gone', () => {
    const table = Object.keys(EXPECTED_ACCESS).sort();
    expect(routes.filter((r) => !table.includes(r))).toEqual([]); // routes without a decision
    expect(table.filter((r) => !routes.includes(r))).toEqual([]); // rows for routes that are gone
  });

  const fill = (route: string): string =>
    route.replace(/\{(\w+)\}/g, (_, name: string) => {
      if (name === 'projectId') return p.projectId;
      if (name === 'headingId') return p.headingId;
      if (name === 'index') return '0';
      if (name === 'token') return 'not-a-real-invitation-token';
      return randomUUID(); // unknown ids: an allowed call answers 404 and changes nothing
    });

  it('lets through exactly the actors the table names, and refuses the others cleanly', async () => {
    const wrong: string[] = [];
    for (const key of routes) {
      const allowed = EXPECTED_ACCESS[key] ?? [];
      const [method, route] = key.split(' ');
      const url = fill(route);
      for (const actor of ACTORS) {
        const call = request(http)[method.toLowerCase() as (typeof METHODS)[number]](url);
        if (actor !== 'anonymous') call.set('Authorization', `Bearer ${tokens[actor]}`);
        if (method !== 'GET' && method !== 'DELETE') call.send({});
        const { status } = await call;
        const refused = status === 401 || status === 403;
        const hidden = status === 404 && actor !== 'anonymous' && !allowed.includes(actor);
        if (status >= 500) wrong.push(`${key} as ${actor}: ${status}`);
        else if (allowed.includes(actor) && refused) wrong.push(`${key} as ${actor}: refused (${status})`);
        else if (!allowed.includes(actor) && actor === 'anonymous' && status !== 401)
          wrong.push(`${key} as anonymous: ${status}, expected 401`);
        else if (!allowed.includes(actor) && actor !== 'anonymous' && !refused && !hidden)
          wrong.push(`${key} as ${actor}: let through (${status})`);
      }
    }
    expect(wrong).toEqual([]);
  });
});
