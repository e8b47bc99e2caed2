/** The fields that differ between two snapshots, as `{ before, after }` for the audit trail. */
export function auditDiff<T extends object>(
  before: T,
  after: T,
  fields: ReadonlyArray<keyof T>,
): { before: Record<string, unknown>; after: Record<string, unknown> } | null {
  const b: Record<string, unknown> = {};
  const a: Record<string, unknown> = {};
  for (const f of fields) {
    if (JSON.stringify(before[f]) !== JSON.stringify(after[f])) {
      b[String(f)] = before[f] ?? null;
      a[String(f)] = after[f] ?? null;
    }
  }
  return Object.keys(a).length ? { before: b, after: a } : null;
}

/** A plain snapshot of the listed fields, for 'create' and 'delete' events. */
export function auditSnapshot<T extends object>(
  entity: T,
  fields: ReadonlyArray<keyof T>,
): Record<string, unknown> {
  return Object.fromEntries(fields.map((f) => [String(f), entity[f] ?? null]));
}
