// Water once: the inflow is recorded once in the ground record (l/min over a stated length of tunnel, or
// at the face); the per-10 m value, the RMR89 groundwater rating and the trigger all read that record.
import { RMR89_INFLOW, RMR89_WATER_CONDITION } from '@roundbook/geomath';

/** Inflow per 10 m of tunnel from the inflow and the length it comes from (l/min per 10 m). */
export function inflowPer10m(inflowLpm: number | null, lengthM: number | null): number | null {
  if (inflowLpm === null || lengthM === null || lengthM <= 0) return null;
  return (inflowLpm * 10) / lengthM;
}

/** What the ground record says about water (the fields of GroundRecord that water reads). */
export interface WaterRecord {
  inflowLpm: number | null;
  inflowLengthM: number | null;
  /** True when the inflow was measured at the face (a point inflow, not over a length of tunnel). */
  inflowAtFace?: boolean | null;
}

export interface WaterReading {
  /** l/min per 10 m of tunnel, or null when no inflow is recorded or its length is missing. */
  per10m: number | null;
  /** How it was worked out, in words (shown beside the value). */
  basis: string | null;
  /** Field errors to ask for (a missing length), keyed by field path. */
  missing: Record<string, string>;
}

/**
 * The inflow per 10 m from the one record. Over a stated length L: q·10/L. At the face: a point inflow falls
 * whole within the 10 m that holds the face, so the per-10 m value is the inflow itself (Roundbook
 * convention, from memory of common practice). A missing length is asked for, never replaced by the round
 * length.
 */
export function readWater(w: WaterRecord): WaterReading {
  if (w.inflowLpm === null || w.inflowLpm === undefined) return { per10m: null, basis: null, missing: {} };
  if (w.inflowAtFace) {
    return {
      per10m: w.inflowLpm,
      basis: `${w.inflowLpm} l/min at the face, taken whole in 10 m`,
      missing: {},
    };
  }
  if (w.inflowLengthM === null || w.inflowLengthM === undefined || !(w.inflowLengthM > 0)) {
    return {
      per10m: null,
      basis: null,
      missing: {
        'ground.inflowLengthM':
          'Give the length of tunnel the inflow comes from (ground.inflowLengthM), or mark the inflow as at the face.',
      },
    };
  }
  return {
    per10m: inflowPer10m(w.inflowLpm, w.inflowLengthM),
    basis: `${w.inflowLpm} l/min over ${w.inflowLengthM} m`,
    missing: {},
  };
}

/** The RMR89 A5 rating of an inflow per 10 m (Bieniawski 1989, Table 4.1 A5). */
export function inflowRating(per10m: number): number {
  const band = RMR89_INFLOW.find((b) => {
    const lo = b.minInclusive ? per10m >= b.min : per10m > b.min;
    const hi = b.maxInclusive ? per10m <= b.max : per10m < b.max;
    return lo && hi;
  });
  return band ? band.rating : 0;
}

/**
 * A warning when groundwater is rated by its general condition but the measured inflow falls in another A5
 * band (Bieniawski 1989, Table 4.1 A5: the inflow, pressure-ratio and condition columns of one row rate alike).
 */
export function waterConditionWarning(
  condition: keyof typeof RMR89_WATER_CONDITION,
  per10m: number | null,
): string | null {
  if (per10m === null) return null;
  const byCondition = RMR89_WATER_CONDITION[condition];
  const byInflow = inflowRating(per10m);
  if (byCondition === byInflow) return null;
  const shown = Math.round(per10m * 10) / 10;
  return `Groundwater is rated “${condition}” (${byCondition}), but the inflow recorded, ${shown} l/min per 10 m, rates ${byInflow} (Bieniawski 1989, Table 4.1 A5): rate it by the inflow, or check the record.`;
}
