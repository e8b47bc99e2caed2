import type { RatingBand } from './rating-bands.js';
import { band, bandOf, requireInRange } from './rating-bands.js';
import type { RmrOrientationAssessment } from './rmr-orientation.js';
import { RMR_TUNNEL_ADJUSTMENT, rmrOrientationInTunnel } from './rmr-orientation.js';
import type { Drive, Plane } from './types.js';
import { RatingError } from './types.js';

/**
 * RMR89 — Bieniawski 1989, Engineering Rock Mass Classifications, Table 4.1 (A1–A5, B, C, D, E, F).
 * Ratings A1–A5, B, C seen in Brady & Brown 2004 p.97; E seen in Look, Handbook of Geotechnical
 * Investigation and Design Tables, Table 18.4; D (class meaning) from memory.
 *
 * Boundary rule for the measured inputs: a value exactly on a boundary takes the less favourable (lower)
 * rating. Each row below states which of its ends it includes.
 */
export const RMR89_EDITION = 'RMR89: Bieniawski 1989, Engineering Rock Mass Classifications, Table 4.1';

const INF = Infinity;

/** A1 by point-load index Is50 (MPa). At or below 1 MPa use UCS instead. */
export const RMR89_STRENGTH_IS50: readonly RatingBand[] = [
  band(10, false, INF, false, 15, 'Is50 over 10 MPa'),
  band(4, false, 10, true, 12, 'Is50 over 4 to 10 MPa'),
  band(2, false, 4, true, 7, 'Is50 over 2 to 4 MPa'),
  band(1, false, 2, true, 4, 'Is50 over 1 to 2 MPa'),
];

/** A1 by uniaxial compressive strength (MPa). */
export const RMR89_STRENGTH_UCS: readonly RatingBand[] = [
  band(250, false, INF, false, 15, 'UCS over 250 MPa'),
  band(100, false, 250, true, 12, 'UCS over 100 to 250 MPa'),
  band(50, false, 100, true, 7, 'UCS over 50 to 100 MPa'),
  band(25, false, 50, true, 4, 'UCS over 25 to 50 MPa'),
  band(5, false, 25, true, 2, 'UCS over 5 to 25 MPa'),
  band(1, false, 5, true, 1, 'UCS over 1 to 5 MPa'),
  band(0, true, 1, true, 0, 'UCS 1 MPa or less'),
];

/** A2, RQD (%). */
export const RMR89_RQD: readonly RatingBand[] = [
  band(90, false, 100, true, 20, 'RQD over 90 to 100 %'),
  band(75, false, 90, true, 17, 'RQD over 75 to 90 %'),
  band(50, false, 75, true, 13, 'RQD over 50 to 75 %'),
  band(25, false, 50, true, 8, 'RQD over 25 to 50 %'),
  band(0, true, 25, true, 3, 'RQD 25 % or less'),
];

/** A3, spacing of discontinuities (metres). */
export const RMR89_SPACING: readonly RatingBand[] = [
  band(2, false, INF, false, 20, 'over 2 m'),
  band(0.6, false, 2, true, 15, 'over 0.6 to 2 m'),
  band(0.2, false, 0.6, true, 10, 'over 200 to 600 mm'),
  band(0.06, false, 0.2, true, 8, 'over 60 to 200 mm'),
  band(0, false, 0.06, true, 5, '60 mm or less'),
];

/** A4, the simple condition rating, one class per row. */
export type Rmr89SimpleCondition =
  | 'very-rough-tight'
  | 'slightly-rough-slightly-weathered'
  | 'slightly-rough-highly-weathered'
  | 'slickensided-or-thin-gouge'
  | 'soft-gouge-or-wide-open';

export const RMR89_CONDITION_SIMPLE: readonly {
  readonly id: Rmr89SimpleCondition;
  readonly rating: number;
  readonly description: string;
}[] = [
  { id: 'very-rough-tight', rating: 30, description: 'Very rough, not continuous, closed, fresh walls' },
  {
    id: 'slightly-rough-slightly-weathered',
    rating: 25,
    description: 'Slightly rough, open under 1 mm, walls slightly weathered',
  },
  {
    id: 'slightly-rough-highly-weathered',
    rating: 20,
    description: 'Slightly rough, open under 1 mm, walls highly weathered',
  },
  {
    id: 'slickensided-or-thin-gouge',
    rating: 10,
    description: 'Continuous; slickensided, or gouge under 5 mm thick, or open 1–5 mm',
  },
  {
    id: 'soft-gouge-or-wide-open',
    rating: 0,
    description: 'Continuous; soft gouge over 5 mm thick, or open over 5 mm',
  },
];

/** E, persistence (metres). */
export const RMR89_PERSISTENCE: readonly RatingBand[] = [
  band(0, true, 1, false, 6, 'under 1 m'),
  band(1, true, 3, false, 4, '1 m to under 3 m'),
  band(3, true, 10, false, 2, '3 m to under 10 m'),
  band(10, true, 20, false, 1, '10 m to under 20 m'),
  band(20, true, INF, false, 0, '20 m or more'),
];

/** E, separation or aperture (mm). 0 means closed. */
export const RMR89_SEPARATION: readonly RatingBand[] = [
  band(0, true, 0, true, 6, 'closed'),
  band(0, false, 0.1, false, 5, 'open under 0.1 mm'),
  band(0.1, true, 1, false, 4, '0.1 mm to under 1 mm'),
  band(1, true, 5, false, 1, '1 mm to under 5 mm'),
  band(5, true, INF, false, 0, '5 mm or more'),
];

export type Rmr89Roughness = 'very rough' | 'rough' | 'slightly rough' | 'smooth' | 'slickensided';
export const RMR89_ROUGHNESS: Readonly<Record<Rmr89Roughness, number>> = {
  'very rough': 6,
  rough: 5,
  'slightly rough': 3,
  smooth: 1,
  slickensided: 0,
};

export type Rmr89Weathering = 'unweathered' | 'slightly' | 'moderately' | 'highly' | 'decomposed';
export const RMR89_WEATHERING: Readonly<Record<Rmr89Weathering, number>> = {
  unweathered: 6,
  slightly: 5,
  moderately: 3,
  highly: 1,
  decomposed: 0,
};

/** E, infilling: hard or soft, by thickness (mm); 5 mm itself counts as thick. */
export const RMR89_INFILLING_HARD: readonly RatingBand[] = [
  band(0, false, 5, false, 4, 'hard filling under 5 mm'),
  band(5, true, INF, false, 2, 'hard filling 5 mm or more'),
];
export const RMR89_INFILLING_SOFT: readonly RatingBand[] = [
  band(0, false, 5, false, 2, 'soft filling under 5 mm'),
  band(5, true, INF, false, 0, 'soft filling 5 mm or more'),
];
export const RMR89_NO_INFILLING_RATING = 6;

/** A5, inflow per 10 m of tunnel length (litres per minute). */
export const RMR89_INFLOW: readonly RatingBand[] = [
  band(0, true, 0, true, 15, 'none'),
  band(0, false, 10, false, 10, 'under 10 L/min'),
  band(10, true, 25, false, 7, '10 to under 25 L/min'),
  band(25, true, 125, false, 4, '25 to under 125 L/min'),
  band(125, true, INF, false, 0, '125 L/min or more'),
];

/** A5, joint water pressure over major principal stress. */
export const RMR89_PRESSURE_RATIO: readonly RatingBand[] = [
  band(0, true, 0, true, 15, '0'),
  band(0, false, 0.1, false, 10, 'under 0.1'),
  band(0.1, true, 0.2, false, 7, '0.1 to under 0.2'),
  band(0.2, true, 0.5, false, 4, '0.2 to under 0.5'),
  band(0.5, true, INF, false, 0, '0.5 or more'),
];

export type Rmr89WaterCondition = 'completely dry' | 'damp' | 'wet' | 'dripping' | 'flowing';
export const RMR89_WATER_CONDITION: Readonly<Record<Rmr89WaterCondition, number>> = {
  'completely dry': 15,
  damp: 10,
  wet: 7,
  dripping: 4,
  flowing: 0,
};

export type Rmr89Class = 'I' | 'II' | 'III' | 'IV' | 'V';

/** C and D: classes (seen) and their meaning (from memory). A total on a boundary: 80 is II, 81 is I. */
export const RMR89_CLASSES: readonly {
  readonly rockClass: Rmr89Class;
  readonly description: string;
  /** Lowest total in the class; totals above the next class's `above` go to that class. */
  readonly above: number;
  readonly standUpTime: string;
  readonly cohesionKPa: string;
  readonly frictionDeg: string;
  readonly meaningCheck: 'from memory';
}[] = [
  {
    rockClass: 'I',
    description: 'very good rock',
    above: 80,
    standUpTime: '20 years for a 15 m span',
    cohesionKPa: 'over 400',
    frictionDeg: 'over 45',
    meaningCheck: 'from memory',
  },
  {
    rockClass: 'II',
    description: 'good rock',
    above: 60,
    standUpTime: '1 year for a 10 m span',
    cohesionKPa: '300–400',
    frictionDeg: '35–45',
    meaningCheck: 'from memory',
  },
  {
    rockClass: 'III',
    description: 'fair rock',
    above: 40,
    standUpTime: '1 week for a 5 m span',
    cohesionKPa: '200–300',
    frictionDeg: '25–35',
    meaningCheck: 'from memory',
  },
  {
    rockClass: 'IV',
    description: 'poor rock',
    above: 20,
    standUpTime: '10 hours for a 2.5 m span',
    cohesionKPa: '100–200',
    frictionDeg: '15–25',
    meaningCheck: 'from memory',
  },
  {
    rockClass: 'V',
    description: 'very poor rock',
    above: -Infinity,
    standUpTime: '30 minutes for a 1 m span',
    cohesionKPa: 'under 100',
    frictionDeg: 'under 15',
    meaningCheck: 'from memory',
  },
];

export type Rmr89Strength = { kind: 'point-load'; is50: number } | { kind: 'ucs'; ucs: number };

export type Rmr89Infilling = { kind: 'none' } | { kind: 'hard' | 'soft'; thicknessMm: number };

export type Rmr89Condition =
  | { kind: 'simple'; condition: Rmr89SimpleCondition }
  | {
      kind: 'detailed';
      persistenceM: number;
      separationMm: number;
      roughness: Rmr89Roughness;
      infilling: Rmr89Infilling;
      weathering: Rmr89Weathering;
    };

export type Rmr89Groundwater =
  | { kind: 'inflow'; litresPerMinutePer10m: number }
  | { kind: 'pressure-ratio'; ratio: number }
  | { kind: 'condition'; condition: Rmr89WaterCondition };

export type Rmr89Orientation =
  | { kind: 'assessment'; assessment: RmrOrientationAssessment }
  | { kind: 'set-and-drive'; plane: Plane; drive: Drive }
  | { kind: 'not assessed' };

/**
 * Input of `rmr89`.
 * - strength: point-load index Is50 (MPa, must be over 1) or UCS (MPa, 0 or more).
 * - rqd: 0–100 %.
 * - spacingM: mean spacing of discontinuities, metres (> 0).
 * - condition: the simple A4 class, or the detailed E ratings (persistence m, separation mm, roughness,
 *   infilling, weathering) whose sum replaces A4 — except that soft infilling of 5 mm or more governs and
 *   the condition is then 0 (Bieniawski's note to Table E; RMR89_SOFT_INFILL_NOTE).
 * - groundwater: inflow per 10 m of tunnel (L/min), pressure ratio, or the general condition.
 * - orientation: an assessment, a set and the drive (rmrOrientationInTunnel), or 'not assessed' (0).
 */
export interface Rmr89Input {
  strength: Rmr89Strength;
  rqd: number;
  spacingM: number;
  condition: Rmr89Condition;
  groundwater: Rmr89Groundwater;
  orientation: Rmr89Orientation;
}

export interface Rmr89Result {
  total: number;
  rockClass: Rmr89Class;
  /** strength, rqd, spacing, condition, groundwater, orientation; with the detailed path also
   * persistence, separation, roughness, infilling, weathering. */
  ratings: Record<string, number>;
  /** Sum of A1–A5 (no orientation adjustment). */
  basic: number;
  /** RMR89′ for GSI: groundwater taken as dry (15) and no orientation adjustment. */
  dryUnadjusted: number;
  meaning: (typeof RMR89_CLASSES)[number];
  /** Set when a note to table E overrode the sum of the E ratings (the condition rating is then 0). */
  conditionGovernedBy?: 'soft infilling 5 mm or more';
  /** Notes applied, in words, for the UI to show beside the condition rating. */
  notes: string[];
}

/**
 * Bieniawski's note to Table 4.1 E (1989; methods.md §4.2, from memory): where soft infilling thicker than
 * 5 mm is present it governs, and the condition rating is that of A4's last row (0), whatever the other E
 * ratings sum to. Roundbook applies it from 5 mm itself (a boundary value takes the less favourable side).
 */
export const RMR89_SOFT_INFILL_NOTE =
  'Soft infilling of 5 mm or more governs the joint condition (Bieniawski 1989, note to Table 4.1 E): the condition rating is that of A4, soft gouge over 5 mm (0), not the sum of the E ratings.';

/** Thickness (mm) from which soft infilling governs the condition (Roundbook boundary rule: 5 mm included). */
export const RMR89_SOFT_INFILL_GOVERNS_MM = 5;

function strengthRating(strength: Rmr89Strength): number {
  switch (strength.kind) {
    case 'point-load':
      if (Number.isFinite(strength.is50) && strength.is50 <= 1 && strength.is50 >= 0) {
        throw new RatingError(
          `point-load index Is50 ${strength.is50} MPa is 1 MPa or less: give the UCS instead (RMR89 table A1)`,
        );
      }
      return bandOf('point-load index Is50', strength.is50, RMR89_STRENGTH_IS50, 'MPa').rating;
    case 'ucs':
      return bandOf('UCS', strength.ucs, RMR89_STRENGTH_UCS, 'MPa').rating;
  }
}

function conditionRatings(condition: Rmr89Condition): Record<string, number> {
  switch (condition.kind) {
    case 'simple': {
      const row = RMR89_CONDITION_SIMPLE.find((r) => r.id === condition.condition);
      if (row === undefined) {
        throw new RatingError(
          `joint condition "${String(condition.condition)}" is not in table A4: expected one of ${RMR89_CONDITION_SIMPLE.map((r) => r.id).join(', ')}`,
        );
      }
      return { condition: row.rating };
    }
    case 'detailed': {
      const persistence = bandOf('persistence', condition.persistenceM, RMR89_PERSISTENCE, 'm').rating;
      const separation = bandOf('separation', condition.separationMm, RMR89_SEPARATION, 'mm').rating;
      const roughness = lookup('roughness', condition.roughness, RMR89_ROUGHNESS);
      const weathering = lookup('weathering', condition.weathering, RMR89_WEATHERING);
      const infilling = infillingRating(condition.infilling);
      const governed = softInfillGoverns(condition.infilling);
      return {
        persistence,
        separation,
        roughness,
        infilling,
        weathering,
        condition: governed
          ? RMR89_CONDITION_SIMPLE[RMR89_CONDITION_SIMPLE.length - 1].rating
          : persistence + separation + roughness + infilling + weathering,
      };
    }
  }
}

function softInfillGoverns(infilling: Rmr89Infilling): boolean {
  return infilling.kind === 'soft' && infilling.thicknessMm >= RMR89_SOFT_INFILL_GOVERNS_MM;
}

function infillingRating(infilling: Rmr89Infilling): number {
  switch (infilling.kind) {
    case 'none':
      return RMR89_NO_INFILLING_RATING;
    case 'hard':
      return bandOf('hard infilling thickness', infilling.thicknessMm, RMR89_INFILLING_HARD, 'mm').rating;
    case 'soft':
      return bandOf('soft infilling thickness', infilling.thicknessMm, RMR89_INFILLING_SOFT, 'mm').rating;
  }
}

function lookup<K extends string>(parameter: string, key: K, table: Readonly<Record<K, number>>): number {
  const value = (table as Readonly<Record<string, number | undefined>>)[key];
  if (value === undefined) {
    throw new RatingError(
      `${parameter} "${String(key)}" is not in the table: expected one of ${Object.keys(table).join(', ')}`,
    );
  }
  return value;
}

function groundwaterRating(water: Rmr89Groundwater): number {
  switch (water.kind) {
    case 'inflow':
      return bandOf('inflow per 10 m', water.litresPerMinutePer10m, RMR89_INFLOW, 'L/min').rating;
    case 'pressure-ratio':
      return bandOf('joint water pressure ratio', water.ratio, RMR89_PRESSURE_RATIO, '').rating;
    case 'condition':
      return lookup('groundwater condition', water.condition, RMR89_WATER_CONDITION);
  }
}

function orientationRating(orientation: Rmr89Orientation): number {
  switch (orientation.kind) {
    case 'assessment':
      return lookup('orientation assessment', orientation.assessment, RMR_TUNNEL_ADJUSTMENT);
    case 'set-and-drive':
      return rmrOrientationInTunnel(orientation.plane, orientation.drive).adjustment;
    case 'not assessed':
      return 0;
  }
}

/** The RMR89 class of a total: over 80 I, over 60 II, over 40 III, over 20 IV, otherwise V. */
export function rmr89Class(total: number): Rmr89Class {
  requireInRange('RMR89 total', total, -12, 100);
  const row = RMR89_CLASSES.find((c) => total > c.above);
  return (row ?? RMR89_CLASSES[RMR89_CLASSES.length - 1]).rockClass;
}

/** RMR89 total, class and the rating of each parameter (see Rmr89Input for the input shape). */
export function rmr89(input: Rmr89Input): Rmr89Result {
  const strength = strengthRating(input.strength);
  const rqd = bandOf('RQD', input.rqd, RMR89_RQD, '%').rating;
  const spacing = bandOf('spacing', input.spacingM, RMR89_SPACING, 'm').rating;
  const condition = conditionRatings(input.condition);
  const groundwater = groundwaterRating(input.groundwater);
  const orientation = orientationRating(input.orientation);
  const conditionTotal = condition.condition;
  const basic = strength + rqd + spacing + conditionTotal + groundwater;
  const total = basic + orientation;
  const rockClass = rmr89Class(total);
  const meaning = RMR89_CLASSES.find((c) => c.rockClass === rockClass) ?? RMR89_CLASSES[4];
  const governed = input.condition.kind === 'detailed' && softInfillGoverns(input.condition.infilling);
  const result: Rmr89Result = {
    total,
    rockClass,
    ratings: { strength, rqd, spacing, ...condition, groundwater, orientation },
    basic,
    dryUnadjusted: basic - groundwater + RMR89_WATER_CONDITION['completely dry'],
    meaning,
    notes: governed ? [RMR89_SOFT_INFILL_NOTE] : [],
  };
  if (governed) result.conditionGovernedBy = 'soft infilling 5 mm or more';
  return result;
}

/** What was recorded for the governing joint (or set) of the round: aperture and infill. */
export interface GoverningJointRecord {
  /** Aperture (separation) in mm; null or undefined when not recorded. */
  apertureMm?: number | null;
  /** Infill as recorded; null or undefined when not recorded. */
  infill?: Rmr89Infilling | null;
}

export interface Rmr89ConditionWarning {
  code: 'aperture' | 'infill';
  message: string;
}

const mm = (v: number): string => `${Number(v.toFixed(2))} mm`;

function describeInfill(infill: Rmr89Infilling): string {
  return infill.kind === 'none' ? 'no infill' : `${infill.kind} infill ${mm(infill.thicknessMm)}`;
}

/**
 * Warnings (never refusals) where the typed joint condition contradicts what was recorded for the
 * governing joint: its aperture and infill. The simple A4 rows are read by their own words (closed; under
 * 1 mm; gouge under 5 mm or open 1–5 mm; soft gouge or open over 5 mm); the detailed path compares the
 * E bands of separation and infilling. Unrecorded values give no warning.
 */
export function rmr89ConditionWarnings(
  condition: Rmr89Condition,
  joint: GoverningJointRecord,
): Rmr89ConditionWarning[] {
  const out: Rmr89ConditionWarning[] = [];
  const aperture =
    typeof joint.apertureMm === 'number' && Number.isFinite(joint.apertureMm) && joint.apertureMm >= 0
      ? joint.apertureMm
      : undefined;
  const infill = joint.infill ?? undefined;
  const filled = infill !== undefined && infill.kind !== 'none' ? infill : undefined;
  const thickSoft = infill !== undefined && softInfillGoverns(infill);
  if (condition.kind === 'simple') {
    const row = RMR89_CONDITION_SIMPLE.find((r) => r.id === condition.condition);
    const name = row ? `“${row.description}” (${row.rating})` : condition.condition;
    switch (condition.condition) {
      case 'very-rough-tight':
        if (aperture !== undefined && aperture > 0)
          out.push({
            code: 'aperture',
            message: `The condition ${name} means closed joints, but the governing joint is open ${mm(aperture)}.`,
          });
        if (filled)
          out.push({
            code: 'infill',
            message: `The condition ${name} means closed joints, but the governing joint has ${describeInfill(filled)}.`,
          });
        break;
      case 'slightly-rough-slightly-weathered':
      case 'slightly-rough-highly-weathered':
        if (aperture !== undefined && aperture >= 1)
          out.push({
            code: 'aperture',
            message: `The condition ${name} means open under 1 mm, but the governing joint is open ${mm(aperture)}.`,
          });
        if (filled && filled.thicknessMm >= 1)
          out.push({
            code: 'infill',
            message: `The condition ${name} means open under 1 mm, but the governing joint has ${describeInfill(filled)}.`,
          });
        break;
      case 'slickensided-or-thin-gouge':
        if (aperture !== undefined && aperture >= 5)
          out.push({
            code: 'aperture',
            message: `The condition ${name} means open under 5 mm, but the governing joint is open ${mm(aperture)}: A4 rates that 0.`,
          });
        if (thickSoft && filled)
          out.push({
            code: 'infill',
            message: `The condition ${name} means gouge under 5 mm, but the governing joint has ${describeInfill(filled)}: A4 rates that 0.`,
          });
        break;
      case 'soft-gouge-or-wide-open': {
        // Separation over 5 mm: the opening is the aperture or, when filled, the filling's thickness.
        const opening = Math.max(aperture ?? 0, filled?.thicknessMm ?? 0);
        const known = aperture !== undefined || infill !== undefined;
        if (known && !thickSoft && opening < RMR89_SOFT_INFILL_GOVERNS_MM)
          out.push({
            code: infill !== undefined ? 'infill' : 'aperture',
            message: `The condition ${name} means soft gouge or an opening of 5 mm or more, but the governing joint has ${
              infill !== undefined ? describeInfill(infill) : 'no infill recorded'
            }${aperture !== undefined ? ` and is open ${mm(aperture)}` : ''}.`,
          });
        break;
      }
    }
    return out;
  }
  if (aperture !== undefined) {
    const typed = bandOf('separation', condition.separationMm, RMR89_SEPARATION, 'mm');
    const recorded = bandOf('recorded aperture', aperture, RMR89_SEPARATION, 'mm');
    if (typed !== recorded)
      out.push({
        code: 'aperture',
        message: `The separation typed (${mm(condition.separationMm)}, ${typed.description}) differs from the governing joint's aperture (${mm(aperture)}, ${recorded.description}).`,
      });
  }
  if (infill !== undefined) {
    const typed = condition.infilling;
    const sameKind = typed.kind === infill.kind;
    const sameBand =
      sameKind && (typed.kind === 'none' || infillingRating(typed) === infillingRating(infill));
    if (!sameBand)
      out.push({
        code: 'infill',
        message: `The infilling typed (${describeInfill(typed)}) differs from the governing joint's (${describeInfill(infill)})${
          softInfillGoverns(infill) && !softInfillGoverns(typed)
            ? ': soft infill of 5 mm or more governs the condition (0)'
            : ''
        }.`,
      });
  }
  return out;
}
