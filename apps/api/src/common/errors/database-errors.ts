import { QueryFailedError, TypeORMError } from 'typeorm';
import { PoolWaitTimeoutError, RequestAbandonedError } from '../../database/pool-wait.js';

/** MariaDB's error number of a failed query, if it is one. */
export function dbErrno(error: unknown): number | undefined {
  if (!(error instanceof QueryFailedError)) return undefined;
  const e = error.driverError as { errno?: number } | undefined;
  return e?.errno;
}

/** ER_ROW_IS_REFERENCED_2 (1451): a foreign key with RESTRICT holds the row. */
export const isRowReferenced = (error: unknown): boolean => dbErrno(error) === 1451;
/** ER_DUP_ENTRY (1062): a unique key already holds the value. */
export const isDuplicateKey = (error: unknown): boolean => driverErrorOf(error)?.errno === 1062;
/** ER_LOCK_DEADLOCK (1213): the transaction was rolled back for another; it may be run again from BEGIN. */
export const isDeadlock = (error: unknown): boolean => driverErrorOf(error)?.errno === 1213;

/** How the global filter answers a database error: status, code, message, and a retry hint for outages. */
export interface DatabaseErrorAnswer {
  status: 400 | 409 | 503;
  message: string;
  retryAfterSeconds?: number;
}

/** MariaDB error numbers that mean the value sent does not fit the column (out of range, too long, bad value). */
const BAD_VALUE = new Set([
  1048, // ER_BAD_NULL_ERROR: column cannot be null
  1264, // ER_WARN_DATA_OUT_OF_RANGE
  1265, // WARN_DATA_TRUNCATED
  1292, // ER_TRUNCATED_WRONG_VALUE (dates such as 2026-02-30)
  1366, // ER_TRUNCATED_WRONG_VALUE_FOR_FIELD (bad character or number)
  1367, // ER_ILLEGAL_VALUE_FOR_TYPE
  1406, // ER_DATA_TOO_LONG
  1690, // ER_DATA_OUT_OF_RANGE (BIGINT UNSIGNED value is out of range)
  3140, // ER_INVALID_JSON_TEXT
  4025, // ER_CONSTRAINT_FAILED (a CHECK such as JSON_VALID)
  4038, // ER_JSON_SYNTAX
]);
/** Transient: the database is busy or briefly unreachable; trying again later can succeed. */
const TRANSIENT_ERRNO = new Set([
  1040, // ER_CON_COUNT_ERROR: too many connections
  1047, // ER_UNKNOWN_COM_ERROR: a Galera node not yet synced (stack-notes §13)
  1053, // ER_SERVER_SHUTDOWN
  1205, // ER_LOCK_WAIT_TIMEOUT
  1213, // ER_LOCK_DEADLOCK
  1927, // ER_CONNECTION_KILLED
  2002, // CR_CONNECTION_ERROR
  2003, // CR_CONN_HOST_ERROR
  2006, // CR_SERVER_GONE_ERROR
  2013, // CR_SERVER_LOST
  4031, // ER_CLIENT_INTERACTION_TIMEOUT
]);
const TRANSIENT_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENOTFOUND',
  'EPIPE',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_LOCK_WAIT_TIMEOUT',
  'ER_LOCK_DEADLOCK',
  'POOL_CLOSED',
]);

/** The mysql2 error behind a TypeORM error, or the error itself when it came straight from the pool. */
function driverErrorOf(error: unknown): { errno?: number; code?: string; message?: string } | undefined {
  if (error instanceof QueryFailedError) return error.driverError as { errno?: number; code?: string };
  if (error && typeof error === 'object') {
    const e = error as { errno?: unknown; code?: unknown; driverError?: unknown };
    if (e.driverError && typeof e.driverError === 'object') return e.driverError;
    // mysql2's own errors (from the pool, before any query) carry `fatal` or `sqlState`.
    const fromDriver = 'fatal' in e || 'sqlState' in e || error instanceof TypeORMError;
    if (fromDriver && (typeof e.code === 'string' || typeof e.errno === 'number')) return error;
  }
  return undefined;
}

/**
 * Maps a database error to a 4xx or 503 answer, or undefined when it is not one this product can explain.
 * Messages name no table, key or host.
 */
export function answerOfDatabaseError(error: unknown): DatabaseErrorAnswer | undefined {
  // Every pooled connection stayed busy for DB_POOL_WAIT_MS: the API is overloaded, not down.
  if (error instanceof PoolWaitTimeoutError)
    return {
      status: 503,
      message: 'The server is busy just now. Nothing was changed; try again in a few seconds.',
      retryAfterSeconds: 5,
    };
  // Nobody reads this answer (the client has closed the connection); it only has to be a clean one.
  if (error instanceof RequestAbandonedError)
    return { status: 503, message: 'The request was given up before it was run.', retryAfterSeconds: 5 };
  const d = driverErrorOf(error);
  if (!d) return undefined;
  const { errno, code } = d;
  if (errno === 1062)
    return {
      status: 409,
      message:
        'Something with the same code, name or address already exists (perhaps saved a moment ago). Reload and check.',
    };
  if (errno === 1451)
    return { status: 409, message: 'This is still in use elsewhere and cannot be removed.' };
  if (errno === 1452)
    return { status: 400, message: 'The request refers to something that does not exist (any more).' };
  if (errno !== undefined && BAD_VALUE.has(errno))
    return {
      status: 400,
      message:
        'A value in the request is out of range, too long or not valid for its field. Nothing was saved.',
    };
  if (
    (errno !== undefined && TRANSIENT_ERRNO.has(errno)) ||
    (code !== undefined && TRANSIENT_CODES.has(code))
  )
    return {
      status: 503,
      message: 'The database is not answering just now. Nothing was lost; try again in a few seconds.',
      retryAfterSeconds: errno === 1205 || errno === 1213 ? 2 : 10,
    };
  return undefined;
}
