import type { TriggerAcceptanceInput } from '@roundbook/domain';
import { IsNull, type EntityManager } from 'typeorm';
import { TriggerAcceptance } from './round-review.entity.js';

/** The heading's acceptances that are not withdrawn, newest first, as the domain reads them. */
export async function activeAcceptances(
  manager: EntityManager,
  headingId: string,
): Promise<TriggerAcceptanceInput[]> {
  const rows = await manager.find(TriggerAcceptance, {
    where: { headingId, withdrawnAt: IsNull() },
    order: { acceptedAt: 'DESC' },
    take: 200,
  });
  return rows.map(toInput);
}

export function toInput(a: TriggerAcceptance): TriggerAcceptanceInput {
  return {
    id: a.id,
    ruleId: a.ruleId,
    fromChainage: a.fromChainage,
    toChainage: a.toChainage,
    until: a.until?.toISOString() ?? null,
    reason: a.reason,
    acceptedByName: a.acceptedName,
    acceptedAt: a.acceptedAt.toISOString(),
    snapshot: a.snapshot,
  };
}
