// Setup, support classes: each test file makes its own project (factories.ts), so it needs nothing from the demo seed.
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { latestAudit, makeProject, type TestProject } from './factories';
import { createTestApp } from './test-app';

type Body = Record<string, any>;
const code = `SC${String(Date.now() % 1e6)}`;

describe('Setup: support classes (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;

  const lastAudit = (entityId: string) => latestAudit(app, entityId);

  beforeAll(async () => {
    app = await createTestApp();
    http = app.getHttpServer() as App;
    // A library of three classes on both systems, best ground first (the order the admin keeps).
    p = await makeProject(app, {
      code,
      classes: [
        { code: 'SC-A', name: 'Spot bolts', maxRoundLength: 4, qMin: 10, rmrMin: 61 },
        {
          code: 'SC-B',
          name: 'Pattern bolts and mesh',
          maxRoundLength: 3,
          qMin: 1,
          qMax: 10,
          rmrMin: 41,
          rmrMax: 60,
        },
        { code: 'SC-C', name: 'Sprayed concrete and bolts', maxRoundLength: 2, qMax: 1, rmrMax: 40 },
      ],
    });
  });

  afterAll(async () => {
    await app.close();
  });

  it('twenty classes created at once: every one 201, numbered 1…N with no duplicate sort order (issue 18 item 4)', async () => {
    const q = await makeProject(app, { code: `${code}Z` });
    const answers = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        request(http)
          .post(`${q.base}/support-classes`)
          .set(q.as('admin'))
          .send({
            code: `Z-${String(i).padStart(2, '0')}`,
            name: `Class ${i}`,
            maxRoundLength: 2,
            qMin: 1 + i,
            qMax: 2 + i,
          }),
      ),
    );
    expect(answers.filter((a) => a.status !== 201).map((a) => a.body as Body)).toEqual([]);
    const library = await request(http).get(`${q.base}/support-classes`).set(q.as('admin')).expect(200);
    const orders = (library.body.classes as Body[]).map((c) => c.sortOrder as number);
    // makeProject's own small library first, then the twenty: 1…N, each once.
    expect(orders.length).toBeGreaterThanOrEqual(20);
    expect([...orders].sort((a, b) => a - b)).toEqual(Array.from({ length: orders.length }, (_, i) => i + 1));
  });

  it('shows the library best ground first, with no range warnings', async () => {
    const res = await request(http).get(`${p.base}/support-classes`).set(p.as('supervisor')).expect(200);
    expect((res.body.classes as Body[]).map((c) => c.code)).toEqual(['SC-A', 'SC-B', 'SC-C']);
    expect(res.body.warnings).toEqual([]);
  });

  it('warns when a new class overlaps, lets the admin retire, reorder and delete, and audits each step', async () => {
    const base = p.base;
    const as = p.as;
    await request(http)
      .post(`${base}/support-classes`)
      .set(as('engineer'))
      .send({ code: 'X', name: 'x', maxRoundLength: 2, qMin: 1 })
      .expect(403);
    const bad = await request(http)
      .post(`${base}/support-classes`)
      .set(as('admin'))
      .send({ code: 'SC-X', name: 'No range', maxRoundLength: 2 })
      .expect(400);
    expect(bad.body.fields).toEqual({ qMin: expect.stringMatching(/Q range, an RMR89 range/) });
    const inverted = await request(http)
      .post(`${base}/support-classes`)
      .set(as('admin'))
      .send({ code: 'SC-X', name: 'x', maxRoundLength: 2, qMin: 5, qMax: 2 })
      .expect(400);
    expect(Object.keys(inverted.body.fields as object)).toEqual(['qMax']);

    const added = await request(http)
      .post(`${base}/support-classes`)
      .set(as('admin'))
      .send({
        code: 'SC-B2',
        name: 'Systematic bolting, wet ground',
        maxRoundLength: 3,
        qMin: 2,
        qMax: 8,
        rmrMin: 50,
        rmrMax: 60,
        shotcreteMm: 75,
        probingRequired: true,
      })
      .expect(201);
    const library = added.body as Body;
    const b2 = (library.classes as Body[]).find((c) => c.code === 'SC-B2')!;
    expect(b2.sortOrder).toBe(
      Math.max(
        ...(library.classes as Body[]).filter((c) => c.code !== 'SC-B2').map((c) => c.sortOrder as number),
      ) + 1,
    );
    expect(library.warnings).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ kind: 'overlap', system: 'Q', classes: ['SC-B', 'SC-B2'] }),
        expect.objectContaining({ kind: 'overlap', system: 'RMR89', classes: ['SC-B', 'SC-B2'] }),
      ]),
    );

    const idOf = (c: string): string => (library.classes as Body[]).find((x) => x.code === c)!.id as string;
    const reordered = ['SC-A', 'SC-B', 'SC-B2', 'SC-C'].map(idOf);
    const afterOrder = await request(http)
      .put(`${base}/support-classes/order`)
      .set(as('admin'))
      .send({ ids: reordered })
      .expect(200);
    expect((afterOrder.body.classes as Body[]).map((c) => c.code)).toEqual(['SC-A', 'SC-B', 'SC-B2', 'SC-C']);
    await request(http)
      .put(`${base}/support-classes/order`)
      .set(as('admin'))
      .send({ ids: reordered.slice(1) })
      .expect(409);

    // Reordering changed SC-B2's position, so its version moved on.
    const b2Now = (afterOrder.body.classes as Body[]).find((c) => c.id === b2.id)!;
    expect(b2Now.version).toBe((b2.version as number) + 1);
    const retired = await request(http)
      .patch(`${base}/support-classes/${b2.id}`)
      .set(as('admin'))
      .send({ retired: true, version: b2Now.version })
      .expect(200);
    expect(retired.body.warnings).toEqual([]);
    expect(await lastAudit(b2.id as string)).toMatchObject({
      action: 'retire',
      before: { retired: false },
      after: { retired: true },
    });
    await request(http)
      .patch(`${base}/support-classes/${b2.id}`)
      .set(as('admin'))
      .send({ notes: 'late', version: b2Now.version })
      .expect(409);

    const removed = await request(http)
      .delete(`${base}/support-classes/${b2.id}`)
      .set(as('admin'))
      .expect(200);
    expect((removed.body.classes as Body[]).map((c) => c.code)).not.toContain('SC-B2');
    expect(await lastAudit(b2.id as string)).toMatchObject({
      action: 'delete',
      before: expect.objectContaining({ code: 'SC-B2' }),
    });
  });
});
