import type { VersionDifference } from '@roundbook/ui';
import type { SaveRoundRequest } from '@/features/rounds/api/types';

/** Field-by-field comparison of two versions of a round, in words, for the "changed by someone else" view. */

type Comparable = Omit<SaveRoundRequest, 'version'>;

const shown = (value: unknown): string => {
  if (value === null || value === undefined || value === '') return '(empty)';
  if (typeof value === 'number' || typeof value === 'string') return String(value);
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (Array.isArray(value)) return value.length === 0 ? '(none)' : value.map(shown).join('; ');
  if (typeof value === 'object') {
    return Object.entries(value as Record<string, unknown>)
      .filter(
        ([, v]) =>
          v !== null &&
          v !== '' &&
          v !== undefined &&
          !(typeof v === 'object' && Object.keys(v).length === 0),
      )
      .map(([k, v]) => `${k} ${shown(v)}`)
      .join(', ');
  }
  return JSON.stringify(value);
};

const LABELS: [string, (r: Comparable) => unknown][] = [
  ['Face chainage', (r) => r.faceChainage],
  ['Previous chainage', (r) => r.previousChainage],
  ['Round length', (r) => r.roundLength],
  ['Shift date', (r) => r.shiftDate],
  ['Shift', (r) => r.shift],
  ['Parts seen only from a distance', (r) => r.distantParts],
  ['Rock units', (r) => r.ground.units.map((u) => `${u.name} ${u.sharePercent} %`)],
  ['Point-load Is50', (r) => r.ground.pointLoadIs50],
  ['Point-load factor', (r) => r.ground.pointLoadFactor],
  ['Water inflow', (r) => r.ground.inflowLpm],
  ['Inflow comes from (m)', (r) => r.ground.inflowLengthM],
  ['Water description', (r) => r.ground.waterDescription],
  ['Overbreak', (r) => r.ground.overbreakM3],
  ['Ground notes', (r) => r.ground.notes],
  [
    'Joints',
    (r) =>
      r.joints.map(
        (j, i) =>
          `${i + 1}: ${j.kind} ${j.orientationText || '(no orientation)'}${j.setLabel ? ` [${j.setLabel}]` : ''}`,
      ),
  ],
  ['Joint details', (r) => r.joints.map((j) => shown({ ...j, kind: undefined, orientationText: undefined }))],
  ['Q inputs', (r) => (r.qInput === null ? null : { ...r.qInput, rows: undefined })],
  ['RMR89 inputs', (r) => r.rmrInput],
  ['GSI read from the chart', (r) => r.gsiObserved],
  ['Recommended class', (r) => r.recommendedClassId],
  ['Next round length', (r) => r.nextRoundLength],
  ['Reason for the class', (r) => r.recommendationReason],
  [
    'Sketch',
    (r) => {
      const elements = (r.sketch as { elements?: unknown[] } | null | undefined)?.elements;
      return elements ? `${elements.length} drawn element(s)` : null;
    },
  ],
];

export function roundDifferences(
  yours: Comparable,
  theirs: Comparable,
  classCode: (id: string) => string = (id) => id,
): VersionDifference[] {
  const out: VersionDifference[] = [];
  for (const [label, get] of LABELS) {
    let a = get(yours);
    let b = get(theirs);
    if (label === 'Recommended class') {
      a = typeof a === 'string' ? classCode(a) : a;
      b = typeof b === 'string' ? classCode(b) : b;
    }
    const sa = shown(a);
    const sb = shown(b);
    if (sa !== sb) out.push({ label, yours: sa, theirs: sb });
  }
  return out;
}
