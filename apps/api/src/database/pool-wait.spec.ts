import { EventEmitter } from 'node:events';
import type { NextFunction, Request, Response } from 'express';
import { boundPoolWaits, PoolWaitTimeoutError, RequestAbandonedError, requestSignal } from './pool-wait';

type Cb = (err: Error | null, connection?: { release(): void }) => void;

/** A pool that hands out connections only when the test says so (as a busy mysql2 pool queues callers). */
function fakePool() {
  const waiting: Cb[] = [];
  const pool = { getConnection: (cb: Cb) => void waiting.push(cb) };
  const connection = () => ({ release: jest.fn() });
  return { pool, waiting, connection };
}

function deferred() {
  let resolve!: () => void;
  const promise = new Promise<void>((r) => (resolve = r));
  return { promise, resolve };
}

/** Runs `body` as the handler of a request with this method; `close()` is the client going away. */
function inRequest(method: string, body: () => void) {
  const res = Object.assign(new EventEmitter(), { writableFinished: false });
  requestSignal({ method } as Request, res as unknown as Response, body as NextFunction);
  return { close: () => res.emit('close') };
}

describe('boundPoolWaits (common practice: a bounded acquire, shed work whose client has gone)', () => {
  beforeEach(() => jest.useFakeTimers());
  afterEach(() => jest.useRealTimers());

  it('answers a waiter PoolWaitTimeoutError after waitMs, and gives a late connection back to the pool', () => {
    const { pool, waiting, connection } = fakePool();
    boundPoolWaits(pool, 3000);
    const cb = jest.fn();
    pool.getConnection(cb);
    jest.advanceTimersByTime(2999);
    expect(cb).not.toHaveBeenCalled();
    jest.advanceTimersByTime(1);
    expect(cb).toHaveBeenCalledTimes(1);
    expect(cb.mock.calls[0][0]).toBeInstanceOf(PoolWaitTimeoutError);
    const late = connection();
    waiting[0](null, late);
    expect(late.release).toHaveBeenCalledTimes(1);
    expect(cb).toHaveBeenCalledTimes(1);
  });

  it('passes a connection that comes in time through, once, and its timer never fires', () => {
    const { pool, waiting, connection } = fakePool();
    boundPoolWaits(pool, 3000);
    const cb = jest.fn();
    pool.getConnection(cb);
    const c = connection();
    waiting[0](null, c);
    jest.advanceTimersByTime(10_000);
    expect(cb.mock.calls).toEqual([[null, c]]);
    expect(c.release).not.toHaveBeenCalled();
  });

  it('does not ask the pool at all for a request whose client has already gone', async () => {
    const { pool, waiting } = fakePool();
    boundPoolWaits(pool, 3000);
    const cb = jest.fn();
    const gate = deferred();
    // the handler's first query comes after the client has closed
    const req = inRequest('GET', () => void gate.promise.then(() => pool.getConnection(cb)));
    req.close();
    gate.resolve();
    await gate.promise;
    jest.runAllTicks();
    expect(waiting).toHaveLength(0);
    expect(cb.mock.calls[0][0]).toBeInstanceOf(RequestAbandonedError);
  });

  it('answers a queued read at once when its client goes, and the connection it would have had goes back', () => {
    const { pool, waiting, connection } = fakePool();
    boundPoolWaits(pool, 3000);
    const cb = jest.fn();
    const req = inRequest('GET', () => pool.getConnection(cb));
    expect(waiting).toHaveLength(1);
    req.close();
    expect(cb.mock.calls[0][0]).toBeInstanceOf(RequestAbandonedError);
    const c = connection();
    waiting[0](null, c);
    expect(c.release).toHaveBeenCalledTimes(1);
    jest.advanceTimersByTime(10_000);
    expect(cb).toHaveBeenCalledTimes(1);
  });

  it('lets a write that has run a query finish after its client has gone, and sheds a read', async () => {
    const { pool, waiting, connection } = fakePool();
    boundPoolWaits(pool, 3000);
    const run = (method: string) => {
      const first = jest.fn();
      const second = jest.fn();
      const gate = deferred();
      const req = inRequest(method, () => {
        pool.getConnection(first);
        // its second query, asked for in the same request once the test opens the gate
        void gate.promise.then(() => pool.getConnection(second));
      });
      return { first, second, gate, req };
    };
    const write = run('PUT');
    waiting[0](null, connection());
    expect(write.first.mock.calls[0][0]).toBeNull();
    write.req.close();
    write.gate.resolve();
    await write.gate.promise;
    expect(waiting).toHaveLength(2);
    const c = connection();
    waiting[1](null, c);
    expect(write.second.mock.calls).toEqual([[null, c]]);

    const read = run('GET');
    waiting[2](null, connection());
    read.req.close();
    read.gate.resolve();
    await read.gate.promise;
    jest.runAllTicks();
    expect(waiting).toHaveLength(3);
    expect(read.second.mock.calls[0][0]).toBeInstanceOf(RequestAbandonedError);
  });

  it('sheds a write that is still waiting for its first connection when its client goes', () => {
    const { pool, waiting } = fakePool();
    boundPoolWaits(pool, 3000);
    const cb = jest.fn();
    inRequest('PUT', () => pool.getConnection(cb)).close();
    expect(waiting).toHaveLength(1);
    expect(cb.mock.calls[0][0]).toBeInstanceOf(RequestAbandonedError);
  });

  it('does not shed a request whose answer was written before the connection closed', () => {
    const { pool, waiting } = fakePool();
    boundPoolWaits(pool, 3000);
    const cb = jest.fn();
    const res = Object.assign(new EventEmitter(), { writableFinished: false });
    requestSignal(
      { method: 'GET' } as Request,
      res as unknown as Response,
      (() => pool.getConnection(cb)) as NextFunction,
    );
    res.writableFinished = true;
    res.emit('close');
    expect(waiting).toHaveLength(1);
    expect(cb).not.toHaveBeenCalled();
  });
});
