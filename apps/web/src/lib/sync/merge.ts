/**
 * Three-way merge of two versions of one document against the version both started from (plain
 * TypeScript; common practice of text and record merging, applied field by field). A field only one
 * side changed takes that side's value; a field both changed to different values is a conflict the
 * person settles, and until they do the merge keeps their own value (never their notes thrown away).
 * Lists of rows with a stable `key` (joints, rock units) merge row by row, then field by field.
 */

export type Side = 'mine' | 'theirs';

export interface FieldConflict {
  /** Where, e.g. `distantParts`, `q.jr`, `joints[<key>].notes`, or `joints[<key>]` for a whole row. */
  path: string;
  base: unknown;
  mine: unknown;
  theirs: unknown;
}

export interface MergeResult<D> {
  /** The merge with every conflict settled as 'mine'. */
  merged: D;
  /** Fields taken from their version (only they changed them). */
  fromTheirs: string[];
  /** Fields kept from this device (only the person here changed them). */
  fromMine: string[];
  conflicts: FieldConflict[];
}

export interface MergeOptions {
  /** Top-level fields merged as one value (e.g. a drawing whose parts belong together). */
  atomic?: readonly string[];
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

const isPlain = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v);

const isKeyedRows = (v: unknown): v is { key: string }[] =>
  Array.isArray(v) && v.every((r) => isPlain(r) && typeof r.key === 'string');

interface Acc {
  fromTheirs: string[];
  fromMine: string[];
  conflicts: FieldConflict[];
}

function mergeValue(
  path: string,
  base: unknown,
  mine: unknown,
  theirs: unknown,
  acc: Acc,
  atomic: boolean,
): unknown {
  if (same(mine, theirs)) return mine;
  if (same(base, mine)) {
    acc.fromTheirs.push(path);
    return theirs;
  }
  if (same(base, theirs)) {
    acc.fromMine.push(path);
    return mine;
  }
  if (!atomic && isPlain(base) && isPlain(mine) && isPlain(theirs))
    return mergeObject(path, base, mine, theirs, acc);
  if (!atomic && isKeyedRows(mine) && isKeyedRows(theirs) && (base === undefined || isKeyedRows(base)))
    return mergeRows(path, base ?? [], mine, theirs, acc);
  acc.conflicts.push({ path, base, mine, theirs });
  return mine;
}

function mergeObject(
  prefix: string,
  base: Record<string, unknown>,
  mine: Record<string, unknown>,
  theirs: Record<string, unknown>,
  acc: Acc,
  atomicKeys: readonly string[] = [],
): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const keys = new Set([...Object.keys(mine), ...Object.keys(theirs)]);
  for (const k of keys) {
    const path = prefix === '' ? k : `${prefix}.${k}`;
    const value = mergeValue(path, base[k], mine[k], theirs[k], acc, atomicKeys.includes(k));
    if (value !== undefined) out[k] = value;
  }
  return out;
}

function mergeRows(
  prefix: string,
  base: { key: string }[],
  mine: { key: string }[],
  theirs: { key: string }[],
  acc: Acc,
): { key: string }[] {
  const byKey = (rows: { key: string }[]) => new Map(rows.map((r) => [r.key, r]));
  const b = byKey(base);
  const m = byKey(mine);
  const t = byKey(theirs);
  const out: { key: string }[] = [];
  const seen = new Set<string>();
  // Mine's order first (the rows as the person here sees them), then rows only they added.
  const order = [...mine.map((r) => r.key), ...theirs.map((r) => r.key).filter((k) => !m.has(k))];
  for (const key of order) {
    if (seen.has(key)) continue;
    seen.add(key);
    const path = `${prefix}[${key}]`;
    const rb = b.get(key);
    const rm = m.get(key);
    const rt = t.get(key);
    if (rm !== undefined && rt !== undefined) {
      out.push(
        (rb === undefined
          ? mergeValue(path, undefined, rm, rt, acc, true)
          : mergeObject(path, rb, rm, rt, acc)) as {
          key: string;
        },
      );
    } else if (rm !== undefined) {
      // Only here: added here, or removed by them.
      if (rb === undefined) acc.fromMine.push(path);
      else if (same(rb, rm)) {
        acc.fromTheirs.push(path);
        continue;
      } else {
        acc.conflicts.push({ path, base: rb, mine: rm, theirs: undefined });
      }
      out.push(rm);
    } else if (rt !== undefined) {
      // Only there: added by them, or removed here.
      if (rb === undefined) {
        acc.fromTheirs.push(path);
        out.push(rt);
      } else if (same(rb, rt)) {
        acc.fromMine.push(path);
      } else {
        acc.conflicts.push({ path, base: rb, mine: undefined, theirs: rt });
      }
    }
  }
  return out;
}

/** Merges `mine` and `theirs`, both made from `base` (null: not known, so every difference is a conflict). */
export function threeWayMerge<D extends object>(
  base: D | null,
  mine: D,
  theirs: D,
  options: MergeOptions = {},
): MergeResult<D> {
  const acc: Acc = { fromTheirs: [], fromMine: [], conflicts: [] };
  const b = (base ?? {}) as Record<string, unknown>;
  const m = mine as Record<string, unknown>;
  const t = theirs as Record<string, unknown>;
  const merged =
    base === null ? mergeUnknownBase(m, t, acc) : mergeObject('', b, m, t, acc, options.atomic ?? []);
  return { merged: merged as D, ...acc };
}

function mergeUnknownBase(mine: Record<string, unknown>, theirs: Record<string, unknown>, acc: Acc) {
  const out: Record<string, unknown> = { ...theirs, ...mine };
  for (const k of new Set([...Object.keys(mine), ...Object.keys(theirs)])) {
    if (!same(mine[k], theirs[k]))
      acc.conflicts.push({ path: k, base: undefined, mine: mine[k], theirs: theirs[k] });
  }
  return out;
}

const PATH = /([^.[\]]+)|\[([^\]]+)\]/g;

/** Sets one conflict's chosen side into a merged document (rows by key; a removed row is taken out). */
function setAt(doc: Record<string, unknown>, path: string, value: unknown): void {
  const parts = [...path.matchAll(PATH)].map((p) => ({ name: p[1] ?? p[2], row: p[2] !== undefined }));
  let node: unknown = doc;
  for (let i = 0; i < parts.length; i++) {
    const part = parts[i];
    const last = i === parts.length - 1;
    if (part.row) {
      const rows = node as { key: string }[];
      const at = rows.findIndex((r) => r.key === part.name);
      if (last) {
        if (value === undefined) {
          if (at >= 0) rows.splice(at, 1);
        } else if (at >= 0) rows[at] = value as { key: string };
        else rows.push(value as { key: string });
        return;
      }
      node = rows[at];
    } else {
      const obj = node as Record<string, unknown>;
      if (last) {
        obj[part.name] = value;
        return;
      }
      node = obj[part.name];
    }
    if (node === undefined || node === null) return;
  }
}

/** The merge with the person's choices: each conflict 'mine' (the default) or 'theirs'. */
export function applyChoices<D extends object>(result: MergeResult<D>, choices: Record<string, Side>): D {
  const doc = structuredCloneJson(result.merged) as Record<string, unknown>;
  for (const c of result.conflicts) {
    if ((choices[c.path] ?? 'mine') === 'theirs') setAt(doc, c.path, structuredCloneJson(c.theirs));
  }
  return doc as D;
}

function structuredCloneJson<T>(v: T): T {
  return v === undefined ? v : (JSON.parse(JSON.stringify(v)) as T);
}
