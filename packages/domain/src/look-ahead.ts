// The heading's look-ahead for a handover: which mapped faults and shear zones reach the crown or the invert
// ahead of today's face, how far ahead, and in which of the coming rounds (methods.md §6: crossings with
// s > s0 lie ahead of the face; flag the round in which the plane reaches the crown).
import type { FeatureReach } from './triggers.js';

/** One handed-in round's frozen look-ahead: the round, its face, and its features' crossings (chainages). */
export interface LookAheadSource {
  roundNumber: number;
  faceChainage: number;
  reaches: Array<Pick<FeatureReach, 'label' | 'chainage' | 'traceKnown'> & { featureKey?: string | null }>;
}

export interface LookAheadOptions {
  /** Today's face: the last round handed in, m */
  faceChainage: number;
  /** +1: chainage increases in the drive direction; −1: the heading is driven against the chainage */
  chainageSense: 1 | -1;
  /** The length of the coming rounds (the last confirmed round's next round, else the heading's planned), m */
  roundLength: number | null;
}

/** A feature whose crown or invert crossing lies ahead of today's face. */
export interface LookAheadItem {
  label: string;
  /** The round whose face map gave this feature */
  roundNumber: number;
  crownChainage: number | null;
  invertChainage: number | null;
  /** Along the drive from today's face, m (negative: already passed); null where it runs along the tunnel */
  crownAhead: number | null;
  invertAhead: number | null;
  /** The nearer of the crossings still ahead, m (> 0) */
  nearestAhead: number;
  /** Where it is first met: 'crown' or 'invert' */
  firstAt: 'crown' | 'invert';
  /** 1: met in the next round, 2: the one after, …; null without a round length */
  roundsAhead: number | null;
  /** Whether the trace position on the face was recorded (else the face centre was used) */
  traceKnown: boolean;
}

/** Distances below this count as at the face, not ahead of it (common practice: to the millimetre). */
const AT_FACE_M = 0.001;

/**
 * From the frozen assessments of a heading's latest handed-in rounds, newest first: each feature whose crown
 * or invert crossing lies ahead of today's face, nearest first. Distances follow the heading's chainage
 * sense (driven against the chainage, the chainages ahead decrease). The round it is met in is
 * ⌈distance / round length⌉ (a crossing exactly at a round's end belongs to that round). A feature linked
 * across rounds ("same feature as", featureKey) is listed once, from its latest observation (the first of
 * the newest-first sources that has it): the newest face's orientation and trace are the nearest to the
 * coming rounds (features.ts onePerFeature says why the latest, not a mean).
 */
export function headingLookAhead(sources: LookAheadSource[], o: LookAheadOptions): LookAheadItem[] {
  const along = (ch: number | null): number | null =>
    ch === null ? null : Number((o.chainageSense * (ch - o.faceChainage)).toFixed(3));
  const out: LookAheadItem[] = [];
  const seen = new Set<string>();
  for (const s of sources) {
    for (const r of s.reaches) {
      if (r.featureKey) {
        if (seen.has(r.featureKey)) continue;
        seen.add(r.featureKey);
      }
      const crownAhead = along(r.chainage.crown);
      const invertAhead = along(r.chainage.invert);
      const ahead = [
        ['crown', crownAhead],
        ['invert', invertAhead],
      ].filter((x): x is ['crown' | 'invert', number] => x[1] !== null && (x[1] as number) > AT_FACE_M);
      if (ahead.length === 0) continue;
      const [firstAt, nearestAhead] = ahead.reduce((a, b) => (b[1] < a[1] ? b : a));
      out.push({
        label: r.label,
        roundNumber: s.roundNumber,
        crownChainage: r.chainage.crown,
        invertChainage: r.chainage.invert,
        crownAhead,
        invertAhead,
        nearestAhead,
        firstAt,
        roundsAhead:
          o.roundLength !== null && o.roundLength > 0
            ? Math.max(1, Math.ceil(nearestAhead / o.roundLength - 1e-9))
            : null,
        traceKnown: r.traceKnown,
      });
    }
  }
  return out.sort((a, b) => a.nearestAhead - b.nearestAhead || b.roundNumber - a.roundNumber);
}

/** "in the next round", "in round 3 from now" */
export function roundsAheadLabel(roundsAhead: number | null): string {
  if (roundsAhead === null) return 'round length not known';
  return roundsAhead === 1 ? 'in the next round' : `in round ${roundsAhead} from now`;
}
