import { requireFinite, requireInRange, requirePositive } from './rating-bands.js';
import { RatingError } from './types.js';

/**
 * The Q-system: Q = (RQD/Jn)·(Jr/Ja)·(Jw/SRF) (Barton, Lien & Lunde 1974). The parameter tables follow the
 * NGI handbook "Using the Q-system" (2015), which follows Grimstad & Barton (1993). Descriptions are our own
 * short wording. Each row says whether its value was checked against a published reproduction ('seen') or
 * is recalled from the handbook ('from memory') — see methods.md §4.5.
 */
export const Q_EDITION = {
  id: 'ngi-2015',
  name: 'Q-system, NGI handbook "Using the Q-system" (2015), following Grimstad & Barton (1993)',
  sources: [
    'Barton, Lien & Lunde 1974, Engineering classification of rock masses for the design of tunnel support',
    'Grimstad & Barton 1993, Updating of the Q-system for NMT',
    'NGI 2015, Using the Q-system – Rock mass classification and support design',
  ],
} as const;

/** The table edition a round stamps with its Q (the UI shows Q_EDITION.name). */
export const Q_TABLE_EDITION: string = Q_EDITION.id;

export type QParameter = 'rqd' | 'jn' | 'jr' | 'ja' | 'jw' | 'srf';
export type TableCheck = 'seen' | 'from memory';

export interface QTableRow {
  /** Stable id for the UI. */
  readonly id: string;
  /** Group heading within the table (e.g. "walls in contact"), if the table has groups. */
  readonly group?: string;
  readonly description: string;
  /** The value to use; for a range row, its middle (the UI may let the user pick within `range`). */
  readonly value: number;
  readonly range?: readonly [number, number];
  /** Approximate residual friction angle φr (degrees) for Ja rows, or the water pressure (MPa) for Jw rows. */
  readonly extra?: string;
  /** How `extra` was checked when it differs from the row's own check (kept in code, not shown). */
  readonly extraCheck?: TableCheck;
  readonly check: TableCheck;
}

export interface QParameterTable {
  readonly parameter: QParameter;
  readonly symbol: string;
  readonly title: string;
  /** Values accepted by `qValue` (Peck 2000, Table 1; RQD as observed). */
  readonly accepted: readonly [number, number];
  readonly rows: readonly QTableRow[];
  readonly notes: readonly string[];
}

const WALLS_CONTACT = 'walls in contact, or in contact before about 10 cm of shear';
const NO_CONTACT = 'no wall contact when sheared';

export const Q_RQD_TABLE: QParameterTable = {
  parameter: 'rqd',
  symbol: 'RQD',
  title: 'Rock quality designation (%)',
  accepted: [0, 100],
  rows: [
    { id: 'rqd-very-poor', description: 'Very poor', value: 12.5, range: [0, 25], check: 'seen' },
    { id: 'rqd-poor', description: 'Poor', value: 37.5, range: [25, 50], check: 'seen' },
    { id: 'rqd-fair', description: 'Fair', value: 62.5, range: [50, 75], check: 'seen' },
    { id: 'rqd-good', description: 'Good', value: 82.5, range: [75, 90], check: 'seen' },
    { id: 'rqd-excellent', description: 'Excellent', value: 95, range: [90, 100], check: 'seen' },
  ],
  notes: [
    'Where RQD is 10 or less (including 0), Q is computed with 10.',
    'Steps of 5 are precise enough.',
    'The bands only describe the rock; Q uses the RQD number itself.',
  ],
};

export const Q_JN_TABLE: QParameterTable = {
  parameter: 'jn',
  symbol: 'Jn',
  title: 'Joint set number',
  accepted: [0.5, 20],
  rows: [
    {
      id: 'jn-massive',
      description: 'Massive: no joints or only a few',
      value: 0.75,
      range: [0.5, 1],
      check: 'seen',
    },
    { id: 'jn-one', description: 'One set', value: 2, check: 'seen' },
    { id: 'jn-one-random', description: 'One set and random joints', value: 3, check: 'seen' },
    { id: 'jn-two', description: 'Two sets', value: 4, check: 'seen' },
    { id: 'jn-two-random', description: 'Two sets and random joints', value: 6, check: 'seen' },
    { id: 'jn-three', description: 'Three sets', value: 9, check: 'seen' },
    { id: 'jn-three-random', description: 'Three sets and random joints', value: 12, check: 'seen' },
    {
      id: 'jn-four',
      description: 'Four or more sets, random, heavily jointed, small cubic blocks',
      value: 15,
      check: 'seen',
    },
    { id: 'jn-crushed', description: 'Crushed rock, like soil', value: 20, check: 'seen' },
  ],
  notes: ['At tunnel intersections use 3 × Jn.', 'At portals use 2 × Jn.'],
};

export const Q_JR_TABLE: QParameterTable = {
  parameter: 'jr',
  symbol: 'Jr',
  title: 'Joint roughness number',
  accepted: [0.5, 4],
  rows: [
    {
      id: 'jr-discontinuous',
      group: WALLS_CONTACT,
      description: 'Joints that stop short (discontinuous)',
      value: 4,
      check: 'seen',
    },
    {
      id: 'jr-rough-undulating',
      group: WALLS_CONTACT,
      description: 'Rough or irregular, undulating',
      value: 3,
      check: 'seen',
    },
    {
      id: 'jr-smooth-undulating',
      group: WALLS_CONTACT,
      description: 'Smooth, undulating',
      value: 2,
      check: 'seen',
    },
    {
      id: 'jr-slick-undulating',
      group: WALLS_CONTACT,
      description: 'Slickensided, undulating',
      value: 1.5,
      check: 'seen',
    },
    {
      id: 'jr-rough-planar',
      group: WALLS_CONTACT,
      description: 'Rough or irregular, planar',
      value: 1.5,
      check: 'seen',
    },
    { id: 'jr-smooth-planar', group: WALLS_CONTACT, description: 'Smooth, planar', value: 1, check: 'seen' },
    {
      id: 'jr-slick-planar',
      group: WALLS_CONTACT,
      description: 'Slickensided, planar',
      value: 0.5,
      check: 'seen',
    },
    {
      id: 'jr-clay-zone',
      group: NO_CONTACT,
      description: 'Clay-bearing zone thick enough to keep the walls apart',
      value: 1,
      check: 'seen',
    },
    {
      id: 'jr-crushed-zone',
      group: NO_CONTACT,
      description: 'Sandy, gravelly or crushed zone thick enough to keep the walls apart',
      value: 1,
      check: 'seen',
    },
  ],
  notes: [
    // Applied by qValue's jrSpacingOver3m option.
    'Add 1 when the mean spacing of the relevant set is more than 3 m.',
    '0.5 may be used for planar slickensided joints whose lineations point along the sliding direction.',
    'Read the small-scale feature first, then the intermediate scale.',
  ],
};

export const Q_JA_TABLE: QParameterTable = {
  parameter: 'ja',
  symbol: 'Ja',
  title: 'Joint alteration number',
  accepted: [0.75, 20],
  rows: [
    {
      id: 'ja-healed',
      group: 'walls in contact, coatings only',
      description: 'Tightly healed with a hard, non-softening, impermeable filling',
      value: 0.75,
      check: 'seen',
    },
    {
      id: 'ja-stained',
      group: 'walls in contact, coatings only',
      description: 'Fresh walls, only surface staining',
      value: 1,
      extra: 'φr 25–35°',
      extraCheck: 'from memory',
      check: 'seen',
    },
    {
      id: 'ja-slightly-altered',
      group: 'walls in contact, coatings only',
      description: 'Slightly altered walls, non-softening coatings, sandy or disintegrated clay-free rock',
      value: 2,
      extra: 'φr 25–30°',
      extraCheck: 'from memory',
      check: 'seen',
    },
    {
      id: 'ja-silty-clay-coating',
      group: 'walls in contact, coatings only',
      description: 'Silty or sandy clay coatings with a little non-softening clay',
      value: 3,
      extra: 'φr 20–25°',
      check: 'seen',
    },
    {
      id: 'ja-soft-coating',
      group: 'walls in contact, coatings only',
      description: 'Softening or low-friction clay-mineral coatings, a little swelling clay',
      value: 4,
      extra: 'φr 8–16°',
      check: 'seen',
    },
    {
      id: 'ja-thin-sandy',
      group: 'contact before about 10 cm of shear, thin fillings',
      description: 'Sandy particles or disintegrated clay-free rock',
      value: 4,
      extra: 'φr 25–30°',
      check: 'seen',
    },
    {
      id: 'ja-thin-hard-clay',
      group: 'contact before about 10 cm of shear, thin fillings',
      description: 'Strongly over-consolidated, non-softening clay, continuous and under 5 mm',
      value: 6,
      extra: 'φr 16–24°',
      check: 'seen',
    },
    {
      id: 'ja-thin-soft-clay',
      group: 'contact before about 10 cm of shear, thin fillings',
      description: 'Medium or low over-consolidated, softening clay, continuous and under 5 mm',
      value: 8,
      extra: 'φr 12–16°',
      check: 'seen',
    },
    {
      id: 'ja-thin-swelling',
      group: 'contact before about 10 cm of shear, thin fillings',
      description: 'Swelling clay; the value depends on how much swelling clay there is',
      value: 10,
      range: [8, 12],
      extra: 'φr 6–12°',
      check: 'seen',
    },
    {
      id: 'ja-zone-crushed-hard',
      group: 'no wall contact, thick fillings',
      description: 'Zone of crushed rock, strongly over-consolidated',
      value: 6,
      check: 'from memory',
    },
    {
      id: 'ja-zone-crushed-soft',
      group: 'no wall contact, thick fillings',
      description: 'Zone of clay, disintegrated or crushed rock, medium or low over-consolidation, softening',
      value: 8,
      check: 'from memory',
    },
    {
      id: 'ja-zone-crushed-swelling',
      group: 'no wall contact, thick fillings',
      description: 'As above with swelling clay',
      value: 10,
      range: [8, 12],
      check: 'from memory',
    },
    {
      id: 'ja-band-clay-hard',
      group: 'no wall contact, thick fillings',
      description: 'Thick continuous clay zone, strongly over-consolidated',
      value: 10,
      check: 'from memory',
    },
    {
      id: 'ja-band-clay-soft',
      group: 'no wall contact, thick fillings',
      description: 'Thick continuous clay zone, medium or low over-consolidation',
      value: 13,
      check: 'from memory',
    },
    {
      id: 'ja-band-clay-swelling',
      group: 'no wall contact, thick fillings',
      description: 'Thick continuous clay zone with swelling clay',
      value: 16.5,
      range: [13, 20],
      check: 'from memory',
    },
  ],
  notes: [
    'φr is the approximate residual friction angle of the joint surface.',
    // The thick-filling rows follow the 2013/2015 wording (from memory).
    'The thick-filling rows follow the 2015 handbook; the 1974 and 1993 tables group them slightly differently (with an extra 5 for silty or sandy clay zones).',
  ],
};

export const Q_JW_TABLE: QParameterTable = {
  parameter: 'jw',
  symbol: 'Jw',
  title: 'Joint water reduction factor',
  accepted: [0.05, 1],
  rows: [
    {
      id: 'jw-dry',
      description: 'Dry, or a few drips and damp patches',
      value: 1,
      extra: '< 0.1 MPa',
      check: 'seen',
    },
    {
      id: 'jw-medium',
      description: 'Medium inflow, fillings washed out now and then, many drips',
      value: 0.66,
      extra: '0.1–0.25 MPa',
      check: 'seen',
    },
    {
      id: 'jw-jet',
      description: 'Jets or high pressure in competent rock with open joints',
      value: 0.5,
      extra: '0.25–1.0 MPa',
      check: 'seen',
    },
    {
      id: 'jw-outwash',
      description: 'Large inflow or high pressure, fillings washed out considerably',
      value: 0.33,
      extra: '0.25–1.0 MPa',
      check: 'seen',
    },
    {
      id: 'jw-decaying',
      description: 'Exceptional inflow or pressure that falls off with time',
      value: 0.15,
      range: [0.1, 0.2],
      extra: '> 1 MPa',
      check: 'seen',
    },
    {
      id: 'jw-persistent',
      description: 'Exceptional inflow or pressure that keeps on without noticeable decay',
      value: 0.075,
      range: [0.05, 0.1],
      extra: '> 1 MPa',
      check: 'seen',
    },
  ],
  notes: [
    'The last four rows are rough estimates; raise Jw where drainage is installed.',
    'For rock away from the influence of the excavation the handbook suggests 1, 0.66, 0.5 and 0.33 for depths of 0–5, 5–25, 25–250 and over 250 m.',
  ],
};

const SRF_A = 'weakness zones crossing the excavation';
const SRF_B = 'competent, mainly massive rock with stress problems';

export const Q_SRF_TABLE: QParameterTable = {
  parameter: 'srf',
  symbol: 'SRF',
  title: 'Stress reduction factor',
  accepted: [0.5, 400],
  rows: [
    {
      id: 'srf-many-clay-zones',
      group: SRF_A,
      description:
        'Many zones with clay or chemically disintegrated rock, very loose surroundings (any depth)',
      value: 10,
      check: 'seen',
    },
    {
      id: 'srf-one-clay-zone-shallow',
      group: SRF_A,
      description: 'One such zone, depth 50 m or less',
      value: 5,
      check: 'seen',
    },
    {
      id: 'srf-one-clay-zone-deep',
      group: SRF_A,
      description: 'One such zone, depth over 50 m',
      value: 2.5,
      check: 'seen',
    },
    {
      id: 'srf-many-shear-zones',
      group: SRF_A,
      description: 'Many clay-free shear zones in competent rock, loose surroundings (any depth)',
      value: 7.5,
      check: 'seen',
    },
    {
      id: 'srf-one-shear-zone-shallow',
      group: SRF_A,
      description: 'One clay-free shear zone, depth 50 m or less',
      value: 5,
      check: 'seen',
    },
    {
      id: 'srf-one-shear-zone-deep',
      group: SRF_A,
      description: 'One clay-free shear zone, depth over 50 m',
      value: 2.5,
      check: 'seen',
    },
    {
      id: 'srf-loose-open-joints',
      group: SRF_A,
      description: 'Loose open joints, heavily jointed, small cubic blocks (any depth)',
      value: 5,
      check: 'seen',
    },
    {
      id: 'srf-low-stress',
      group: SRF_B,
      description: 'Low stress near the surface, open joints (σc/σ1 > 200, σθ/σc < 0.01)',
      value: 2.5,
      check: 'from memory',
    },
    {
      id: 'srf-medium-stress',
      group: SRF_B,
      description: 'Medium stress, favourable (σc/σ1 200–10, σθ/σc 0.01–0.3)',
      value: 1,
      check: 'from memory',
    },
    {
      id: 'srf-high-stress',
      group: SRF_B,
      description:
        'High stress, very tight; usually good for the roof, maybe not for the walls (σc/σ1 10–5, σθ/σc 0.3–0.4)',
      // The middle of the range, as for every range row of these tables (was 1 before issue 10).
      value: 1.25,
      range: [0.5, 2],
      check: 'from memory',
    },
    {
      id: 'srf-slabbing-slow',
      group: SRF_B,
      description: 'Moderate slabbing after more than an hour in massive rock (σc/σ1 5–3, σθ/σc 0.5–0.65)',
      value: 27.5,
      range: [5, 50],
      check: 'from memory',
    },
    {
      id: 'srf-slabbing-fast',
      group: SRF_B,
      description: 'Slabbing and rock burst within minutes in massive rock (σc/σ1 3–2, σθ/σc 0.65–1)',
      value: 125,
      range: [50, 200],
      check: 'from memory',
    },
    {
      id: 'srf-heavy-burst',
      group: SRF_B,
      description: 'Heavy rock burst and immediate dynamic deformation (σc/σ1 < 2, σθ/σc > 1)',
      value: 300,
      range: [200, 400],
      check: 'from memory',
    },
    {
      id: 'srf-squeezing-mild',
      group: 'squeezing rock',
      description: 'Mild squeezing (σθ/σc 1–5)',
      value: 7.5,
      range: [5, 10],
      check: 'from memory',
    },
    {
      id: 'srf-squeezing-heavy',
      group: 'squeezing rock',
      description: 'Heavy squeezing (σθ/σc > 5)',
      value: 15,
      range: [10, 20],
      check: 'from memory',
    },
    {
      id: 'srf-swelling-mild',
      group: 'swelling rock',
      description: 'Mild swelling',
      value: 7.5,
      range: [5, 10],
      check: 'from memory',
    },
    {
      id: 'srf-swelling-heavy',
      group: 'swelling rock',
      description: 'Heavy swelling',
      value: 12.5,
      range: [10, 15],
      check: 'from memory',
    },
  ],
  notes: [
    'Reduce SRF by 25–50 % where a weakness zone influences the opening but does not cross it.',
    'For strongly anisotropic virgin stress use 0.75σc when 5 ≤ σ1/σ3 ≤ 10 and 0.5σc when σ1/σ3 > 10.',
    'Where the depth of the crown is less than the span, SRF may be raised from 2.5 to 5.',
    'The 1974 competent-rock rows differ (low 2.5, medium 1.0, high 0.5–2, mild burst 5–10, heavy burst 10–20).',
  ],
};

/** All six Q parameter tables in formula order, for the UI's picklists. */
export const Q_TABLES: readonly QParameterTable[] = [
  Q_RQD_TABLE,
  Q_JN_TABLE,
  Q_JR_TABLE,
  Q_JA_TABLE,
  Q_JW_TABLE,
  Q_SRF_TABLE,
];

export type QClass =
  | 'exceptionally poor'
  | 'extremely poor'
  | 'very poor'
  | 'poor'
  | 'fair'
  | 'good'
  | 'very good'
  | 'extremely good'
  | 'exceptionally good';

/**
 * The nine rock-mass classes of Q (class limits from memory of the handbook). Each class includes its lower
 * limit: Q = 4 is 'fair', Q = 10 is 'good'. Below 0.001 is still 'exceptionally poor'; 1000 and above is
 * still 'exceptionally good'.
 */
export const Q_CLASSES: readonly {
  readonly rockClass: QClass;
  readonly min: number;
  readonly max: number;
}[] = [
  { rockClass: 'exceptionally poor', min: 0.001, max: 0.01 },
  { rockClass: 'extremely poor', min: 0.01, max: 0.1 },
  { rockClass: 'very poor', min: 0.1, max: 1 },
  { rockClass: 'poor', min: 1, max: 4 },
  { rockClass: 'fair', min: 4, max: 10 },
  { rockClass: 'good', min: 10, max: 40 },
  { rockClass: 'very good', min: 40, max: 100 },
  { rockClass: 'extremely good', min: 100, max: 400 },
  { rockClass: 'exceptionally good', min: 400, max: 1000 },
];

/** The rock-mass class of a Q value (> 0). Each class includes its lower limit. */
export function qClass(q: number): QClass {
  requirePositive('Q', q);
  let found: QClass = 'exceptionally poor';
  for (const row of Q_CLASSES) if (q >= row.min) found = row.rockClass;
  return found;
}

/** Where the tunnel is: at intersections Jn is tripled, at portals doubled (handbook notes). */
export type QLocation = 'tunnel' | 'intersection' | 'portal';

export interface QInput {
  /** RQD as observed, 0–100 %. Below 10 the formula uses 10. */
  rqd: number;
  /** Table value 0.5–20, before the intersection/portal factor. */
  jn: number;
  /** Table value 0.5–4, before the +1 for spacing over 3 m. */
  jr: number;
  ja: number;
  jw: number;
  srf: number;
  /** Default 'tunnel' (factor 1). */
  location?: QLocation;
  /**
   * True when the mean spacing of the relevant set is more than 3 m: Jr + 1, for the wall-contact groups
   * only (not for a zone that keeps the walls apart).
   */
  jrSpacingOver3m?: boolean;
  /**
   * The Jr row chosen (an id of Q_JR_TABLE), when known: it says whether the walls are in contact, which
   * Jr 1 alone does not (smooth planar, or a zone without wall contact).
   */
  jrRowId?: string;
}

export type QWarningCode =
  | 'not-in-table'
  | 'spacing-bonus-not-applied'
  | 'spacing-bonus-assumes-contact'
  | 'row-value-mismatch'
  | 'set-count-mismatch';

/** A warning about a Q input that is accepted but deserves a second look. */
export interface QWarning {
  parameter: QParameter;
  code: QWarningCode;
  message: string;
  /** For 'not-in-table': the nearest rows below and above the value. */
  nearest?: readonly QTableRow[];
}

export interface QResult {
  q: number;
  rqdUsed: number;
  /** Jn after the intersection (×3) or portal (×2) factor. */
  jnUsed: number;
  /** Jr after the +1 for spacing over 3 m. */
  jrUsed: number;
  rockClass: QClass;
  /** True when the +1 for spacing over 3 m was added to Jr. */
  jrSpacingApplied: boolean;
  /** Inputs accepted but worth a second look (values between table rows, the spacing note). */
  warnings: QWarning[];
  /** Q_TABLE_EDITION: the table edition used. */
  edition: string;
}

const LOCATION_FACTOR: Record<QLocation, number> = { tunnel: 1, intersection: 3, portal: 2 };

/** RatingError unless `value` lies in the accepted range of `table`. */
function checkQParameter(table: QParameterTable, value: number): void {
  requireInRange(
    table.symbol,
    value,
    table.accepted[0],
    table.accepted[1],
    `${table.title}, ${Q_EDITION.id}`,
  );
}

/**
 * Q = (RQD/Jn)·(Jr/Ja)·(Jw/SRF). Every parameter is checked against its table's range (RatingError
 * otherwise); RQD below 10 is taken as 10. A value between table rows (Jn 7) is accepted with a warning
 * naming the nearest rows. The +1 to Jr for spacing over 3 m is added only for the wall-contact groups:
 * not when `jrRowId` names a zone without wall contact; Jr 1 without a row is taken as walls in contact,
 * with a warning.
 */
export function qValue(input: QInput): QResult {
  for (const table of Q_TABLES) checkQParameter(table, input[table.parameter]);
  const location = input.location ?? 'tunnel';
  const factor = LOCATION_FACTOR[location] as number | undefined;
  if (factor === undefined) {
    throw new RatingError(
      `location "${String(location)}" is not known: expected tunnel, intersection or portal`,
    );
  }
  const warnings: QWarning[] = [];
  for (const table of Q_TABLES) {
    if (table.parameter === 'rqd') continue;
    const w = notInTableWarning(table, input[table.parameter]);
    if (w) warnings.push(w);
  }
  const spacing = jrSpacingBonus(input, warnings);
  const rqdUsed = Math.max(10, input.rqd);
  const jnUsed = input.jn * factor;
  const jrUsed = input.jr + (spacing ? 1 : 0);
  const q = (rqdUsed / jnUsed) * (jrUsed / input.ja) * (input.jw / input.srf);
  requireFinite('Q', q);
  return {
    q,
    rqdUsed,
    jnUsed,
    jrUsed,
    rockClass: qClass(q),
    jrSpacingApplied: spacing,
    warnings,
    edition: Q_TABLE_EDITION,
  };
}

const ROW_TOLERANCE = 1e-9;

/** Distance from a value to a row: 0 inside its range (ends included) or at its value. */
function rowDistance(row: QTableRow, value: number): number {
  if (row.range) {
    if (value >= row.range[0] - ROW_TOLERANCE && value <= row.range[1] + ROW_TOLERANCE) return 0;
    return Math.min(Math.abs(value - row.range[0]), Math.abs(value - row.range[1]));
  }
  const d = Math.abs(value - row.value);
  return d <= ROW_TOLERANCE ? 0 : d;
}

const rowText = (row: QTableRow): string =>
  `${row.range ? `${row.range[0]}–${row.range[1]}` : String(row.value)} (${row.description})`;

/**
 * The rows of a Q table nearest to a value that no row holds: the nearest row(s) below and above it.
 * Empty when a row holds the value (at its value or within its range).
 */
export function nearestQRows(parameter: QParameter, value: number): QTableRow[] {
  const table = Q_TABLES.find((t) => t.parameter === parameter);
  if (table === undefined) throw new RatingError(`Q parameter "${String(parameter)}" is not known`);
  if (table.rows.some((r) => rowDistance(r, value) === 0)) return [];
  const below = table.rows.filter((r) => (r.range ? r.range[1] : r.value) < value);
  const above = table.rows.filter((r) => (r.range ? r.range[0] : r.value) > value);
  const nearestOf = (rows: readonly QTableRow[]): QTableRow[] => {
    if (rows.length === 0) return [];
    const best = Math.min(...rows.map((r) => rowDistance(r, value)));
    return rows.filter((r) => rowDistance(r, value) - best <= ROW_TOLERANCE);
  };
  return [...nearestOf(below), ...nearestOf(above)];
}

function notInTableWarning(table: QParameterTable, value: number): QWarning | undefined {
  const nearest = nearestQRows(table.parameter, value);
  if (nearest.length === 0) return undefined;
  return {
    parameter: table.parameter,
    code: 'not-in-table',
    message: `${table.symbol} ${value} is not a value of the ${table.title.toLowerCase()} table (${Q_EDITION.id}): the nearest rows are ${nearest
      .map(rowText)
      .join(', ')
      .replace(/, ([^,]*)$/, ' and $1')}.`,
    nearest,
  };
}

/** Whether the +1 for spacing over 3 m applies: only to the wall-contact groups of Jr. */
function jrSpacingBonus(input: QInput, warnings: QWarning[]): boolean {
  let row: QTableRow | undefined;
  if (input.jrRowId !== undefined) {
    row = Q_JR_TABLE.rows.find((r) => r.id === input.jrRowId);
    if (row === undefined) {
      throw new RatingError(
        `Jr row "${String(input.jrRowId)}" is not in the table: expected one of ${Q_JR_TABLE.rows.map((r) => r.id).join(', ')}`,
      );
    }
    if (rowDistance(row, input.jr) !== 0) {
      warnings.push({
        parameter: 'jr',
        code: 'row-value-mismatch',
        message: `Jr ${input.jr} is not the value of the row chosen, “${row.description}” (${row.value}).`,
      });
    }
  }
  if (input.jrSpacingOver3m !== true) return false;
  if (row?.group === NO_CONTACT) {
    warnings.push({
      parameter: 'jr',
      code: 'spacing-bonus-not-applied',
      message: `The +1 for spacing over 3 m is for walls in contact; it is not added to Jr ${input.jr} of “${row.description}” (no wall contact).`,
    });
    return false;
  }
  const contactRows = Q_JR_TABLE.rows.filter((r) => r.group !== NO_CONTACT);
  const contactPossible = contactRows.some((r) => rowDistance(r, input.jr) === 0);
  const noContactPossible = Q_JR_TABLE.rows.some(
    (r) => r.group === NO_CONTACT && rowDistance(r, input.jr) === 0,
  );
  if (row === undefined && noContactPossible && contactPossible) {
    warnings.push({
      parameter: 'jr',
      code: 'spacing-bonus-assumes-contact',
      message: `Jr ${input.jr} is both “smooth, planar” (walls in contact) and a zone that keeps the walls apart; the +1 for spacing over 3 m was added as for walls in contact. Name the Jr row to be sure.`,
    });
  }
  return true;
}

/**
 * The Jn row for a number of joint sets found and whether random joints are present (the Jn table: none or
 * few 0.5–1, one set 2, one set + random 3, two 4, two + random 6, three 9, three + random 12, four or more
 * 15). Crushed rock (20) is a description, not a count, and is never suggested.
 */
export function jnRowForSets(setCount: number, randomJoints: boolean): QTableRow {
  if (!Number.isInteger(setCount) || setCount < 0) {
    throw new RatingError(
      `the number of joint sets must be a whole number of 0 or more, not ${String(setCount)}`,
    );
  }
  const id =
    setCount >= 4
      ? 'jn-four'
      : setCount === 0
        ? randomJoints
          ? 'jn-one'
          : 'jn-massive'
        : (['jn-one', 'jn-two', 'jn-three'] as const)[setCount - 1] + (randomJoints ? '-random' : '');
  const row = Q_JN_TABLE.rows.find((r) => r.id === id);
  if (row === undefined) throw new RatingError(`no Jn row for ${setCount} sets`);
  return row;
}

/**
 * A warning (never a refusal) when Jn does not match the number of sets found plus the random-joints flag;
 * undefined when it does. Random joints alone (no set) are taken as "one set" (2) or fewer: Jn 0.5–2 fits.
 * Jn 15 fits four or more sets, and Jn 20 (crushed rock) fits any count.
 */
export function jnSetCountWarning(jn: number, setCount: number, randomJoints: boolean): QWarning | undefined {
  const row = jnRowForSets(setCount, randomJoints);
  const fits =
    rowDistance(row, jn) === 0 || jn === 20 || (setCount === 0 && randomJoints && jn >= 0.5 && jn <= 2);
  if (fits) return undefined;
  const found = `${setCount === 0 ? 'no' : setCount} set${setCount === 1 ? '' : 's'}${randomJoints ? ' and random joints' : ''}`;
  return {
    parameter: 'jn',
    code: 'set-count-mismatch',
    message: `Jn ${jn} does not match the ${found} found: the table gives ${rowText(row)}.`,
    nearest: [row],
  };
}
