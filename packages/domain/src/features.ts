// A persistent feature (a fault, a shear zone, a named joint) mapped on several faces is one feature. Each
// later observation is linked to the first one ("same feature as"); the link always names the first
// observation (the API resolves a pick of a later one to its first), so the key of a feature is that id.
import { angleBetweenPlanes } from '@roundbook/geomath';
import type { Plane } from '@roundbook/geomath';

/** One observation of a discontinuity, possibly linked to an earlier observation of the same feature. */
export interface FeatureObservation {
  id: string;
  /** The first observation of the same feature on an earlier round; null/absent: its own feature. */
  sameAsJointId?: string | null;
}

/** The key that names a feature across rounds: the id of its first observation. */
export const featureKeyOf = (o: FeatureObservation): string => o.sameAsJointId ?? o.id;

/**
 * One observation per feature: of the observations of a linked feature the latest is kept (`newer(a, b)`
 * > 0 when a is later than b; ties keep the first in the list), unlinked observations are all kept, in
 * their order.
 *
 * Why the latest and not a mean orientation (common practice): a persistent feature is best known where it
 * was seen last — nearest the coming rounds, usually with more of it exposed — and its trace on that face
 * belongs with that orientation (the look-ahead projects the two together); a mean of two or three faces
 * would blur a curving fault and pair an orientation with a trace it was not measured on. The feature is
 * then counted once in set finding, densities and Terzaghi weights.
 */
export function onePerFeature<T extends FeatureObservation>(
  items: readonly T[],
  newer: (a: T, b: T) => number = () => 0,
): T[] {
  const best = new Map<string, T>();
  for (const item of items) {
    const key = featureKeyOf(item);
    const held = best.get(key);
    if (held === undefined || newer(item, held) > 0) best.set(key, item);
  }
  const kept = new Set(best.values());
  return items.filter((i) => kept.has(i));
}

/** How many observations were folded into others by `onePerFeature` (for the words under a plot). */
export const foldedCount = (items: readonly FeatureObservation[]): number =>
  items.length - new Set(items.map(featureKeyOf)).size;

/** An earlier observation the geologist may link a joint to. */
export interface FeatureCandidate {
  id: string;
  sameAsJointId?: string | null;
  roundId: string;
  roundNumber: number;
  faceChainage: number;
  kind: string;
  dipDirection: number;
  dip: number;
  /** The geologist's notes on it (a named feature is named there) */
  notes?: string;
}

export interface CandidateOptions {
  /** The joint's orientation as read (null: offer by chainage only). */
  plane: Plane | null;
  /** This round's face chainage, m */
  faceChainage: number;
  /** The round itself, never offered. */
  roundId: string;
  /** Largest angle between the planes (their poles), degrees; common practice: 20°. */
  toleranceDeg?: number;
  /** Largest distance along the heading between the faces, m; common practice: 30 m (a few rounds). */
  withinM?: number;
}

export const SAME_FEATURE_TOLERANCE_DEG = 20;
export const SAME_FEATURE_WITHIN_M = 30;

export interface OfferedFeature {
  candidate: FeatureCandidate;
  /** Angle between the two planes, degrees (null when the joint's orientation is not read) */
  angle: number | null;
  /** Distance between the faces, m */
  distance: number;
}

/**
 * The earlier observations offered for "same feature as": other rounds of the heading within `withinM` of
 * the face and within `toleranceDeg` of the joint's orientation (common practice: a persistent feature keeps
 * its orientation to about the scatter of a set from face to face), one per feature (its latest
 * observation), closest in orientation first, then nearest.
 */
export function sameFeatureCandidates(
  candidates: readonly FeatureCandidate[],
  o: CandidateOptions,
): OfferedFeature[] {
  const tolerance = o.toleranceDeg ?? SAME_FEATURE_TOLERANCE_DEG;
  const within = o.withinM ?? SAME_FEATURE_WITHIN_M;
  const offered: OfferedFeature[] = [];
  const latest = onePerFeature(
    candidates.filter((c) => c.roundId !== o.roundId),
    (a, b) => a.roundNumber - b.roundNumber,
  );
  for (const c of latest) {
    const distance = Math.abs(c.faceChainage - o.faceChainage);
    if (distance > within + 1e-9) continue;
    const angle = o.plane === null ? null : angleBetweenPlanes(o.plane, c);
    if (angle !== null && angle > tolerance + 1e-9) continue;
    offered.push({ candidate: c, angle, distance });
  }
  return offered.sort((a, b) => (a.angle ?? 0) - (b.angle ?? 0) || a.distance - b.distance);
}
