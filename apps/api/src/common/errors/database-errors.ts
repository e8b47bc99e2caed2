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
