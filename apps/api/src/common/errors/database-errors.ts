import { QueryFailedError } from 'typeorm';

/** MariaDB's error number of a failed query, if it is one. */
export function dbErrno(error: unknown): number | undefined {
  if (!(error instanceof QueryFailedError)) return undefined;
  const e = error.driverError as { errno?: number } | undefined;
  return e?.errno;
}

/** ER_ROW_IS_REFERENCED_2 (1451): a foreign key with RESTRICT holds the row. */
export const isRowReferenced = (error: unknown): boolean => dbErrno(error) === 1451;
/** ER_DUP_ENTRY (1062): a unique key already holds the value. */
export const isDuplicateKey = (error: unknown): boolean => dbErrno(error) === 1062;

/** What a database failure means to the caller, or null when it is not one the caller can act on. */
export type DatabaseFailure =
  | { kind: 'conflict'; message: string }
  | { kind: 'bad-value'; message: string }
  | { kind: 'unavailable'; message: string };

// MariaDB error numbers (https://mariadb.com/kb/en/mariadb-error-codes/).
const BAD_VALUE = new Set([
  1048, // ER_BAD_NULL_ERROR: a column cannot be null
  1264, // ER_WARN_DATA_OUT_OF_RANGE
  1265, // WARN_DATA_TRUNCATED
  1292, // ER_TRUNCATED_WRONG_VALUE (dates)
  1366, // ER_TRUNCATED_WRONG_VALUE_FOR_FIELD
  1406, // ER_DATA_TOO_LONG
  1690, // ER_DATA_OUT_OF_RANGE
  3140, // ER_INVALID_JSON_TEXT
  4025, // ER_CONSTRAINT_FAILED (CHECK, JSON_VALID)
]);
const UNAVAILABLE = new Set([
  1040, // ER_CON_COUNT_ERROR: too many connections
  1047, // ER_UNKNOWN_COM_ERROR: a Galera node not ready
  1053, // ER_SERVER_SHUTDOWN
  1205, // ER_LOCK_WAIT_TIMEOUT
  1213, // ER_LOCK_DEADLOCK
  2002, // CR_CONNECTION_ERROR
  2003, // CR_CONN_HOST_ERROR
  2006, // CR_SERVER_GONE_ERROR
  2013, // CR_SERVER_LOST
]);
const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'PROTOCOL_CONNECTION_LOST',
  'ER_GET_CONNECTION_TIMEOUT',
  'ER_CONNECTION_TIMEOUT',
  'ER_SOCKET_UNEXPECTED_CLOSE',
  'ER_CLOSING_POOL',
]);

/** Classifies a failed query or lost connection; null for anything else (a bug: 500). */
export function databaseFailure(error: unknown): DatabaseFailure | null {
  // A failed query, or the MariaDB driver's own connection error (it marks those `fatal`); other libraries'
  // network errors (mail, storage) are not the database's.
  const isDriverError = (e: unknown): boolean =>
    e !== null && typeof e === 'object' && 'fatal' in e && ('errno' in e || 'code' in e);
  if (!(error instanceof QueryFailedError) && !isDriverError(error)) return null;
  const driver = (error instanceof QueryFailedError ? error.driverError : error) as
    { errno?: number; code?: string } | null | undefined;
  if (!driver || typeof driver !== 'object') return null;
  const errno = driver.errno;
  if (errno === 1062)
    return {
      kind: 'conflict',
      message: 'Something with the same code or name was saved at the same moment; reload and try again.',
    };
  if (errno !== undefined && BAD_VALUE.has(errno))
    return {
      kind: 'bad-value',
      message: 'A value is outside what Roundbook can store (too large, too long or not a real date).',
    };
  if (
    (errno !== undefined && UNAVAILABLE.has(errno)) ||
    (driver.code !== undefined && UNAVAILABLE_CODES.has(driver.code))
  )
    return {
      kind: 'unavailable',
      message: 'The database is not reachable just now. Nothing was saved; try again in a few seconds.',
    };
  return null;
}
