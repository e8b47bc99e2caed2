import { findSets, jvFromSpacings, planeOfPole, poleOf, rmrOrientationInTunnel } from '@roundbook/geomath';
import type { Drive, Plane, RmrOrientationResult } from '@roundbook/geomath';
import type { NearbyJoint } from '@/features/rounds/api/types';
import type { JointRow } from '@/features/rounds/schemas/round-form';
import { valueOf } from '@/features/rounds/schemas/round-form';
import { readOrientation } from '@/features/rounds/utils/orientation';

export interface ComputedSet {
  label: string;
  mean: Plane;
  /** Joints of this round and of earlier rounds in the set. */
  count: number;
  /** Of which from this round. */
  countHere: number;
  k: number;
  alpha95: number;
  /** Keys of this round's joints in the set. */
  memberKeys: string[];
  /** Mean spacing of this round's joints in the set that have one, m. */
  meanSpacingM: number | null;
  orientation: RmrOrientationResult | null;
}

export interface SetsResult {
  sets: ComputedSet[];
  /** The computed set label of each of this round's readable joints ('' = in no set). */
  labelOf: Record<string, string>;
  /** How many readable joints (this round + nearby) went into the analysis. */
  used: number;
}

/**
 * Sets from this round's readable joints plus the earlier rounds' joints near it, with geomath's
 * `findSets` on the poles. Labels S1, S2, … follow the set sizes (largest first).
 */
export function computeSets(
  joints: JointRow[],
  nearby: NearbyJoint[],
  drive: Drive | null,
  /** How many sets to look for; null lets geomath decide from the density (needs many joints). */
  count: number | null = null,
): SetsResult {
  const here: { key: string; plane: Plane; spacing: number | null }[] = [];
  for (const j of joints) {
    const reading = readOrientation(j.orientationText, j.notation);
    if (reading.kind !== 'plane') continue;
    const spacing = valueOf(j.spacingM);
    here.push({
      key: j.key,
      plane: reading.plane,
      spacing: spacing !== null && spacing > 0 ? spacing : null,
    });
  }
  const planes = [
    ...here.map((h) => h.plane),
    ...nearby.map((n) => ({ dipDirection: n.dipDirection, dip: n.dip })),
  ];
  const labelOf: Record<string, string> = Object.fromEntries(here.map((h) => [h.key, '']));
  if (planes.length < 2) return { sets: [], labelOf, used: planes.length };
  const { sets } = findSets(
    planes.map(poleOf),
    count === null ? undefined : { count: Math.min(count, planes.length) },
  );
  const computed = sets.map((set, i) => {
    const label = `S${i + 1}`;
    const members = set.members.filter((m) => m < here.length).map((m) => here[m]);
    for (const m of members) labelOf[m.key] = label;
    const spacings = members.map((m) => m.spacing).filter((s): s is number => s !== null);
    const mean = planeOfPole(set.mean);
    let orientation: RmrOrientationResult | null = null;
    if (drive !== null) {
      try {
        // The mean to 0.1°, as shown; the assessment's reason then reads like the table.
        const shown = {
          dipDirection: Math.round(mean.dipDirection * 10) / 10,
          dip: Math.round(mean.dip * 10) / 10,
        };
        orientation = rmrOrientationInTunnel(shown, drive);
      } catch {
        orientation = null;
      }
    }
    return {
      label,
      mean,
      count: set.members.length,
      countHere: members.length,
      k: set.k,
      alpha95: set.alpha95,
      memberKeys: members.map((m) => m.key),
      meanSpacingM: spacings.length === 0 ? null : spacings.reduce((a, b) => a + b, 0) / spacings.length,
      orientation,
    };
  });
  return { sets: computed, labelOf, used: planes.length };
}

/** The least favourable orientation assessment among the sets (the one to suggest for RMR89). */
export function worstOrientation(
  sets: ComputedSet[],
): { set: ComputedSet; result: RmrOrientationResult } | null {
  let worst: { set: ComputedSet; result: RmrOrientationResult } | null = null;
  for (const set of sets) {
    if (set.orientation === null) continue;
    if (worst === null || set.orientation.adjustment < worst.result.adjustment) {
      worst = { set, result: set.orientation };
    }
  }
  return worst;
}

/** Jv from the mean spacing of each set of this round (geomath's jvFromSpacings); null without spacings. */
export function jvOfSets(sets: ComputedSet[]): { jv: number; spacings: number[] } | null {
  const spacings = sets.map((s) => s.meanSpacingM).filter((s): s is number => s !== null);
  if (spacings.length === 0) return null;
  return { jv: jvFromSpacings(spacings), spacings };
}
