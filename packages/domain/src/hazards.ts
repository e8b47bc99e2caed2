// The hazard register of a heading (product.md "Hazard"): its words, its order and the checks of its
// chainage range against the heading. Used by the API on write, the browser in the form and the handover.
import { formatChainageFor, type ChainageStyleOf } from './format.js';
import { senseSign, type ChainageSenseCode } from './heading.js';
import { LEVEL_RANK, type TriggerLevel } from './vocabulary.js';

export const HAZARD_KINDS = [
  'loose-ground',
  'wedge',
  'water',
  'gas',
  'misfire',
  'probe-finding',
  'overbreak',
  'other',
] as const;
export type HazardKind = (typeof HAZARD_KINDS)[number];
export const hazardKindLabels: Record<HazardKind, string> = {
  'loose-ground': 'Loose ground',
  wedge: 'Wedge',
  water: 'Water',
  gas: 'Gas',
  misfire: 'Misfire',
  'probe-finding': 'Probe finding',
  overbreak: 'Overbreak',
  other: 'Other',
};

export const HAZARD_STATUSES = ['open', 'closed'] as const;
export type HazardStatus = (typeof HAZARD_STATUSES)[number];
export const hazardStatusLabels: Record<HazardStatus, string> = { open: 'Open', closed: 'Closed' };

/** Where a hazard was raised: on a round, on a handover, or directly on the heading's register. */
export const HAZARD_ORIGINS = ['round', 'handover', 'direct'] as const;
export type HazardOrigin = (typeof HAZARD_ORIGINS)[number];
export const hazardOriginLabels: Record<HazardOrigin, string> = {
  round: 'Raised on a round',
  handover: 'Raised on a handover',
  direct: 'Raised on the register',
};

/** The roles that may close a hazard (product.md: engineers close hazards; supervisors hand them over). */
export const HAZARD_CLOSING_ROLES = ['engineer', 'supervisor', 'admin'] as const;

/**
 * How far ahead of the furthest mapped face a hazard may start: probe holes and look-ahead findings are
 * recorded ahead of the face, rarely beyond a few tens of metres [common practice; a generous limit that
 * catches a mistyped chainage, e.g. a missing or extra digit].
 */
export const HAZARD_AHEAD_LIMIT_M = 100;

/** What the trigger rules and the handover read of an open hazard. */
export interface HazardFact {
  id: string;
  kind: HazardKind;
  level: TriggerLevel;
  /** The range's start-side end and far end, by the heading's chainage sense (m). */
  fromChainage: number;
  toChainage: number;
  description: string;
}

/** A hazard's range in the heading's chainage style: "1+003.0 – 1+006.0", or one chainage for a place. */
export function formatHazardRange(
  h: Pick<HazardFact, 'fromChainage' | 'toChainage'>,
  heading: ChainageStyleOf,
): string {
  const from = formatChainageFor(h.fromChainage, heading);
  return h.fromChainage === h.toChainage ? from : `${from} – ${formatChainageFor(h.toChainage, heading)}`;
}

/** The range as given, put in the drive's order: from is the end nearer the heading's start. */
export function orderedRange(
  from: number,
  to: number,
  sense: ChainageSenseCode | null | undefined,
): { fromChainage: number; toChainage: number } {
  const s = senseSign(sense);
  return s * (to - from) >= 0
    ? { fromChainage: from, toChainage: to }
    : { fromChainage: to, toChainage: from };
}

export interface HazardHeadingBounds extends Partial<ChainageStyleOf> {
  code?: string;
  startChainage: number;
  chainageSense?: ChainageSenseCode | null;
}

/**
 * Field errors of a hazard's chainage range against its heading: both ends on the driven side of the start
 * chainage, and not more than HAZARD_AHEAD_LIMIT_M ahead of the furthest face (the start when no round yet).
 */
export function hazardRangeErrors(
  range: { fromChainage: number; toChainage: number },
  heading: HazardHeadingBounds,
  furthestFace: number | null,
): Record<string, string> {
  const fields: Record<string, string> = {};
  const s = senseSign(heading.chainageSense);
  const name = heading.code ? `heading ${heading.code}` : 'the heading';
  const face = furthestFace ?? heading.startChainage;
  const ch = (m: number): string =>
    heading.chainageStyle
      ? formatChainageFor(m, {
          chainageStyle: heading.chainageStyle,
          chainageDecimals: heading.chainageDecimals,
        })
      : `${m} m`;
  for (const key of ['fromChainage', 'toChainage'] as const) {
    const c = range[key];
    if (!Number.isFinite(c)) {
      fields[key] = 'Give the chainage in metres.';
      continue;
    }
    if (s * (c - heading.startChainage) < -1e-9)
      fields[key] =
        `Chainage ${ch(c)} is behind the start of ${name} (${ch(heading.startChainage)}): a hazard lies in the driven heading or ahead of its face.`;
    else if (s * (c - face) > HAZARD_AHEAD_LIMIT_M + 1e-9)
      fields[key] =
        `Chainage ${ch(c)} is more than ${HAZARD_AHEAD_LIMIT_M} m ahead of the face of ${name} (${ch(face)}): check the figure.`;
  }
  return fields;
}

/** Where a hazard's range lies from a face: reaching it, behind it or ahead of it, in metres along the drive. */
export function hazardPlaceFromFace(
  h: Pick<HazardFact, 'fromChainage' | 'toChainage'>,
  faceChainage: number,
  sense: ChainageSenseCode | null | undefined = 'increasing',
): { where: 'at-face' | 'behind' | 'ahead'; distance: number } {
  const s = senseSign(sense);
  const near = s * (h.fromChainage - faceChainage);
  const far = s * (h.toChainage - faceChainage);
  const lo = Math.min(near, far);
  const hi = Math.max(near, far);
  if (lo <= 1e-9 && hi >= -1e-9) return { where: 'at-face', distance: 0 };
  return hi < 0 ? { where: 'behind', distance: -hi } : { where: 'ahead', distance: lo };
}

/** Open hazards as they are listed: red first, then amber, then green; along each level by chainage. */
export function compareHazards(
  a: Pick<HazardFact, 'level' | 'fromChainage' | 'toChainage'>,
  b: Pick<HazardFact, 'level' | 'fromChainage' | 'toChainage'>,
  sense: ChainageSenseCode | null | undefined = 'increasing',
): number {
  const byLevel = LEVEL_RANK[b.level] - LEVEL_RANK[a.level];
  if (byLevel !== 0) return byLevel;
  const s = senseSign(sense);
  return s * (a.fromChainage - b.fromChainage) || s * (a.toChainage - b.toChainage);
}
