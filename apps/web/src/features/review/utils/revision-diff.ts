// The difference between two frozen revisions of a round, field by field (pure; unit-tested).

export interface FieldChange {
  /** Where the field sits in the record, in words: "ground › inflowLpm", "joints › 2 › orientationText". */
  field: string;
  before: string;
  after: string;
}

function shown(v: unknown): string {
  if (v === null || v === undefined || v === '') return '—';
  if (typeof v === 'string') return v;
  if (typeof v === 'number' || typeof v === 'boolean') return String(v);
  return JSON.stringify(v);
}

/** Every leaf of a JSON record by its path (arrays by 1-based position, as people count rows). */
export function flatten(value: unknown, path: string[] = [], out = new Map<string, unknown>()) {
  if (Array.isArray(value)) {
    if (value.length === 0) out.set(path.join(' › '), '');
    value.forEach((v, i) => flatten(v, [...path, String(i + 1)], out));
  } else if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) flatten(v, [...path, k], out);
  } else {
    out.set(path.join(' › '), value);
  }
  return out;
}

/** The fields that differ between two records, in the order of the later one (then those it dropped). */
export function revisionDiff(
  before: Record<string, unknown>,
  after: Record<string, unknown>,
  ignore: (field: string) => boolean = (f) => / › id$/.test(f),
): FieldChange[] {
  const a = flatten(before);
  const b = flatten(after);
  const fields = [...new Set([...b.keys(), ...a.keys()])];
  return fields
    .filter((f) => !ignore(f) && shown(a.get(f)) !== shown(b.get(f)))
    .map((f) => ({ field: f, before: shown(a.get(f)), after: shown(b.get(f)) }));
}
