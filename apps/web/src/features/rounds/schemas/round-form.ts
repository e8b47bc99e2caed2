import {
  DEFAULT_SET_PARAMETERS,
  emptySketch,
  restoreSketch,
  type SetParameters,
  type SketchDocument,
} from '@roundbook/domain';
import { formatChainage, parseChainage } from '@roundbook/geomath';
import type { ChainageStyle } from '@roundbook/geomath';
import type {
  QLocation,
  Rmr89Roughness,
  Rmr89SimpleCondition,
  Rmr89WaterCondition,
  Rmr89Weathering,
  RmrOrientationAssessment,
} from '@roundbook/geomath';
import { object, string } from 'yup';
import type {
  JointInput,
  JointKind,
  JointWater,
  JrcMethod,
  PlaneNotation,
  Round,
  SaveRoundRequest,
  Shift,
} from '@/features/rounds/api/types';

/**
 * The Round editor's form. Numbers are kept as the text typed (so "2," or "1." survive while typing)
 * and turned into numbers only when the record is sent; every field maps onto SaveRoundDto.
 */

export interface JointRow {
  /** The joint's stable id: a UUID made in the browser for a new row, kept by the server across saves. */
  key: string;
  kind: JointKind;
  orientationText: string;
  notation: PlaneNotation;
  setLabel: string;
  setOverride: boolean;
  spacingM: string;
  persistenceM: string;
  apertureMm: string;
  jr: string;
  jrc: string;
  jrcMethod: JrcMethod | '';
  infill: string;
  ja: string;
  water: JointWater | '';
  thicknessM: string;
  notes: string;
  /** "Same feature as": the first observation of this feature on an earlier round ('' = not linked). */
  sameAsJointId: string;
  /** Why an imported row needs a look (kept on screen until the person clears it). */
  importNote: string;
}

export interface UnitRow {
  key: string;
  name: string;
  sharePercent: string;
  weatheringGrade: string;
  strengthGrade: string;
}

export type QParameterKey = 'rqd' | 'jn' | 'jr' | 'ja' | 'jw' | 'srf';

export interface QForm {
  rqd: string;
  jn: string;
  jr: string;
  ja: string;
  jw: string;
  srf: string;
  /** The table row chosen for each parameter (several rows can share a value). */
  rows: Partial<Record<QParameterKey, string>>;
  location: QLocation;
  jrSpacingOver3m: boolean;
  /** True when the RQD came from Jv (a correlation) rather than a measurement. */
  rqdFromJv: boolean;
}

export interface RmrForm {
  strengthKind: 'point-load' | 'ucs';
  is50: string;
  ucs: string;
  rqd: string;
  spacingM: string;
  conditionKind: 'simple' | 'detailed';
  simple: Rmr89SimpleCondition | '';
  persistenceM: string;
  separationMm: string;
  roughness: Rmr89Roughness | '';
  infillKind: 'none' | 'hard' | 'soft';
  infillMm: string;
  weathering: Rmr89Weathering | '';
  waterKind: 'inflow' | 'condition' | 'pressure-ratio';
  inflowPer10m: string;
  waterCondition: Rmr89WaterCondition | '';
  pressureRatio: string;
  /** '' = not assessed. */
  orientation: RmrOrientationAssessment | '';
}

export interface RoundFormValues {
  faceChainage: string;
  previousChainage: string;
  roundLength: string;
  shiftDate: string;
  shift: Shift;
  distantParts: string;
  units: UnitRow[];
  pointLoadIs50: string;
  pointLoadFactor: string;
  inflowLpm: string;
  inflowLengthM: string;
  waterDescription: string;
  overbreakM3: string;
  groundNotes: string;
  joints: JointRow[];
  /** How the sets are found (window along the heading, number of sets): kept with the round. */
  setParameters: SetParameters;
  q: QForm;
  rmr: RmrForm;
  gsiObserved: string;
  recommendedClassId: string;
  nextRoundLength: string;
  recommendationReason: string;
  /** The face sketch (packages/domain document); an empty one is sent as null. */
  sketch: SketchDocument;
}

let keySeq = 0;
/** A key for a new row, unique in this browser tab. */
export function newKey(prefix: string): string {
  keySeq += 1;
  return `${prefix}-${Date.now().toString(36)}-${keySeq}`;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[1-8][0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/i;

/** A new joint's id: a random UUID (RFC 4122 version 4), so the joint keeps it from its first save on. */
export function newJointId(): string {
  const c = globalThis.crypto as Crypto | undefined;
  if (c && typeof c.randomUUID === 'function') return c.randomUUID();
  const bytes = new Uint8Array(16);
  if (c) c.getRandomValues(bytes);
  else for (let i = 0; i < 16; i++) bytes[i] = Math.floor(Math.random() * 256);
  bytes[6] = (bytes[6] & 0x0f) | 0x40;
  bytes[8] = (bytes[8] & 0x3f) | 0x80;
  const hex = Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}

const text = (value: number | null | undefined): string =>
  value === null || value === undefined ? '' : String(value);

/** Typed text as a number: '' → null, "2,5" → 2.5, anything unreadable → NaN. */
export function numberOf(value: string): number | null {
  const t = value.trim().replace(',', '.');
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

/** For the API: unreadable numbers are sent as empty (the field shows why). */
const num = (value: string): number | null => {
  const n = numberOf(value);
  return n === null || Number.isNaN(n) ? null : n;
};

/** A chainage typed as 1+250.0 or 1250.0, in metres; null when empty or unreadable. */
/** How a heading writes its chainages (its style and decimals). */
export interface ChainageInputStyle {
  style: ChainageStyle;
  decimals?: number;
}

/**
 * A stored chainage as the text of a chainage field, in the heading's style (1254 → "1+254.0"), with as many
 * decimals as the stored value has when it has more than the heading shows, so that opening a round and
 * saving it again never rounds the stored value (1254.25 → "1+254.25" on a one-decimal heading).
 */
export function chainageInputOf(metres: number | null | undefined, chainage?: ChainageInputStyle): string {
  if (metres === null || metres === undefined) return '';
  if (chainage === undefined || !Number.isFinite(metres)) return String(metres);
  const own = String(metres).split('.')[1]?.length ?? 0;
  return formatChainage(metres, {
    style: chainage.style,
    decimals: Math.min(Math.max(chainage.decimals ?? 1, own), 6),
  });
}

export function chainageOf(value: string): number | null {
  if (value.trim() === '') return null;
  try {
    return parseChainage(value);
  } catch {
    return null;
  }
}

export function emptyJoint(notation: PlaneNotation): JointRow {
  return {
    key: newJointId(),
    kind: 'joint',
    orientationText: '',
    notation,
    setLabel: '',
    setOverride: false,
    spacingM: '',
    persistenceM: '',
    apertureMm: '',
    jr: '',
    jrc: '',
    jrcMethod: '',
    infill: '',
    ja: '',
    water: '',
    thicknessM: '',
    notes: '',
    sameAsJointId: '',
    importNote: '',
  };
}

const emptyQ = (): QForm => ({
  rqd: '',
  jn: '',
  jr: '',
  ja: '',
  jw: '',
  srf: '',
  rows: {},
  location: 'tunnel',
  jrSpacingOver3m: false,
  rqdFromJv: false,
});

const emptyRmr = (): RmrForm => ({
  strengthKind: 'point-load',
  is50: '',
  ucs: '',
  rqd: '',
  spacingM: '',
  conditionKind: 'simple',
  simple: '',
  persistenceM: '',
  separationMm: '',
  roughness: '',
  infillKind: 'none',
  infillMm: '',
  weathering: '',
  waterKind: 'inflow',
  inflowPer10m: '',
  waterCondition: '',
  pressureRatio: '',
  orientation: '',
});

type Loose = Record<string, unknown>;
const isObj = (v: unknown): v is Loose => typeof v === 'object' && v !== null;
const str = (v: unknown): string => (typeof v === 'number' ? String(v) : typeof v === 'string' ? v : '');

function qFormOf(input: Loose | null): QForm {
  const q = emptyQ();
  if (input === null) return q;
  for (const key of ['rqd', 'jn', 'jr', 'ja', 'jw', 'srf'] as const) q[key] = str(input[key]);
  if (isObj(input.rows)) {
    for (const [k, v] of Object.entries(input.rows))
      if (typeof v === 'string') q.rows[k as QParameterKey] = v;
  }
  if (input.location === 'intersection' || input.location === 'portal') q.location = input.location;
  q.jrSpacingOver3m = input.jrSpacingOver3m === true;
  q.rqdFromJv = input.rqdFromJv === true;
  return q;
}

function rmrFormOf(input: Loose | null): RmrForm {
  const r = emptyRmr();
  if (input === null) return r;
  const strength = isObj(input.strength) ? input.strength : {};
  if (strength.kind === 'ucs') {
    r.strengthKind = 'ucs';
    r.ucs = str(strength.ucs);
  } else r.is50 = str(strength.is50);
  r.rqd = str(input.rqd);
  r.spacingM = str(input.spacingM);
  const c = isObj(input.condition) ? input.condition : {};
  if (c.kind === 'detailed') {
    r.conditionKind = 'detailed';
    r.persistenceM = str(c.persistenceM);
    r.separationMm = str(c.separationMm);
    r.roughness = (str(c.roughness) as Rmr89Roughness) || '';
    r.weathering = (str(c.weathering) as Rmr89Weathering) || '';
    const inf = isObj(c.infilling) ? c.infilling : {};
    if (inf.kind === 'hard' || inf.kind === 'soft') {
      r.infillKind = inf.kind;
      r.infillMm = str(inf.thicknessMm);
    }
  } else r.simple = (str(c.condition) as Rmr89SimpleCondition) || '';
  const w = isObj(input.groundwater) ? input.groundwater : {};
  if (w.kind === 'condition') {
    r.waterKind = 'condition';
    r.waterCondition = (str(w.condition) as Rmr89WaterCondition) || '';
  } else if (w.kind === 'pressure-ratio') {
    r.waterKind = 'pressure-ratio';
    r.pressureRatio = str(w.ratio);
  } else r.inflowPer10m = str(w.litresPerMinutePer10m);
  const o = isObj(input.orientation) ? input.orientation : {};
  if (o.kind === 'assessment') r.orientation = (str(o.assessment) as RmrOrientationAssessment) || '';
  return r;
}

/** The round's sketch as the domain reads it (an unreadable one opens empty rather than breaking the form). */
function sketchFormOf(sketch: Round['sketch']): SketchDocument {
  if (sketch === null || sketch === undefined) return emptySketch();
  try {
    return restoreSketch(sketch);
  } catch {
    return emptySketch();
  }
}

/** The form for a saved round (chainages in the heading's style when it is given). */
export function formValuesOf(round: Round, chainage?: ChainageInputStyle): RoundFormValues {
  return {
    sketch: sketchFormOf(round.sketch),
    faceChainage: chainageInputOf(round.faceChainage, chainage),
    previousChainage: chainageInputOf(round.previousChainage, chainage),
    roundLength: text(round.roundLength),
    shiftDate: round.shiftDate,
    shift: round.shift,
    distantParts: round.distantParts,
    units: round.ground.units.map((u) => ({
      key: newKey('unit'),
      name: u.name,
      sharePercent: text(u.sharePercent),
      weatheringGrade: u.weatheringGrade ?? '',
      strengthGrade: u.strengthGrade ?? '',
    })),
    pointLoadIs50: text(round.ground.pointLoadIs50),
    pointLoadFactor: text(round.ground.pointLoadFactor),
    inflowLpm: text(round.ground.inflowLpm),
    inflowLengthM: text(round.ground.inflowLengthM),
    waterDescription: round.ground.waterDescription,
    overbreakM3: text(round.ground.overbreakM3),
    groundNotes: round.ground.notes,
    joints: round.joints.map((j) => ({
      key: j.id,
      kind: j.kind,
      orientationText: j.orientationText,
      notation: j.notation,
      setLabel: j.setLabel ?? '',
      setOverride: j.setOverride ?? false,
      spacingM: text(j.spacingM),
      persistenceM: text(j.persistenceM),
      apertureMm: text(j.apertureMm),
      jr: text(j.jr),
      jrc: text(j.jrc),
      jrcMethod: j.jrcMethod ?? '',
      infill: j.infill,
      ja: text(j.ja),
      water: j.water ?? '',
      thicknessM: text(j.thicknessM),
      notes: j.notes,
      sameAsJointId: j.sameAsJointId ?? '',
      importNote: '',
    })),
    setParameters: { ...(round.setParameters ?? DEFAULT_SET_PARAMETERS) },
    q: qFormOf(round.qInput),
    rmr: rmrFormOf(round.rmrInput),
    gsiObserved: text(round.gsiObserved),
    recommendedClassId: round.recommendedClassId ?? '',
    nextRoundLength: text(round.nextRoundLength),
    recommendationReason: round.recommendationReason,
  };
}

/** The form's inputs as sent: empty choices go as null and the server says what is missing. */
const asSent = <T>(value: unknown): T => value as T;

const anyFilled = (values: string[]) => values.some((v) => v.trim() !== '');

/** Q inputs as stored: the six numbers (empty ones as null, so the server says what is missing) and the choices. */
export function qInputOf(q: QForm): SaveRoundRequest['qInput'] {
  if (!anyFilled([q.rqd, q.jn, q.jr, q.ja, q.jw, q.srf])) return null;
  return asSent<SaveRoundRequest['qInput']>({
    rqd: num(q.rqd),
    jn: num(q.jn),
    jr: num(q.jr),
    ja: num(q.ja),
    jw: num(q.jw),
    srf: num(q.srf),
    location: q.location,
    jrSpacingOver3m: q.jrSpacingOver3m,
    rows: q.rows,
    rqdFromJv: q.rqdFromJv,
  });
}

/** RMR89 inputs in geomath's Rmr89Input shape (orientation as an assessment or not assessed). */
export function rmrInputOf(r: RmrForm): SaveRoundRequest['rmrInput'] {
  const filled = anyFilled([
    r.is50,
    r.ucs,
    r.rqd,
    r.spacingM,
    r.simple,
    r.persistenceM,
    r.separationMm,
    r.roughness,
    r.weathering,
    r.inflowPer10m,
    r.waterCondition,
    r.pressureRatio,
  ]);
  if (!filled) return null;
  return asSent<SaveRoundRequest['rmrInput']>({
    strength:
      r.strengthKind === 'ucs' ? { kind: 'ucs', ucs: num(r.ucs) } : { kind: 'point-load', is50: num(r.is50) },
    rqd: num(r.rqd),
    spacingM: num(r.spacingM),
    condition:
      r.conditionKind === 'simple'
        ? { kind: 'simple', condition: r.simple || null }
        : {
            kind: 'detailed',
            persistenceM: num(r.persistenceM),
            separationMm: num(r.separationMm),
            roughness: r.roughness || null,
            infilling:
              r.infillKind === 'none'
                ? { kind: 'none' }
                : { kind: r.infillKind, thicknessMm: num(r.infillMm) },
            weathering: r.weathering || null,
          },
    groundwater:
      r.waterKind === 'inflow'
        ? { kind: 'inflow', litresPerMinutePer10m: num(r.inflowPer10m) }
        : r.waterKind === 'pressure-ratio'
          ? { kind: 'pressure-ratio', ratio: num(r.pressureRatio) }
          : { kind: 'condition', condition: r.waterCondition || null },
    orientation:
      r.orientation === '' ? { kind: 'not assessed' } : { kind: 'assessment', assessment: r.orientation },
  });
}

export function jointInputOf(j: JointRow): JointInput {
  return {
    ...(UUID.test(j.key) ? { id: j.key } : {}),
    kind: j.kind,
    notation: j.notation,
    orientationText: j.orientationText,
    setLabel: j.setLabel.trim() === '' ? null : j.setLabel.trim(),
    setOverride: j.setOverride,
    spacingM: num(j.spacingM),
    persistenceM: num(j.persistenceM),
    apertureMm: num(j.apertureMm),
    jr: num(j.jr),
    jrc: num(j.jrc),
    jrcMethod: j.jrcMethod === '' ? null : j.jrcMethod,
    infill: j.infill,
    ja: num(j.ja),
    water: j.water === '' ? null : j.water,
    thicknessM: j.kind === 'fault' || j.kind === 'shear-zone' ? num(j.thicknessM) : null,
    notes: j.notes,
    sameAsJointId: j.sameAsJointId === '' ? null : j.sameAsJointId,
  };
}

/** The whole record for PUT …/rounds/{roundId}. */
export function saveRequestOf(
  values: RoundFormValues,
  version: number,
  fallbackChainage: number,
): SaveRoundRequest {
  return {
    version,
    faceChainage: chainageOf(values.faceChainage) ?? fallbackChainage,
    previousChainage: chainageOf(values.previousChainage),
    roundLength: num(values.roundLength),
    shiftDate: values.shiftDate,
    shift: values.shift,
    distantParts: values.distantParts,
    ground: {
      units: values.units.map((u) => ({
        name: u.name,
        sharePercent: num(u.sharePercent) ?? 0,
        weatheringGrade: u.weatheringGrade === '' ? null : u.weatheringGrade,
        strengthGrade: u.strengthGrade === '' ? null : u.strengthGrade,
      })),
      pointLoadIs50: num(values.pointLoadIs50),
      pointLoadFactor: num(values.pointLoadFactor),
      inflowLpm: num(values.inflowLpm),
      inflowLengthM: num(values.inflowLengthM),
      waterDescription: values.waterDescription,
      overbreakM3: num(values.overbreakM3),
      notes: values.groundNotes,
    },
    joints: values.joints.map(jointInputOf),
    setParameters: values.setParameters as SaveRoundRequest['setParameters'],
    qInput: qInputOf(values.q),
    rmrInput: rmrInputOf(values.rmr),
    gsiObserved: num(values.gsiObserved),
    recommendedClassId: values.recommendedClassId === '' ? null : values.recommendedClassId,
    nextRoundLength: num(values.nextRoundLength),
    recommendationReason: values.recommendationReason,
    sketch:
      values.sketch.elements.length === 0
        ? null
        : (values.sketch as unknown as NonNullable<SaveRoundRequest['sketch']>),
  };
}

const numberText = (label: string) =>
  string().test('number', `${label} is a number.`, (v) => v === undefined || !Number.isNaN(numberOf(v) ?? 0));

/** Checks made while typing (the server checks the rest on save and on submit). */
export const roundFormSchema = object({
  faceChainage: string()
    .required('Give the face chainage.')
    .test('chainage', 'Write the chainage as 1+250.0 or 1250.0.', (v) => chainageOf(v) !== null),
  previousChainage: string().test(
    'chainage',
    'Write the chainage as 1+250.0 or 1250.0.',
    (v) => v === undefined || v.trim() === '' || chainageOf(v) !== null,
  ),
  roundLength: numberText('The round length'),
  pointLoadIs50: numberText('Is50'),
  pointLoadFactor: numberText('The factor'),
  inflowLpm: numberText('The inflow'),
  inflowLengthM: numberText('The length'),
  overbreakM3: numberText('Overbreak'),
  gsiObserved: numberText('GSI').test(
    'range',
    'GSI is 0–100.',
    (v) => v === undefined || ((num(v) ?? 0) >= 0 && (num(v) ?? 0) <= 100),
  ),
  nextRoundLength: numberText('The next round length'),
});

export const nextRoundLengthOf = (values: RoundFormValues): number | null => num(values.nextRoundLength);
export const valueOf = num;
