import {
  angleBetweenPlanes,
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

/**
 * A set of the heading as its earlier rounds left it (the latest round that had the label): what a new
 * round's sets are matched to, so that S1 stays S1 from round to round.
 */
export interface HeadingSet {
  label: string;
  mean: Plane;
  /** The set's 95 % cone on that round (degrees); null for a set of one joint. */
  alpha95: number | null;
  /** Face chainage of the round the mean comes from. */
  chainage: number;
}

/**
 * Two set means at most this far apart (acute angle between the mean poles, degrees) are the same set of
 * the heading. 20° is geomath's SET_SEPARATION, the angle below which two density maxima are taken as one
 * set, so a mean that moved less than that is still the same set (common practice: sets are told apart by
 * some 20–30° between their means).
 */
export const SET_MATCH_ANGLE = 20;

/** The matching rule in words, stored with each round's sets and shown beside them. */
export const SET_MATCH_RULE =
  `A set of this round keeps the label of the heading's set whose mean is nearest, if the two means are at ` +
  `most ${SET_MATCH_ANGLE}° apart (or within that set's 95 % cone, when the cone is wider); each of the ` +
  `heading's sets names at most one set of the round, nearest pairs first; a set that matches none takes ` +
  `the next free label. A joint outside every set's cone is random.`;

/** What the round's sets were matched to, kept with them (the browser re-runs the same matching). */
export interface SetMatching {
  rule: string;
  maxAngle: number;
  headingSets: HeadingSet[];
}

/**
 * The heading's sets from its earlier rounds' sets, oldest round first: each label's latest mean. A label
 * the geologist renamed or merged (`names`) is read under its new name, the latest mean kept.
 */
export function headingSetsOf(
  rounds: ReadonlyArray<{
    chainage: number;
    sets: ReadonlyArray<{ label: string; mean: Plane; alpha95: number | null }>;
  }>,
  names: SetNames = {},
): HeadingSet[] {
  const latest = new Map<string, HeadingSet>();
  for (const r of rounds)
    for (const s of r.sets) {
      if (!s.label) continue;
      const label = namedLabel(s.label, names);
      latest.set(label, { label, mean: s.mean, alpha95: s.alpha95, chainage: r.chainage });
    }
  return [...latest.values()];
}

/**
 * The geologist's names for the heading's sets: label → the label to use instead. To a new label it is a
 * rename; to another set's label, a merge (the two are one set from then on).
 */
export type SetNames = Record<string, string>;

/** The label a set is known by after the geologist's renames and merges (followed through, no loops). */
export function namedLabel(label: string, names: SetNames): string {
  let out = label;
  const seen = new Set<string>([label]);
  for (;;) {
    const next = Object.prototype.hasOwnProperty.call(names, out) ? names[out]?.trim() : undefined;
    if (!next || seen.has(next)) return out;
    seen.add(next);
    out = next;
  }
}

const labelNumber = (label: string): number => {
  const m = /^S(\d+)$/.exec(label);
  return m ? Number(m[1]) : 0;
};

/**
 * Labels for sets found on a round (largest first), matched to the heading's sets by SET_MATCH_RULE:
 * the nearest pairs first, one-to-one; the rest take S(n+1), S(n+2), … past every label the heading has.
 * Returns each set's label and its angle to the heading set it matched (null: a new set).
 */
export function matchSetLabels(
  found: ReadonlyArray<{
    mean: Plane;
    /** Matched (and labelled) after the others: e.g. no joint on this face. */ later?: boolean;
  }>,
  headingSets: readonly HeadingSet[],
  maxAngle = SET_MATCH_ANGLE,
): Array<{ label: string; angle: number | null }> {
  const pairs: Array<{ f: number; h: number; angle: number; later: number }> = [];
  found.forEach((s, f) =>
    headingSets.forEach((h, hi) => {
      const angle = angleBetweenPlanes(s.mean, h.mean);
      if (angle <= Math.max(maxAngle, h.alpha95 ?? 0))
        pairs.push({ f, h: hi, angle, later: s.later ? 1 : 0 });
    }),
  );
  pairs.sort((a, b) => a.later - b.later || a.angle - b.angle || a.f - b.f || a.h - b.h);
  const out: Array<{ label: string; angle: number | null } | null> = found.map(() => null);
  const used = new Set<number>();
  for (const p of pairs) {
    if (out[p.f] !== null || used.has(p.h)) continue;
    out[p.f] = { label: headingSets[p.h].label, angle: p.angle };
    used.add(p.h);
  }
  let next = Math.max(0, ...headingSets.map((h) => labelNumber(h.label)));
  const taken = new Set(headingSets.map((h) => h.label));
  const order = found
    .map((_, i) => i)
    .sort((a, b) => Number(!!found[a].later) - Number(!!found[b].later) || a - b);
  for (const i of order) {
    if (out[i] !== null) continue;
    let label: string;
    do label = `S${++next}`;
    while (taken.has(label));
    taken.add(label);
    out[i] = { label, angle: null };
  }
  return out as Array<{ label: string; angle: number | null }>;
}

export interface RoundSet {
  label: string;
  /** Angle to the heading's set whose label it kept (degrees); null: a new set, or none to match. */
  matchedAngle?: number | null;
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
  /** What the labels were matched to (absent in assessments made before sets were matched). */
  matching?: SetMatching;
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
 * `findSets` on the poles; the round's sets are those with at least one joint on this face. Labels follow
 * the heading (SET_MATCH_RULE): a set keeps the label of the heading's set it matches, and a new set takes
 * the next free label (with no heading sets, S1, S2, … by size, largest first). The geologist's names for
 * the heading's sets (`names`) rename or merge them. A geologist's override moves a joint into the named
 * set (or makes a set of that name); the set's mean then includes it. An override with no label ('') takes
 * the joint out of every set: it is random and in no set's mean. A joint outside every set's cone is random.
 * A feature linked across rounds ("same feature as") counts once (see onePerFeature).
 */
export function findRoundSets(
  joints: SetJoint[],
  nearbyAll: NearbyPlane[],
  drive: Drive | null,
  parameters: SetParameters = DEFAULT_SET_PARAMETERS,
  heading: { sets?: HeadingSet[]; names?: SetNames } = {},
): RoundSets {
  const names = heading.names ?? {};
  const headingSets = heading.sets ?? [];
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
  type Found = {
    label: string;
    here: SetJoint[];
    near: NearbyPlane[];
    mean: Plane;
    k: number | null;
    a95: number | null;
    angle: number | null;
    /** Two computed sets the geologist merged: the mean is worked out again from all members. */
    merged?: boolean;
  };
  const found: Found[] = [];
  if (planes.length >= 2) {
    const { sets } = findSets(
      planes.map(poleOf),
      parameters.count === null ? undefined : { count: Math.min(parameters.count, planes.length) },
    );
    // Sets with no joint on this face are matched last: they only help to find the round's sets.
    const labels = matchSetLabels(
      sets.map((set) => ({
        mean: planeOfPole(set.mean),
        later: !set.members.some((m) => m < free.length),
      })),
      headingSets,
    );
    sets.forEach((set, i) => {
      const here = set.members.filter((m) => m < free.length).map((m) => free[m]);
      const near = set.members.filter((m) => m >= free.length).map((m) => nearby[m - free.length]);
      const label = namedLabel(labels[i].label, names);
      const same = found.find((f) => f.label === label);
      if (same) {
        // Merged by the geologist: one set of both sets' joints.
        same.here.push(...here);
        same.near.push(...near);
        same.merged = true;
        return;
      }
      found.push({
        label,
        here,
        near,
        mean: planeOfPole(set.mean),
        k: finite(set.k),
        a95: finite(set.alpha95),
        angle: labels[i].angle,
      });
    });
  }
  // Overrides join the named set (its mean recomputed with them) or make a set of their own.
  const byLabel = new Map(found.map((s) => [s.label, s]));
  const overrideOnly = new Set<string>();
  for (const j of joints) {
    // No override, or taken out of every set by the geologist (random: in no set, in no mean).
    if (j.override === null || j.override === '') continue;
    const label = namedLabel(j.override, names);
    const target = byLabel.get(label);
    if (target) target.here.push(j);
    else {
      const made: Found = {
        label,
        here: [j],
        near: [],
        mean: j.plane,
        k: null,
        a95: null,
        angle: null,
      };
      found.push(made);
      byLabel.set(label, made);
      overrideOnly.add(label);
    }
  }
  // A set seen only on earlier faces is not a set of this round (earlier joints only help to find it).
  const sets: RoundSet[] = found
    .filter((s) => s.here.length > 0)
    .map((s) => {
      const hadOverride = s.merged === true || s.here.some((j) => j.override !== null);
      const stats = hadOverride
        ? meanOf([...s.here.map((j) => j.plane), ...s.near.map((n) => n.plane)])
        : null;
      for (const j of s.here) membership[j.id] = s.label;
      const spacings = s.here.map((m) => m.spacingM).filter((v): v is number => v !== null && v > 0);
      const mean = stats?.mean ?? s.mean;
      return {
        label: s.label,
        matchedAngle: s.angle === null ? null : Math.round(s.angle * 10) / 10,
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
    matching: { rule: SET_MATCH_RULE, maxAngle: SET_MATCH_ANGLE, headingSets },
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
