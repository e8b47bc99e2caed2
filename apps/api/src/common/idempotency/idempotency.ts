import type { EntityManager } from 'typeorm';
import { DomainException, ErrorCode } from '../errors/domain.exception.js';
import { IdempotencyKey } from './idempotency-key.entity.js';

/** The header a client sends with a creating request that it may retry. */
export const IDEMPOTENCY_HEADER = 'idempotency-key';

/** Reads and checks the header: 1–100 visible ASCII characters, or absent. */
export function readIdempotencyKey(value: string | string[] | undefined): string | null {
  if (value === undefined) return null;
  const key = Array.isArray(value) ? value[0] : value;
  if (!/^[\x21-\x7e]{1,100}$/.test(key)) {
    throw new DomainException(
      ErrorCode.ValidationFailed,
      'The Idempotency-Key header must be 1–100 visible characters (a UUID is best).',
      { 'Idempotency-Key': 'Send 1–100 visible characters, e.g. a UUID.' },
    );
  }
  return key;
}

/** What an earlier request with the same key created, if any (locks the key row in the transaction). */
export async function priorResult(
  manager: EntityManager,
  userId: string,
  key: string,
  scope: string,
): Promise<string | null> {
  const found = await manager.findOne(IdempotencyKey, {
    where: { userId, key },
    lock: { mode: 'pessimistic_write' },
  });
  if (!found) return null;
  if (found.scope !== scope)
    throw new DomainException(
      ErrorCode.Conflict,
      'This Idempotency-Key was already used for a different request; send a new key.',
    );
  return found.resourceId;
}

export async function rememberResult(
  manager: EntityManager,
  userId: string,
  key: string,
  scope: string,
  resourceId: string,
): Promise<void> {
  await manager.insert(IdempotencyKey, { userId, key, scope, resourceId });
}
