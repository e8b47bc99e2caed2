import { AsyncLocalStorage } from 'node:async_hooks';
import type { NextFunction, Request, Response } from 'express';
import type { DataSource } from 'typeorm';

/**
 * Bounded waits for a pooled MariaDB connection, and no queries for a client that has gone.
 *
 * mysql2's pool (3.x) queues `getConnection` callers without any time limit: its options are
 * `waitForConnections`, `connectionLimit`, `maxIdle`, `idleTimeout` and `queueLimit`, none of them a wait
 * time (TypeORM's `acquireTimeout` is passed through but mysql2 ignores it, with a warning). A full queue
 * (`queueLimit`) refuses at once instead of waiting a little, so the bound is added here, around the pool's
 * own `getConnection`: whoever has waited `waitMs` is answered with {@link PoolWaitTimeoutError} (a 503
 * with Retry-After through the global filter), and a connection that arrives after that goes straight back
 * to the pool, where the next waiter gets it.
 */

/** No pooled connection came free within the configured wait (DB_POOL_WAIT_MS). */
export class PoolWaitTimeoutError extends Error {
  override readonly name = 'PoolWaitTimeoutError';
  constructor(readonly waitMs: number) {
    super(`No database connection came free within ${waitMs} ms`);
  }
}

/** The client closed its connection before this request's queries ran: they were not run. */
export class RequestAbandonedError extends Error {
  override readonly name = 'RequestAbandonedError';
  constructor() {
    super('The client closed the connection before the request reached the database');
  }
}

interface RequestState {
  /** Aborted when the response is closed before it was finished (the client gave up). */
  signal: AbortSignal;
  /** Only reads are shed once they have started; a write that has run a query is left to finish. */
  readOnly: boolean;
  started: boolean;
}

const requests = new AsyncLocalStorage<RequestState>();

/**
 * Express middleware: ties the rest of the request to an AbortSignal that fires when the client closes the
 * connection before the answer was written. Mounted as Nest middleware, i.e. after the body parsers.
 */
export function requestSignal(req: Request, res: Response, next: NextFunction): void {
  const controller = new AbortController();
  res.once('close', () => {
    if (!res.writableFinished) controller.abort();
  });
  const state: RequestState = {
    signal: controller.signal,
    readOnly: req.method === 'GET' || req.method === 'HEAD',
    started: false,
  };
  requests.run(state, next);
}

type GetConnectionCallback = (err: Error | null, connection?: { release(): void }) => void;
interface CallbackPool {
  getConnection(cb: GetConnectionCallback): void;
}

/** Wraps the pool's getConnection: bounded by `waitMs`, and given up when the request's client has gone. */
export function boundPoolWaits(pool: CallbackPool, waitMs: number): void {
  const getConnection = pool.getConnection.bind(pool);
  pool.getConnection = (cb: GetConnectionCallback) => {
    const state = requests.getStore();
    // A read may be dropped at any of its queries; a write only before its first one, so that a write the
    // client stopped waiting for is never left half done by us.
    const signal = state && (state.readOnly || !state.started) ? state.signal : undefined;
    if (signal?.aborted) {
      process.nextTick(() => cb(new RequestAbandonedError()));
      return;
    }
    let settled = false;
    const settle = (err: Error | null, connection?: { release(): void }): void => {
      settled = true;
      clearTimeout(timer);
      signal?.removeEventListener('abort', onAbort);
      if (!err && state) state.started = true;
      cb(err, connection);
    };
    const onAbort = (): void => settle(new RequestAbandonedError());
    const timer = setTimeout(() => settle(new PoolWaitTimeoutError(waitMs)), waitMs);
    signal?.addEventListener('abort', onAbort, { once: true });
    getConnection((err, connection) => {
      if (!settled) settle(err, connection);
      else if (!err) connection?.release();
    });
  };
}

/** The mysql2 pool behind a TypeORM DataSource on the mysql/mariadb driver. */
export function poolOf(dataSource: DataSource): CallbackPool {
  const pool = (dataSource.driver as unknown as { pool?: CallbackPool }).pool;
  if (!pool || typeof pool.getConnection !== 'function')
    throw new Error('The database driver has no mysql2 pool to bound');
  return pool;
}
