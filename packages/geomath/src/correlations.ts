import { ratingCaution } from './cautions.js';
import { requireFinite, requireInRange, requirePositive } from './rating-bands.js';
import { RatingError } from './types.js';

/**
 * Published correlations between ratings. Each is an empirical fit, not a measurement: results carry a
 * flag or a caution saying so.
 */

/** Lowest RMR89′ for which GSI = RMR89′ − 5 is used (Singh & Goel 2011, eq. 26.1: RMR89′ ≥ 23). */
export const GSI_FROM_RMR89_MIN = 23;

/**
 * GSI = RMR89′ − 5 (Hoek, Kaiser & Bawden 1995; Hoek & Brown 1997; seen in Singh & Goel 2011 eq. 26.1),
 * where RMR89′ is RMR89 with groundwater rated dry (15) and no orientation adjustment (`rmr89(...).dryUnadjusted`).
 * Valid for RMR89′ from 23 (included) to 100; below that, read GSI from its chart (RatingError).
 */
export function gsiFromRmr89(rmr89: number): number {
  requireFinite('RMR89′', rmr89);
  if (rmr89 < GSI_FROM_RMR89_MIN || rmr89 > 100) {
    throw new RatingError(
      `RMR89′ ${rmr89} is outside the range of GSI = RMR89′ − 5: expected ${GSI_FROM_RMR89_MIN} to 100 (below 23 read GSI from the chart)`,
    );
  }
  return rmr89 - 5;
}

export type JvEdition = 1982 | 2005;

export interface RqdEstimate {
  rqd: number;
  /** Value of the straight line before clipping to 0–100. */
  unclipped: number;
  clipped: boolean;
  /** Always true: RQD from Jv is a correlation. */
  isCorrelation: true;
  source: string;
  caution: string;
}

const JV_SOURCES: Record<JvEdition, string> = {
  1982: 'Palmström 1982 (also ISRM 1981): RQD = 115 − 3.3·Jv',
  2005: 'Palmström 2005, Measurements of and correlations between block size and RQD, TUST 20: RQD = 110 − 2.5·Jv',
};

/** RQD from the volumetric joint count with its flags (see rqdFromJv). */
export function rqdEstimateFromJv(jv: number, edition: JvEdition): RqdEstimate {
  requireFinite('Jv', jv);
  if (jv < 0) throw new RatingError(`Jv ${jv} joints/m³ is negative: expected 0 or more`);
  let unclipped: number;
  if (edition === 1982) unclipped = 115 - 3.3 * jv;
  else if (edition === 2005) unclipped = 110 - 2.5 * jv;
  else throw new RatingError(`Jv–RQD edition ${String(edition)} is not known: expected 1982 or 2005`);
  const rqd = Math.min(100, Math.max(0, unclipped));
  return {
    rqd,
    unclipped,
    clipped: rqd !== unclipped,
    isCorrelation: true,
    source: JV_SOURCES[edition],
    caution: ratingCaution('rqd-from-jv').text,
  };
}

/**
 * RQD (%) from Jv (joints/m³), clipped to 0–100. 1982: 115 − 3.3·Jv (seen in secondary sources);
 * 2005: 110 − 2.5·Jv (from memory). A correlation, not a measurement.
 */
export function rqdFromJv(jv: number, edition: JvEdition): number {
  return rqdEstimateFromJv(jv, edition).rqd;
}

/**
 * Volumetric joint count Jv = Σ 1/S_i (S_i the mean spacing of set i, metres) + Nr/5, where Nr is the number
 * of random joints (belonging to no set) counted with the sets (Palmström; methods.md §4.3).
 */
export function jvFromSpacings(spacingsM: readonly number[], randomJoints = 0): number {
  spacingsM.forEach((s, i) => requirePositive(`spacing of set ${i + 1}`, s, 'm'));
  requireInRange('random joint count', randomJoints, 0, Number.MAX_SAFE_INTEGER);
  return spacingsM.reduce((sum, s) => sum + 1 / s, 0) + randomJoints / 5;
}

/** RMR = 9·ln Q + 44 (Bieniawski 1976; seen as a common correlation in Palmström 2008, Fig. 1). */
export function rmrFromQBieniawski1976(q: number): number {
  requirePositive('Q', q);
  return 9 * Math.log(q) + 44;
}

/** RMR ≈ 15·log10 Q + 50 (Barton 1995; from memory). */
export function rmrFromQBarton1995(q: number): number {
  requirePositive('Q', q);
  return 15 * Math.log10(q) + 50;
}
