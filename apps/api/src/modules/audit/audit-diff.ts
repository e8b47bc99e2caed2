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

/** The keys of two plain objects whose values differ, as `{ before, after }` (null for a missing key). */
export function objectDiff(
  before: Record<string, unknown>,
  after: Record<string, unknown>,
): { before: Record<string, unknown>; after: Record<string, unknown> } {
  const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])];
  return auditDiff(before, after, keys as ReadonlyArray<string>) ?? { before: {}, after: {} };
}

const isPlainObject = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * Two successive changes as one: what was there before the first, what is there after the second. Keys listed
 * in `nested` hold objects of their own (ground fields, joints by id) that merge one level down. A key that
 * ends where it started drops out.
 */
export function coalesceChanges(
  first: { before: Record<string, unknown>; after: Record<string, unknown> },
  second: { before: Record<string, unknown>; after: Record<string, unknown> },
  nested: ReadonlyArray<string> = [],
): { before: Record<string, unknown>; after: Record<string, unknown> } {
  const before: Record<string, unknown> = { ...second.before };
  const after: Record<string, unknown> = { ...first.after };
  for (const [k, v] of Object.entries(first.before)) {
    before[k] =
      nested.includes(k) && isPlainObject(v) && isPlainObject(second.before[k])
        ? { ...second.before[k], ...v }
        : v;
  }
  for (const [k, v] of Object.entries(second.after)) {
    after[k] =
      nested.includes(k) && isPlainObject(v) && isPlainObject(first.after[k])
        ? { ...first.after[k], ...v }
        : v;
  }
  for (const k of Object.keys(after)) {
    if (nested.includes(k) && isPlainObject(before[k]) && isPlainObject(after[k])) {
      const b = before[k];
      const a = after[k];
      for (const inner of Object.keys(a))
        if (JSON.stringify(b[inner] ?? null) === JSON.stringify(a[inner] ?? null)) {
          delete b[inner];
          delete a[inner];
        }
      if (Object.keys(a).length === 0 && Object.keys(b).length === 0) {
        delete before[k];
        delete after[k];
      }
    } else if (JSON.stringify(before[k] ?? null) === JSON.stringify(after[k] ?? null)) {
      delete before[k];
      delete after[k];
    }
  }
  return { before, after };
}
