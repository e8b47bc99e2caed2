/** A support class of the project's library, as the suggestion reads it. */
export interface SupportClassInput {
  id: string;
  code: string;
  qMin: number | null;
  qMax: number | null;
  rmrMin: number | null;
  rmrMax: number | null;
  maxRoundLength: number;
  retired: boolean;
  sortOrder: number;
}

/**
 * Support classes whose ranges fit the ratings: every range a class defines for which the round has a value
 * must contain it (Q [qMin, qMax), RMR89 [rmrMin, rmrMax]), and at least one range must be checked.
 * Retired classes are never suggested. Best ground first (library order).
 */
export function suggestClasses(classes: SupportClassInput[], q: number | null, rmr: number | null): string[] {
  return classes
    .filter((c) => !c.retired)
    .filter((c) => {
      const hasQ = c.qMin !== null || c.qMax !== null;
      const hasRmr = c.rmrMin !== null || c.rmrMax !== null;
      const checks: boolean[] = [];
      if (hasQ && q !== null) checks.push(q >= (c.qMin ?? 0) && q < (c.qMax ?? Infinity));
      if (hasRmr && rmr !== null) checks.push(rmr >= (c.rmrMin ?? 0) && rmr <= (c.rmrMax ?? 100));
      return checks.length > 0 && checks.every(Boolean);
    })
    .sort((a, b) => a.sortOrder - b.sortOrder)
    .map((c) => c.id);
}
