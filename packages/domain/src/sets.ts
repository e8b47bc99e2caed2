import {
  findSets,
  fisherStatistics,
  jvFromSpacings,
  planeOfPole,
  poleOf,
  rmrOrientationInTunnel,
} from '@roundbook/geomath';
import type { Drive, Plane, RmrOrientationResult } from '@roundbook/geomath';
import { featureKeyOf, onePerFeature } from './features.js';

/** How the sets of a round are found; stored with the round so that a re-read finds the same sets. */
export interface SetParameters {
  /** Metres either side of the face within which earlier rounds' joints of the heading join the analysis. */
  windowM: number;
  /** Number of sets asked for; null lets geomath decide from the density. */
  count: number | null;
}
export const DEFAULT_SET_PARAMETERS: SetParameters = { windowM: 25, count: null };
export const SET_WINDOWS = [0, 10, 25, 50, 100] as const;

/** A readable joint of this round, by its stable id. */
export interface SetJoint {
  id: string;
  plane: Plane;
  spacingM: number | null;
  /**
   * The geologist's own set label, kept over the computed one; '' = the geologist took the joint out of
   * every set (random, left out of the analysis); null = no override.
   */
  override: string | null;
  /** The first observation of the same feature on an earlier round (features.ts). */
  sameAsJointId?: string | null;
}
/** A readable joint of an earlier round near the face. */
export interface NearbyPlane {
  id: string;
  roundId: string;
  plane: Plane;
  /** The first observation of the same feature on an earlier round (features.ts). */
  sameAsJointId?: string | null;
  /** Its round's number: of several observations of one feature the latest is kept. */
  roundNumber?: number;
}

export interface RoundSet {
  label: string;
  mean: Plane;
  /** Joints of this round and of earlier rounds in the set. */
  count: number;
  /** Of which from this round. */
  countHere: number;
  /** Fisher concentration and 95 % cone (degrees); null for a set of one joint. */
  k: number | null;
  alpha95: number | null;
  /** Ids of this round's joints in the set (overrides included). */
  memberIds: string[];
  /** Ids of earlier rounds' joints in the set. */
  nearbyMemberIds: string[];
  /** Mean spacing of this round's joints in the set that have one, m. */
  meanSpacingM: number | null;
  /** RMR89 orientation assessment of the set's mean against the drive. */
  orientation: RmrOrientationResult | null;
  /** True when the set was made only from the geologist's overrides. */
  byOverride: boolean;
}

export interface RoundSets {
  parameters: SetParameters;
  sets: RoundSet[];
  /** The set label of each of this round's readable joints ('' = random, in no set). */
  membership: Record<string, string>;
  /** Ids of this round's joints whose label is the geologist's own. */
  overridden: string[];
  /** How many readable joints (this round + nearby) went into the analysis. */
  used: number;
  /** Earlier observations of features linked to one already counted ("same feature as"), left out. */
  linkedLeftOut: number;
}

const shown = (p: Plane): Plane => ({
  dipDirection: Math.round(p.dipDirection * 10) / 10,
  dip: Math.round(p.dip * 10) / 10,
});

function assess(mean: Plane, drive: Drive | null): RmrOrientationResult | null {
  if (drive === null) return null;
  try {
    // The mean to 0.1°, as shown; the assessment's reason then reads like the table.
    return rmrOrientationInTunnel(shown(mean), drive);
  } catch {
    return null;
  }
}

const finite = (v: number): number | null => (Number.isFinite(v) ? v : null);

function meanOf(planes: Plane[]): { mean: Plane; k: number | null; alpha95: number | null } {
  if (planes.length === 1) return { mean: planes[0], k: null, alpha95: null };
  const f = fisherStatistics(planes.map(poleOf), { axial: true });
  return { mean: planeOfPole(f.mean), k: finite(f.k), alpha95: finite(f.alpha95) };
}

/**
 * Sets from this round's readable joints plus the earlier rounds' joints near it, with geomath's
 * `findSets` on the poles; the round's sets are those with at least one joint on this face. Labels S1, S2, … follow the set sizes (largest first). A geologist's override
 * moves a joint into the named set (or makes a set of that name); the set's mean then includes it. An
 * override with no label ('') takes the joint out of every set: it is random and in no set's mean.
 * A feature linked across rounds ("same feature as") counts once (see onePerFeature).
 */
export function findRoundSets(
  joints: SetJoint[],
  nearbyAll: NearbyPlane[],
  drive: Drive | null,
  parameters: SetParameters = DEFAULT_SET_PARAMETERS,
): RoundSets {
  const membership: Record<string, string> = Object.fromEntries(joints.map((j) => [j.id, '']));
  const overridden = joints.filter((j) => j.override !== null).map((j) => j.id);
  const free = joints.filter((j) => j.override === null);
  // A feature linked across rounds is counted once: this round's observation stands for it in its own
  // sets, and of the earlier observations of any other linked feature the latest is kept (features.ts).
  const hereKeys = new Set(joints.map(featureKeyOf));
  const nearby = onePerFeature(
    nearbyAll.filter((n) => !hereKeys.has(featureKeyOf(n))),
    (a, b) => (a.roundNumber ?? 0) - (b.roundNumber ?? 0),
  );
  const planes = [...free.map((h) => h.plane), ...nearby.map((n) => n.plane)];
  const found: Array<{
    label: string;
    here: SetJoint[];
    near: NearbyPlane[];
    mean: Plane;
    k: number | null;
    a95: number | null;
  }> = [];
  if (planes.length >= 2) {
    const { sets } = findSets(
      planes.map(poleOf),
      parameters.count === null ? undefined : { count: Math.min(parameters.count, planes.length) },
    );
    sets.forEach((set, i) => {
      const here = set.members.filter((m) => m < free.length).map((m) => free[m]);
      const near = set.members.filter((m) => m >= free.length).map((m) => nearby[m - free.length]);
      found.push({
        label: `S${i + 1}`,
        here,
        near,
        mean: planeOfPole(set.mean),
        k: finite(set.k),
        a95: finite(set.alpha95),
      });
    });
  }
  // Overrides join the named set (its mean recomputed with them) or make a set of their own.
  const byLabel = new Map(found.map((s) => [s.label, s]));
  const overrideOnly = new Set<string>();
  for (const j of joints) {
    // No override, or taken out of every set by the geologist (random: in no set, in no mean).
    if (j.override === null || j.override === '') continue;
    const target = byLabel.get(j.override);
    if (target) target.here.push(j);
    else {
      const made = {
        label: j.override,
        here: [j],
        near: [] as NearbyPlane[],
        mean: j.plane,
        k: null,
        a95: null,
      };
      found.push(made);
      byLabel.set(j.override, made);
      overrideOnly.add(j.override);
    }
  }
  // A set seen only on earlier faces is not a set of this round (earlier joints only help to find it).
  const sets: RoundSet[] = found
    .filter((s) => s.here.length > 0)
    .map((s) => {
      const hadOverride = s.here.some((j) => j.override !== null);
      const stats = hadOverride
        ? meanOf([...s.here.map((j) => j.plane), ...s.near.map((n) => n.plane)])
        : null;
      for (const j of s.here) membership[j.id] = s.label;
      const spacings = s.here.map((m) => m.spacingM).filter((v): v is number => v !== null && v > 0);
      const mean = stats?.mean ?? s.mean;
      return {
        label: s.label,
        mean,
        count: s.here.length + s.near.length,
        countHere: s.here.length,
        k: stats ? stats.k : s.k,
        alpha95: stats ? stats.alpha95 : s.a95,
        memberIds: s.here.map((j) => j.id),
        nearbyMemberIds: s.near.map((n) => n.id),
        meanSpacingM: spacings.length === 0 ? null : spacings.reduce((a, b) => a + b, 0) / spacings.length,
        orientation: assess(mean, drive),
        byOverride: overrideOnly.has(s.label),
      };
    });
  return {
    parameters,
    sets,
    membership,
    overridden,
    used: planes.length + joints.filter((j) => j.override !== null && j.override !== '').length,
    linkedLeftOut: nearbyAll.length - nearby.length,
  };
}

/** The least favourable orientation assessment among the sets (the one to suggest for RMR89). */
export function worstOrientation(sets: RoundSet[]): { set: RoundSet; result: RmrOrientationResult } | null {
  let worst: { set: RoundSet; result: RmrOrientationResult } | null = null;
  for (const set of sets) {
    if (set.orientation === null) continue;
    if (worst === null || set.orientation.adjustment < worst.result.adjustment)
      worst = { set, result: set.orientation };
  }
  return worst;
}

/** Jv from the mean spacing of each set of the round (geomath jvFromSpacings); null when no set has a spacing. */
export function jvOfSets(sets: RoundSet[]): { jv: number; spacings: number[] } | null {
  const spacings = sets.map((s) => s.meanSpacingM).filter((s): s is number => s !== null);
  if (spacings.length === 0) return null;
  return { jv: jvFromSpacings(spacings), spacings };
}
