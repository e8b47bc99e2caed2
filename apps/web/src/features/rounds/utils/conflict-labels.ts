import type { RoundFormValues } from '@/features/rounds/schemas/round-form';

/** The Round form's fields in words, for the conflict view (same words as the sections' labels). */
const FIELDS: Record<string, string> = {
  faceChainage: 'Face chainage',
  previousChainage: 'Previous chainage',
  roundLength: 'Round length',
  shiftDate: 'Shift date',
  shift: 'Shift',
  distantParts: 'Parts of the face seen only from a distance',
  units: 'Rock units',
  pointLoadIs50: 'Point-load index Is50',
  pointLoadFactor: 'Point-load factor',
  inflowLpm: 'Water inflow',
  inflowLengthM: 'Tunnel length the inflow comes from',
  waterDescription: 'Water at the face, in words',
  overbreakM3: 'Overbreak',
  groundNotes: 'Notes on the ground',
  joints: 'Joints',
  setParameters: 'How the sets are found',
  q: 'Q inputs',
  rmr: 'RMR89 inputs',
  gsiObserved: 'GSI read from the chart',
  recommendedClassId: 'Recommended class',
  nextRoundLength: 'Next round length',
  recommendationReason: 'Reason or remarks',
  sketch: 'Sketch',
};

const JOINT_FIELDS: Record<string, string> = {
  kind: 'kind',
  orientationText: 'orientation',
  notation: 'notation',
  setLabel: 'set',
  setOverride: 'set chosen by hand',
  spacingM: 'spacing',
  persistenceM: 'persistence',
  apertureMm: 'aperture',
  jr: 'Jr',
  jrc: 'JRC',
  jrcMethod: 'JRC by',
  infill: 'infill',
  ja: 'Ja',
  water: 'water',
  thicknessM: 'thickness',
  notes: 'notes',
  sameAsJointId: 'same feature as',
  importNote: 'import note',
};

const UNIT_FIELDS: Record<string, string> = {
  name: 'name',
  sharePercent: 'share of the face',
  weatheringGrade: 'weathering grade',
  strengthGrade: 'strength grade',
};

const ROW = /^(joints|units)\[([^\]]+)\](?:\.(.+))?$/;

/** `joints[<key>].notes` → "Joint 3, notes" (numbered as on this device, else as on theirs). */
export function conflictLabel(path: string, mine: RoundFormValues, theirs: RoundFormValues): string {
  const row = ROW.exec(path);
  if (row !== null) {
    const [, list, key, field] = row;
    const rows = list === 'joints' ? [mine.joints, theirs.joints] : [mine.units, theirs.units];
    const index = rows.map((r) => r.findIndex((x) => x.key === key)).find((i) => i >= 0) ?? -1;
    const noun = list === 'joints' ? 'Joint' : 'Rock unit';
    const name = index >= 0 ? `${noun} ${index + 1}` : noun;
    if (field === undefined) return name;
    return `${name}, ${(list === 'joints' ? JOINT_FIELDS : UNIT_FIELDS)[field] ?? field}`;
  }
  const [head, ...rest] = path.split('.');
  const base = FIELDS[head] ?? head;
  return rest.length === 0 ? base : `${base}: ${rest.join('.')}`;
}

/** A value in words for the two columns. */
export function conflictValue(value: unknown): string {
  if (value === undefined) return '(removed)';
  if (value === null || value === '') return '(empty)';
  if (typeof value === 'string' || typeof value === 'number') return String(value);
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (Array.isArray(value)) return value.length === 0 ? '(none)' : `${value.length} item(s)`;
  if (typeof value === 'object') {
    const o = value as Record<string, unknown>;
    if (Array.isArray(o.elements)) return `${o.elements.length} drawn element(s)`;
    const text = (v: unknown) => (typeof v === 'string' || typeof v === 'number' ? String(v) : '');
    if (typeof o.orientationText === 'string')
      return `${text(o.kind) || 'joint'} ${o.orientationText || '(no orientation)'}${text(o.notes) ? ` — ${text(o.notes)}` : ''}`;
    if (typeof o.name === 'string') return `${o.name} ${text(o.sharePercent)} %`.trim();
    return Object.entries(o)
      .filter(([, v]) => v !== '' && v !== null && v !== undefined && typeof v !== 'object')
      .map(([k, v]) => `${k} ${String(v)}`)
      .join(', ');
  }
  return JSON.stringify(value);
}

const API_FIELDS: Record<string, string> = {
  ground: 'Ground',
  qInput: 'Q inputs',
  rmrInput: 'RMR89 inputs',
  joints: 'Joints',
  status: 'Status',
};

/** A field of the round as the audit trail names it (the API's names), in words. */
export function auditFieldLabel(field: string): string {
  return API_FIELDS[field] ?? FIELDS[field] ?? field;
}
