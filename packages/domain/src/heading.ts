// A heading's alignment as the round sees it: the chainage sense (chainage increases or decreases in the
// drive direction), straights and circular arcs from the start, and the stage's own part of the profile.
// The geometry is geomath's (heading-alignment.ts, profile.ts); this file reads a heading record into it.
import {
  alignmentPointAt,
  chainageSign,
  stagePart,
  type AlignmentSegment,
  type HeadingAlignment,
} from '@roundbook/geomath';
import type { HeadingGeometry } from './triggers.js';
import type { Stage } from './vocabulary.js';

export const CHAINAGE_SENSE_CODES = ['increasing', 'decreasing'] as const;
export type ChainageSenseCode = (typeof CHAINAGE_SENSE_CODES)[number];
export const chainageSenseLabels: Record<ChainageSenseCode, string> = {
  increasing: 'Chainage increases in the drive direction',
  decreasing: 'Chainage decreases in the drive direction (driven against the chainage)',
};
export const ALIGNMENT_SIDES = ['left', 'right'] as const;
export type AlignmentSide = (typeof ALIGNMENT_SIDES)[number];

/** One segment as a heading stores it: a straight (radius null) or a circular arc turning left or right. */
export interface AlignmentSegmentRecord {
  length: number;
  radius: number | null;
  side: AlignmentSide | null;
}

/** The alignment fields of a heading record (entity, DTO or form values). */
export interface HeadingAlignmentRecord {
  startChainage: number;
  driveTrend: number;
  gradientPercent: number;
  startEasting?: number | null;
  startNorthing?: number | null;
  chainageSense?: ChainageSenseCode | null;
  /** Drive bearing at the start when it differs from the drive trend (a curve starts there); null: the drive trend. */
  initialBearing?: number | null;
  alignmentSegments?: AlignmentSegmentRecord[] | null;
}

/** +1 when chainage increases in the drive direction, −1 when it decreases. */
export const senseSign = (sense: ChainageSenseCode | null | undefined): 1 | -1 =>
  chainageSign(sense ?? 'increasing');

/**
 * The geomath alignment of a heading: its segments, then straight on without end (a face beyond the last
 * segment is on the tangent there: Roundbook convention). No segments: one straight along the drive trend.
 */
export function headingAlignment(h: HeadingAlignmentRecord): HeadingAlignment {
  const segments: AlignmentSegment[] = (h.alignmentSegments ?? []).map((s) =>
    s.radius === null || s.radius === undefined
      ? { length: s.length }
      : { length: s.length, radius: s.radius, turn: s.side ?? 'right' },
  );
  segments.push({ length: Infinity });
  return {
    startChainage: h.startChainage,
    start: { east: h.startEasting ?? 0, north: h.startNorthing ?? 0 },
    startBearing: h.initialBearing ?? h.driveTrend,
    segments,
    chainageSense: h.chainageSense ?? 'increasing',
    gradientPercent: h.gradientPercent,
  };
}

/**
 * The drive bearing (tangent of the alignment) at a face chainage. A face behind the start (a chainage the
 * heading has not reached by its sense) takes the start bearing.
 */
export function driveTrendAt(h: HeadingAlignmentRecord, chainage: number): number {
  const alignment = headingAlignment(h);
  const distance = senseSign(h.chainageSense) * (chainage - h.startChainage);
  if (!(distance > 0)) return alignment.startBearing;
  return alignmentPointAt(alignment, chainage).bearing;
}

/** Field errors of an alignment (segments with a length, arcs with a radius and a side). */
export function alignmentErrors(
  h: Pick<HeadingAlignmentRecord, 'alignmentSegments'>,
): Record<string, string> {
  const fields: Record<string, string> = {};
  (h.alignmentSegments ?? []).forEach((s, i) => {
    const key = `alignmentSegments.${i}`;
    if (!(s.length > 0) || !Number.isFinite(s.length))
      fields[`${key}.length`] = `Segment ${i + 1}: give its length, more than 0 m.`;
    if (s.radius !== null && s.radius !== undefined) {
      if (!(s.radius > 0) || !Number.isFinite(s.radius))
        fields[`${key}.radius`] = `Segment ${i + 1}: an arc needs a radius of more than 0 m.`;
      if (s.side !== 'left' && s.side !== 'right')
        fields[`${key}.side`] =
          `Segment ${i + 1}: say which side the arc turns to (left or right, looking ahead).`;
    } else if (s.side !== null && s.side !== undefined) {
      fields[`${key}.side`] = `Segment ${i + 1}: a straight has no side; give a radius for an arc.`;
    }
  });
  return fields;
}

/** The length of a round, positive in the drive direction: (face − previous) × sense, to the millimetre. */
export function roundLengthOf(
  faceChainage: number,
  previousChainage: number,
  sense: ChainageSenseCode | null | undefined,
): number {
  return Math.round(senseSign(sense) * (faceChainage - previousChainage) * 1000) / 1000;
}

/** The face chainage one planned round ahead of the previous face, by the sense. */
export function nextFaceChainage(
  previousChainage: number,
  plannedRoundLength: number,
  sense: ChainageSenseCode | null | undefined,
): number {
  return Math.round((previousChainage + senseSign(sense) * plannedRoundLength) * 1000) / 1000;
}

/** True when face a lies further along the drive than face b. */
export const isAheadOf = (a: number, b: number, sense: ChainageSenseCode | null | undefined): boolean =>
  senseSign(sense) * (a - b) > 0;

/** The part of the profile a stage excavates, as heights relative to the axis (geomath stagePart). */
export function stageGeometry(
  h: {
    profileShape: 'circular' | 'horseshoe' | 'd-shaped' | 'rectangular';
    profileWidth: number;
    profileHeight: number;
    axisHeight: number;
    benchHeight?: number | null;
  },
  stage: Stage,
): { crownHeight: number; invertDepth: number; halfWidth: number } | null {
  try {
    const part = stagePart(
      {
        shape: h.profileShape,
        width: h.profileWidth,
        height: h.profileHeight,
        axisHeight: h.axisHeight,
        ...(h.benchHeight !== null && h.benchHeight !== undefined ? { benchLine: h.benchHeight } : {}),
      },
      stage === 'invert' ? 'full-face' : stage,
    );
    return { crownHeight: part.crownHeight, invertDepth: part.invertDepth, halfWidth: part.halfWidth };
  } catch {
    return null;
  }
}

/** A heading record as the assessment reads it: its alignment, its profile and its planned round length. */
export type AssessedHeadingRecord = HeadingAlignmentRecord &
  Parameters<typeof stageGeometry>[0] & { plannedRoundLength: number };

/**
 * What the assessment and the trigger rules read of a heading, for one stage of its profile and, when
 * given, at one face chainage: the drive there is the tangent of the alignment (straights and arcs), the
 * chainage sense says which way chainage runs, and the stage's own part of the profile (top heading above
 * the bench line, bench below it) gives the crown, invert and walls of the crown-reach rule.
 */
export function assessedHeading(
  heading: AssessedHeadingRecord,
  stage: Stage,
  faceChainage?: number,
): HeadingGeometry & { plannedRoundLength: number } {
  let driveTrend = heading.driveTrend;
  if (faceChainage !== undefined) {
    try {
      driveTrend = driveTrendAt(heading, faceChainage);
    } catch {
      driveTrend = heading.initialBearing ?? heading.driveTrend;
    }
  }
  const part = stageGeometry(heading, stage);
  return {
    driveTrend,
    gradientPercent: heading.gradientPercent,
    profileHeight: heading.profileHeight,
    profileWidth: heading.profileWidth,
    axisHeight: heading.axisHeight,
    chainageSense: senseSign(heading.chainageSense),
    ...(part
      ? {
          stageCrownHeight: part.crownHeight,
          stageInvertDepth: part.invertDepth,
          stageHalfWidth: part.halfWidth,
        }
      : {}),
    plannedRoundLength: heading.plannedRoundLength,
  };
}
