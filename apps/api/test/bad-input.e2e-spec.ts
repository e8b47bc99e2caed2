// Issue 20, item 2: bad input. Every POST/PUT/PATCH route with a JSON body gets generated invalid bodies:
// each property of a valid body (and of its nested objects) replaced by values its OpenAPI schema refuses —
// wrong types, null where null is not allowed, numbers past the bounds, strings past their length, unknown
// enum values, impossible dates, lone surrogates, deep nesting — plus fast-check's hostile strings and
// numbers (fixed seed, so a failure replays). Each must answer 4xx, never 5xx, and write nothing: the
// checksums of every table are the same before and after.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { INestApplication } from '@nestjs/common';
import fc from 'fast-check';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource } from 'typeorm';
import { makeProject, saveBody, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
type Schema = Record<string, any>;
const code = `BI${String(Date.now() % 1e6)}`;
const SEED = 20261202;

const document = JSON.parse(readFileSync(path.join(__dirname, '..', 'openapi.json'), 'utf8')) as {
  paths: Record<string, Record<string, Schema>>;
  components: { schemas: Record<string, Schema> };
};

/** The schema with $ref and single allOf resolved (enough for the DTOs of this API). */
function resolve(schema: Schema | undefined): Schema {
  if (!schema) return {};
  if (schema.$ref) return resolve(document.components.schemas[String(schema.$ref).split('/').pop()!]);
  if (Array.isArray(schema.allOf) && schema.allOf.length === 1) {
    const { allOf, ...rest } = schema;
    return { ...resolve(allOf[0] as Schema), ...rest };
  }
  return schema;
}

const deep = (depth: number): unknown => {
  let v: unknown = 1;
  for (let i = 0; i < depth; i++) v = { a: v };
  return v;
};

/** Values the schema refuses, for one property. */
function invalidValues(raw: Schema): unknown[] {
  const s = resolve(raw);
  const out: unknown[] = [deep(300)];
  if (!s.nullable) out.push(null);
  if (s.enum) out.push('not-one-of-them', 7);
  if (s.oneOf) out.push('x', 12);
  switch (s.type) {
    case 'number':
    case 'integer':
      out.push('12', true, [1], 'NaN');
      if (s.maximum !== undefined) out.push(Number(s.maximum) + 1, 1e300);
      if (s.minimum !== undefined) out.push(Number(s.minimum) - 1, -1e300);
      if (s.maximum === undefined) out.push(1e300);
      break;
    case 'string':
      out.push(12345, ['x'], { x: 1 }, 'a\uD800b');
      if (s.maxLength !== undefined) out.push('x'.repeat(Number(s.maxLength) + 1));
      if (s.format === 'uuid') out.push('not-a-uuid');
      if (s.format === 'email') out.push('not-an-address', 'a\uDC00@site.test');
      if (s.pattern && String(s.pattern).includes('\\d{4}-\\d{2}-\\d{2}'))
        out.push('2026-02-30', '0000-00-00');
      break;
    case 'boolean':
      out.push('yes', 1);
      break;
    case 'array':
      out.push('x', [[]], [deep(50)], { length: 1 });
      if (s.maxItems !== undefined) out.push(Array.from({ length: Number(s.maxItems) + 1 }, () => ({})));
      break;
    case 'object':
      out.push('x', [], 42);
      break;
    default:
      break;
  }
  return out;
}

/** Every (path into the body, invalid value) pair: top-level properties and one level into objects. */
function mutations(body: Body, schema: Schema): Array<{ where: string; value: unknown }> {
  const s = resolve(schema);
  const props = (s.properties ?? {}) as Record<string, Schema>;
  const list: Array<{ where: string; value: unknown }> = [];
  for (const [name, propSchema] of Object.entries(props)) {
    if (name === 'version') continue; // a wrong version is a 409 by design, covered elsewhere
    for (const value of invalidValues(propSchema)) list.push({ where: name, value });
    const inner = resolve(propSchema);
    if (inner.type === 'object' && inner.properties && body[name] && typeof body[name] === 'object') {
      for (const [sub, subSchema] of Object.entries(inner.properties as Record<string, Schema>)) {
        for (const value of invalidValues(subSchema)) list.push({ where: `${name}.${sub}`, value });
      }
    }
  }
  // fast-check's hostile text and numbers where the schema wants a bounded number or a closed set.
  const hostileText = fc.sample(fc.string({ unit: 'binary', maxLength: 40 }), { seed: SEED, numRuns: 3 });
  const hostileNumbers = fc.sample(
    fc.double({ noNaN: true }).filter((n) => Math.abs(n) > 1e9),
    {
      seed: SEED,
      numRuns: 3,
    },
  );
  for (const [name, propSchema] of Object.entries(props)) {
    const p = resolve(propSchema);
    if (p.enum)
      for (const t of hostileText)
        if (!(p.enum as unknown[]).includes(t)) list.push({ where: name, value: t });
    if ((p.type === 'number' || p.type === 'integer') && p.maximum !== undefined)
      for (const n of hostileNumbers) list.push({ where: name, value: n });
  }
  return list;
}

/** The body routes with a case below (the first test checks this list against the OpenAPI document). */
const ROUTE_KEYS = [
  'POST /api/auth/login',
  'POST /api/auth/password',
  'POST /api/projects',
  'PATCH /api/projects/{projectId}',
  'POST /api/projects/{projectId}/headings',
  'PATCH /api/projects/{projectId}/headings/{headingId}',
  'POST /api/projects/{projectId}/support-classes',
  'PUT /api/projects/{projectId}/support-classes/order',
  'PATCH /api/projects/{projectId}/support-classes/{classId}',
  'POST /api/projects/{projectId}/trigger-rules',
  'POST /api/projects/{projectId}/trigger-rules/preview',
  'PATCH /api/projects/{projectId}/trigger-rules/{ruleId}',
  'POST /api/projects/{projectId}/invitations',
  'PATCH /api/projects/{projectId}/members/{memberId}',
  'POST /api/invitations/{token}/accept',
  'POST /api/projects/{projectId}/headings/{headingId}/rounds',
  'PUT /api/projects/{projectId}/rounds/{roundId}',
  'POST /api/projects/{projectId}/rounds/{roundId}/submit',
  'POST /api/projects/{projectId}/rounds/{roundId}/confirm',
  'POST /api/projects/{projectId}/rounds/{roundId}/return',
  'POST /api/projects/{projectId}/rounds/{roundId}/correct',
  'POST /api/projects/{projectId}/rounds/{roundId}/triggers/{ruleId}/acknowledge',
  'POST /api/projects/{projectId}/rounds/{roundId}/triggers/{ruleId}/accept',
  'POST /api/projects/{projectId}/rounds/{roundId}/photos',
  'POST /api/projects/{projectId}/rounds/{roundId}/photos/{photoId}/complete',
  'PATCH /api/projects/{projectId}/rounds/{roundId}/photos/{photoId}',
  'POST /api/projects/{projectId}/headings/{headingId}/hazards',
  'PATCH /api/projects/{projectId}/headings/{headingId}/hazards/{hazardId}',
  'POST /api/projects/{projectId}/headings/{headingId}/hazards/{hazardId}/close',
  'POST /api/projects/{projectId}/handovers',
  'POST /api/projects/{projectId}/handovers/{handoverId}/acknowledge',
  'PUT /api/projects/{projectId}/rounds/{roundId}/support-record',
  'PUT /api/projects/{projectId}/notice-settings',
];

function withValue(body: Body, where: string, value: unknown): Body {
  const copy = structuredClone(body);
  const [a, b] = where.split('.');
  if (b === undefined) copy[a] = value;
  else copy[a] = { ...(copy[a] as Body), [b]: value };
  return copy;
}

describe('Bad input (e2e, generated invalid bodies on every body route)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  let round: Body;

  const checksums = async (): Promise<string> => {
    const ds = app.get(DataSource);
    const tables = (await ds.query<Array<Record<string, string>>>('SHOW TABLES')).map(
      (r) => Object.values(r)[0],
    );
    const rows = await ds.query<Array<{ Table: string; Checksum: string }>>(
      `CHECKSUM TABLE ${tables.map((t) => `\`${t}\``).join(', ')}`,
    );
    return rows.map((r) => `${r.Table}=${r.Checksum}`).join('\n');
  };

  beforeAll(async () => {
    app = await createTestApp((c) => ({ ...c, projectCreation: 'anyone' }));
    http = app.getHttpServer() as App;
    p = await makeProject(app, {
      code,
      rules: [{ watch: 'q', comparison: '<', threshold: 1, level: 'amber' }],
    });
    round = (
      await request(http)
        .post(`${p.base}/headings/${p.headingId}/rounds`)
        .set(p.as('geologist'))
        .send({ stage: 'full-face', faceChainage: 1003 })
        .expect(201)
    ).body as Body;
  });

  afterAll(async () => {
    await app.close();
  });

  type Case = { key: string; url: string; as: Body; body: Body };
  const cases: Case[] = [];

  beforeAll(async () => {
    const project = (await request(http).get(p.base).set(p.as('admin')).expect(200)).body as Body;
    const heading = (
      await request(http).get(`${p.base}/headings/${p.headingId}`).set(p.as('admin')).expect(200)
    ).body as Body;
    const classes = p.classes;
    const rule = (await request(http).get(`${p.base}/trigger-rules`).set(p.as('admin')).expect(200))
      .body[0] as Body;
    const team = (await request(http).get(`${p.base}/team`).set(p.as('admin')).expect(200)).body as Body;
    const viewer = (team.members as Body[]).find((m) => m.role === 'viewer')!;
    const memberId = (viewer.id ?? viewer.userId) as string;
    const validRule = {
      watch: 'rmr89',
      comparison: '<',
      threshold: 20,
      level: 'red',
      action: 'Stop and call.',
      ownerRole: 'engineer',
      timeAllowedHours: 1,
    };

    // A valid body (and who sends it) for each body route; the invalid ones are made from it.
    cases.push(
      {
        key: 'POST /api/auth/login',
        url: '/api/auth/login',
        as: {},
        body: { email: p.emailOf('viewer'), password: 'wrong-password-1' },
      },
      {
        key: 'POST /api/auth/password',
        url: '/api/auth/password',
        as: p.as('viewer'),
        body: { currentPassword: 'wrong-password-1', newPassword: 'a-new-password-2026' },
      },
      {
        key: 'POST /api/projects',
        url: '/api/projects',
        as: p.as('admin'),
        body: { code: `${code}X`, name: 'Invented', timeZone: 'Europe/Oslo' },
      },
      {
        key: 'PATCH /api/projects/{projectId}',
        url: p.base,
        as: p.as('admin'),
        body: { version: project.version, name: project.name },
      },
      {
        key: 'POST /api/projects/{projectId}/headings',
        url: `${p.base}/headings`,
        as: p.as('admin'),
        body: {
          code: 'NEW',
          name: 'New heading',
          startChainage: 0,
          driveTrend: 10,
          gradientPercent: 1,
          profileShape: 'circular',
          profileWidth: 5,
          profileHeight: 5,
          axisHeight: 2.5,
          stages: ['full-face'],
          plannedRoundLength: 3,
        },
      },
      {
        key: 'PATCH /api/projects/{projectId}/headings/{headingId}',
        url: `${p.base}/headings/${p.headingId}`,
        as: p.as('admin'),
        body: { version: heading.version, name: heading.name },
      },
      {
        key: 'POST /api/projects/{projectId}/support-classes',
        url: `${p.base}/support-classes`,
        as: p.as('admin'),
        body: { code: 'C9', name: 'New class', maxRoundLength: 2, qMin: 0.001, qMax: 0.1 },
      },
      {
        key: 'PUT /api/projects/{projectId}/support-classes/order',
        url: `${p.base}/support-classes/order`,
        as: p.as('admin'),
        body: { ids: classes.map((c) => c.id) },
      },
      {
        key: 'PATCH /api/projects/{projectId}/support-classes/{classId}',
        url: `${p.base}/support-classes/${classes[0].id}`,
        as: p.as('admin'),
        body: { version: classes[0].version, name: classes[0].name },
      },
      {
        key: 'POST /api/projects/{projectId}/trigger-rules',
        url: `${p.base}/trigger-rules`,
        as: p.as('admin'),
        body: validRule,
      },
      {
        key: 'POST /api/projects/{projectId}/trigger-rules/preview',
        url: `${p.base}/trigger-rules/preview`,
        as: p.as('admin'),
        body: validRule,
      },
      {
        key: 'PATCH /api/projects/{projectId}/trigger-rules/{ruleId}',
        url: `${p.base}/trigger-rules/${rule.id}`,
        as: p.as('admin'),
        body: { version: rule.version, action: rule.action },
      },
      {
        key: 'POST /api/projects/{projectId}/invitations',
        url: `${p.base}/invitations`,
        as: p.as('admin'),
        body: { email: `new.${code.toLowerCase()}@roundbook.test`, role: 'viewer', name: 'New' },
      },
      {
        key: 'PATCH /api/projects/{projectId}/members/{memberId}',
        url: `${p.base}/members/${memberId}`,
        as: p.as('admin'),
        body: { role: 'viewer' },
      },
      {
        key: 'POST /api/invitations/{token}/accept',
        url: '/api/invitations/not-a-real-token/accept',
        as: {},
        body: { name: 'Someone', password: 'long-enough-pw' },
      },
      {
        key: 'POST /api/projects/{projectId}/headings/{headingId}/rounds',
        url: `${p.base}/headings/${p.headingId}/rounds`,
        as: p.as('geologist'),
        body: { stage: 'full-face', faceChainage: 1006 },
      },
      {
        key: 'PUT /api/projects/{projectId}/rounds/{roundId}',
        url: `${p.base}/rounds/${round.id}`,
        as: p.as('geologist'),
        body: saveBody(round),
      },
      {
        key: 'POST /api/projects/{projectId}/rounds/{roundId}/submit',
        url: `${p.base}/rounds/${round.id}/submit`,
        as: p.as('geologist'),
        body: { version: round.version },
      },
      // Review (issue 11): the body is checked before the round's state, so a draft serves.
      {
        key: 'POST /api/projects/{projectId}/rounds/{roundId}/confirm',
        url: `${p.base}/rounds/${round.id}/confirm`,
        as: p.as('engineer'),
        body: {
          version: round.version,
          classId: classes[0].id,
          roundLength: 3,
          reason: 'Because.',
          comments: '',
          password: 'rb-test-2026-pw',
        },
      },
      {
        key: 'POST /api/projects/{projectId}/rounds/{roundId}/return',
        url: `${p.base}/rounds/${round.id}/return`,
        as: p.as('engineer'),
        body: { version: round.version, comments: [{ section: 'ground', text: 'Check the inflow.' }] },
      },
      {
        key: 'POST /api/projects/{projectId}/rounds/{roundId}/correct',
        url: `${p.base}/rounds/${round.id}/correct`,
        as: p.as('engineer'),
        body: { version: round.version, reason: 'The face chainage was mistyped.' },
      },
      {
        key: 'POST /api/projects/{projectId}/rounds/{roundId}/triggers/{ruleId}/acknowledge',
        url: `${p.base}/rounds/${round.id}/triggers/${rule.id}/acknowledge`,
        as: p.as('engineer'),
        body: { actionTaken: 'Probed ahead.', note: '' },
      },
      {
        key: 'POST /api/projects/{projectId}/rounds/{roundId}/triggers/{ruleId}/accept',
        url: `${p.base}/rounds/${round.id}/triggers/${rule.id}/accept`,
        as: p.as('engineer'),
        body: { fromChainage: 1000, toChainage: 1030, until: null, reason: 'Covered by the class.' },
      },
      // Photos (issue 14): the body is checked before the photo is looked up.
      {
        key: 'POST /api/projects/{projectId}/rounds/{roundId}/photos',
        url: `${p.base}/rounds/${round.id}/photos`,
        as: p.as('geologist'),
        body: { fileName: 'face.jpg', contentType: 'image/jpeg', size: 1000 },
      },
      {
        key: 'POST /api/projects/{projectId}/rounds/{roundId}/photos/{photoId}/complete',
        url: `${p.base}/rounds/${round.id}/photos/${round.id}/complete`,
        as: p.as('geologist'),
        body: { parts: [{ partNumber: 1, etag: '"abc"' }] },
      },
      {
        key: 'PATCH /api/projects/{projectId}/rounds/{roundId}/photos/{photoId}',
        url: `${p.base}/rounds/${round.id}/photos/${round.id}`,
        as: p.as('geologist'),
        body: { caption: 'Crown, left of axis' },
      },
      // Hazards (issue 15): the body is checked before the hazard is looked up.
      {
        key: 'POST /api/projects/{projectId}/headings/{headingId}/hazards',
        url: `${p.base}/headings/${p.headingId}/hazards`,
        as: p.as('geologist'),
        body: {
          kind: 'wedge',
          fromChainage: 1001,
          toChainage: 1003,
          level: 'red',
          description: 'Wedge in the crown.',
          origin: 'round',
          roundId: round.id,
          photoIds: [],
        },
      },
      {
        key: 'PATCH /api/projects/{projectId}/headings/{headingId}/hazards/{hazardId}',
        url: `${p.base}/headings/${p.headingId}/hazards/${round.id}`,
        as: p.as('engineer'),
        body: { version: 1, level: 'amber', fromChainage: 1001, description: 'Smaller than first seen.' },
      },
      {
        key: 'POST /api/projects/{projectId}/headings/{headingId}/hazards/{hazardId}/close',
        url: `${p.base}/headings/${p.headingId}/hazards/${round.id}/close`,
        as: p.as('engineer'),
        body: { version: 1, reason: 'Scaled down and bolted.' },
      },
      {
        // The only supervisor hands over to themselves: a body that passes validation still gets a 400.
        key: 'POST /api/projects/{projectId}/handovers',
        url: `${p.base}/handovers`,
        as: p.as('supervisor'),
        body: {
          shiftDate: '2026-12-03',
          shift: 'night',
          incomingUserId: (team.members as Body[]).find((m) => m.role === 'supervisor')!.userId as string,
          headings: [{ headingId: p.headingId, cycleStage: 'drilling', notes: '' }],
          generalNotes: 'Invented notes',
          extraRecipients: ['office@roundbook.test'],
        },
      },
      {
        key: 'POST /api/projects/{projectId}/handovers/{handoverId}/acknowledge',
        url: `${p.base}/handovers/${round.id}/acknowledge`,
        as: p.as('supervisor'),
        body: { comment: 'Understood.' },
      },
      {
        // The round is a draft: a body that passes the checks still gets 409 (not confirmed), never a write.
        key: 'PUT /api/projects/{projectId}/rounds/{roundId}/support-record',
        url: `${p.base}/rounds/${round.id}/support-record`,
        as: p.as('supervisor'),
        body: {
          version: 0,
          items: [{ element: 'bolts', status: 'done', quantity: 12, length: 3, reason: '' }],
        },
      },
      {
        // The caller's own notice choice (issue 11): every flag is a required boolean, red must be true.
        key: 'PUT /api/projects/{projectId}/notice-settings',
        url: `${p.base}/notice-settings`,
        as: p.as('engineer'),
        body: { submitted: true, ruleOverdue: true, returned: true, confirmedOtherClass: true, red: false },
      },
    );
  });

  it('has a case for every route with a JSON body (a new route fails until it gets one)', () => {
    const bodyRoutes = Object.entries(document.paths).flatMap(([route, ops]) =>
      Object.entries(ops)
        // JSON bodies (a photo's parts are raw bytes, checked by their own e2e).
        .filter(([, op]) => op.requestBody?.content?.['application/json'] !== undefined)
        .map(([m]) => `${m.toUpperCase()} ${route}`),
    );
    expect(bodyRoutes.filter((r) => !cases.some((c) => c.key === r))).toEqual([]);
    expect(cases.length).toBeGreaterThan(20);
  });

  // One test per route, so a slow machine gets each route its own time and a failure names its route.
  it.each(ROUTE_KEYS)('%s: every generated invalid body gets a 4xx and writes nothing', async (key) => {
    const c = cases.find((x) => x.key === key)!;
    expect(c).toBeDefined();
    const before = await checksums();
    const wrong: string[] = [];
    let sent = 0;
    const [method, route] = c.key.split(' ');
    const schema = document.paths[route][method.toLowerCase()].requestBody.content['application/json']
      .schema as Schema;
    const bodies: Array<{ where: string; value: unknown; body: unknown }> = [
      { where: '(body)', value: 'nested 2000 deep', body: deep(2000) },
      { where: '(body)', value: 'an array', body: [c.body] },
      { where: '(body)', value: 'x', body: 'x' },
      ...mutations(c.body, schema).map((m) => ({
        where: m.where,
        value: m.value,
        body: withValue(c.body, m.where, m.value),
      })),
    ];
    for (const b of bodies) {
      const verb = method.toLowerCase() as 'post' | 'put' | 'patch';
      const call = request(http);
      const res = await call[verb](c.url)
        .set(c.as)
        .set('Content-Type', 'application/json')
        .send(JSON.stringify(b.body));
      sent++;
      const shown = JSON.stringify(b.value)?.slice(0, 60);
      if (res.status >= 500 || res.status < 400) wrong.push(`${c.key} ${b.where}=${shown}: ${res.status}`);
    }
    // three whole-body cases, and at least one refused value for every property but the version
    const props = Object.keys((resolve(schema).properties ?? {}) as object).filter((n) => n !== 'version');
    expect(sent).toBe(bodies.length);
    expect(sent).toBeGreaterThanOrEqual(3 + props.length);
    expect(wrong).toEqual([]);
    expect(await checksums()).toBe(before);
  });
});
