// Values typed once in Ground and Joints, carried into the rating inputs (issue 19, item 3): each with
// the value, where it came from in words, and any caution that goes with it. Pure; the browser fills
// empty rating inputs from it and marks them as carried.
import { jvFromSpacings, rqdEstimateFromJv } from '@roundbook/geomath';
import type { JvEdition } from '@roundbook/geomath';
import type { RoundSet } from './sets.js';

export type CarriedInput = 'is50' | 'rmrRqd' | 'qRqd' | 'spacingM' | 'inflowPer10m';

export interface CarriedValue {
  value: number;
  /** Where the value comes from, in words for the screen ("Ground: point-load index Is50"). */
  source: string;
  /** A caution that goes with the value, or null. */
  caution: string | null;
}

export interface CarriedSources {
  pointLoadIs50: number | null;
  /** Inflow per 10 m of tunnel as the round's assessment reads it (l/min). */
  inflowPer10m: number | null;
  sets: readonly RoundSet[];
  /** The Jv–RQD correlation to use (Palmström 1982 or 2005). */
  jvEdition?: JvEdition;
}

/** Rounded as the screen shows it, so a carried value and its text agree. */
const shown = (v: number, decimals: number): number => {
  const f = 10 ** decimals;
  return Math.round(v * f) / f;
};

/** The sets that have no spacing on this round, by label ("B, C"). */
export function setsWithoutSpacing(sets: readonly RoundSet[]): string[] {
  return sets.filter((s) => s.meanSpacingM === null).map((s) => s.label);
}

/**
 * RQD from the volumetric joint count of the sets' spacings (Palmström: Jv = Σ 1/spacing), with a
 * caution naming the sets that had no spacing: Jv then counts too few joints and RQD reads too high
 * (optimistic). A single set's spacing alone gives Jv of one set, so RQD is near 100 % for any spacing
 * over about 0.3 m; that is said too.
 */
export function rqdFromSets(
  sets: readonly RoundSet[],
  edition: JvEdition = 1982,
): (CarriedValue & { jv: number; missing: string[] }) | null {
  const spaced = sets.filter((s): s is RoundSet & { meanSpacingM: number } => s.meanSpacingM !== null);
  if (spaced.length === 0) return null;
  let jv: number;
  let rqd: number;
  try {
    jv = jvFromSpacings(spaced.map((s) => s.meanSpacingM));
    rqd = rqdEstimateFromJv(jv, edition).rqd;
  } catch {
    return null;
  }
  const missing = setsWithoutSpacing(sets);
  const cautions: string[] = [];
  if (missing.length > 0)
    cautions.push(
      `Set${missing.length === 1 ? '' : 's'} ${missing.join(', ')} had no spacing and ${missing.length === 1 ? 'is' : 'are'} not counted in Jv, so this RQD is optimistic (too high).`,
    );
  if (spaced.length === 1)
    cautions.push(
      `Jv from one set's spacing alone counts only that set; RQD is then optimistic — type the spacing of every set, or RQD as measured.`,
    );
  return {
    value: shown(rqd, 0),
    jv,
    missing,
    source: `Joints: Jv ${jv.toFixed(1)} joints/m³ from the spacing of set${spaced.length === 1 ? '' : 's'} ${spaced.map((s) => s.label).join(', ')} (${edition === 1982 ? 'Palmström 1982' : 'Palmström 2005'}), a correlation`,
    caution: cautions.length > 0 ? cautions.join(' ') : null,
  };
}

/**
 * What the rating inputs can take from Ground and Joints. RMR89's spacing is the closest-spaced set's mean
 * spacing, the set that governs the blocks [common practice]; inflow per 10 m is the Ground record's.
 */
export function carriedRatingInputs(src: CarriedSources): Partial<Record<CarriedInput, CarriedValue>> {
  const out: Partial<Record<CarriedInput, CarriedValue>> = {};
  if (src.pointLoadIs50 !== null && Number.isFinite(src.pointLoadIs50) && src.pointLoadIs50 > 0)
    out.is50 = { value: src.pointLoadIs50, source: 'Ground: point-load index Is50', caution: null };
  if (src.inflowPer10m !== null && Number.isFinite(src.inflowPer10m) && src.inflowPer10m >= 0)
    out.inflowPer10m = {
      value: shown(src.inflowPer10m, 1),
      source: 'Ground: water inflow per 10 m of tunnel',
      caution: null,
    };
  const spaced = src.sets.filter((s): s is RoundSet & { meanSpacingM: number } => s.meanSpacingM !== null);
  if (spaced.length > 0) {
    const closest = spaced.reduce((a, b) => (b.meanSpacingM < a.meanSpacingM ? b : a));
    const missing = setsWithoutSpacing(src.sets);
    out.spacingM = {
      value: shown(closest.meanSpacingM, 2),
      source: `Joints: mean spacing of set ${closest.label}, the closest-spaced set`,
      caution:
        missing.length > 0
          ? `Set${missing.length === 1 ? '' : 's'} ${missing.join(', ')} had no spacing; a closer set may be missing.`
          : null,
    };
  }
  const rqd = rqdFromSets(src.sets, src.jvEdition ?? 1982);
  if (rqd !== null) {
    const { value, source, caution } = rqd;
    out.rmrRqd = { value, source, caution };
    out.qRqd = { value, source, caution };
  }
  return out;
}
