import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { App } from 'supertest/types';
import { DataSource, type QueryRunner } from 'typeorm';
import { poolOf, PoolWaitTimeoutError, RequestAbandonedError } from '../src/database/pool-wait';
import { makeProject, type TestProject } from './factories';
import { createTestApp } from './test-app';

// Issue 20 item 4: a request queued behind a busy pool is answered 503 with Retry-After within DB_POOL_WAIT_MS
// (never a 500, never a wait without end), a request whose client has gone runs no query, and the API goes on
// as before once connections are free again. The pool of this test's app has 2 connections; the test holds
// both through query runners of its own (each keeps its connection until released).
type Body = Record<string, any>;
type Cb = (err: Error | null, connection?: unknown) => void;
const code = `PW${Date.now() % 1e5}`;
const POOL_SIZE = 2;
const WAIT_MS = 1000;

describe('pool wait: bounded, shed when the client has gone, recovering (e2e, real MariaDB)', () => {
  let app: INestApplication;
  let http: App;
  let p: TestProject;
  let dataSource: DataSource;
  const held: QueryRunner[] = [];

  const holdEveryConnection = async () => {
    for (let i = 0; i < POOL_SIZE; i++) {
      const runner = dataSource.createQueryRunner();
      await runner.connect();
      held.push(runner);
    }
  };
  const releaseAll = async () => {
    while (held.length) await held.pop()!.release();
  };

  beforeAll(async () => {
    app = await createTestApp((c) => ({
      ...c,
      database: { ...c.database, poolSize: POOL_SIZE, poolWaitMs: WAIT_MS },
      // No background worker: every connection of the pool is the test's or its requests'.
      jobs: { ...c.jobs, workerEnabled: false },
    }));
    await app.listen(0, '127.0.0.1');
    http = app.getHttpServer() as App;
    p = await makeProject(app, { code });
    dataSource = app.get(DataSource);
  });

  afterEach(async () => {
    jest.restoreAllMocks();
    await releaseAll();
  });

  afterAll(async () => {
    await app.close();
  });

  it('answers a read 503 with Retry-After once DB_POOL_WAIT_MS has passed, then 200 when a connection is free', async () => {
    await request(http).get('/api/projects').set(p.as('viewer')).expect(200);
    await holdEveryConnection();

    const t0 = performance.now();
    const busy = await request(http).get('/api/projects').set(p.as('viewer'));
    const waited = performance.now() - t0;
    expect(busy.status).toBe(503);
    expect(busy.headers['retry-after']).toBe('5');
    expect(busy.body).toEqual({
      code: 'SERVICE_UNAVAILABLE',
      message: 'The server is busy just now. Nothing was changed; try again in a few seconds.',
    });
    // Answered by the bound, not before it and not long after (a loaded machine may add some time).
    expect(waited).toBeGreaterThanOrEqual(WAIT_MS - 20);
    expect(waited).toBeLessThan(WAIT_MS + 2000);
    // A route that touches no connection is not held up meanwhile.
    await request(http).get('/api/health/live').expect(200);

    await releaseAll();
    const again = await request(http).get('/api/projects').set(p.as('viewer')).expect(200);
    expect((again.body as Body[]).map((x) => x.id)).toContain(p.projectId);
  });

  it('answers a write 503 too and saves nothing of it', async () => {
    const before = (
      await request(http).get(`${p.base}/headings/${p.headingId}/rounds`).set(p.as('viewer')).expect(200)
    ).body as Body;
    await holdEveryConnection();

    const res = await request(http)
      .post(`${p.base}/headings/${p.headingId}/rounds`)
      .set(p.as('geologist'))
      .send({ stage: 'full-face', faceChainage: 1003 });
    expect(res.status).toBe(503);
    expect(res.headers['retry-after']).toBe('5');
    expect((res.body as Body).code).toBe('SERVICE_UNAVAILABLE');

    await releaseAll();
    const after = (
      await request(http).get(`${p.base}/headings/${p.headingId}/rounds`).set(p.as('viewer')).expect(200)
    ).body as Body;
    expect(after.total).toBe(before.total);
    await request(http)
      .post(`${p.base}/headings/${p.headingId}/rounds`)
      .set(p.as('geologist'))
      .send({ stage: 'full-face', faceChainage: 1003 })
      .expect(201);
  });

  it('gives up the wait of a request as soon as its client closes the connection, before any query', async () => {
    await holdEveryConnection();
    const pool = poolOf(dataSource) as { getConnection: (cb: Cb) => void };
    const getConnection = pool.getConnection.bind(pool);
    let reached!: () => void;
    const queued = new Promise<void>((r) => (reached = r));
    const outcome = new Promise<{ err: Error | null; at: number }>((resolve) => {
      jest.spyOn(pool, 'getConnection').mockImplementationOnce((cb: Cb) => {
        getConnection((err, connection) => {
          resolve({ err, at: performance.now() });
          cb(err, connection);
        });
        reached();
      });
    });

    const { port } = (app.getHttpServer() as { address(): AddressInfo }).address();
    const client = httpRequest({
      host: '127.0.0.1',
      port,
      path: '/api/projects',
      headers: p.as('viewer'),
    });
    client.on('error', () => undefined); // the test closes it
    client.end();
    await queued;
    const closedAt = performance.now();
    client.destroy();

    const { err, at } = await outcome;
    expect(err).toBeInstanceOf(RequestAbandonedError);
    expect(err).not.toBeInstanceOf(PoolWaitTimeoutError);
    // Given up by the client's going, not by the bound.
    expect(at - closedAt).toBeLessThan(WAIT_MS / 2);

    await releaseAll();
    await request(http).get('/api/projects').set(p.as('viewer')).expect(200);
  });
});
