// A heading's plan alignment: straights and circular arcs from the heading's start in the direction of
// advance, and its chainage sense (chainage increases or decreases in the drive direction). Plane geometry
// in metres, east/north grid; bearings clockwise from north [common practice of route surveying].
import { gradientPercentToDegrees } from './alignment.js';
import { normalizeAzimuth } from './math.js';
import type { Drive } from './types.js';
import { OrientationError } from './types.js';

/** How chainage runs in the drive direction. */
export type ChainageSense = 'increasing' | 'decreasing';

export const CHAINAGE_SENSES: readonly ChainageSense[] = ['increasing', 'decreasing'];

/** +1 when chainage increases in the drive direction, −1 when it decreases. */
export function chainageSign(sense: ChainageSense = 'increasing'): 1 | -1 {
  if (sense === 'increasing') return 1;
  if (sense === 'decreasing') return -1;
  throw new OrientationError(
    `Chainage sense "${String(sense)}" is not known: expected increasing or decreasing.`,
  );
}

/**
 * The chainage d metres ahead of the face (d < 0: behind it), following the chainage sense: face + d when
 * chainage increases in the drive direction, face − d when it decreases.
 */
export function chainageAhead(
  faceChainage: number,
  distance: number,
  sense: ChainageSense = 'increasing',
): number {
  if (!Number.isFinite(faceChainage) || !Number.isFinite(distance)) {
    throw new RangeError('The face chainage and the distance must be finite numbers of metres.');
  }
  return faceChainage + chainageSign(sense) * distance;
}

/**
 * Distance ahead of the face (in the drive direction) of a chainage: positive ahead, negative behind.
 */
export function distanceAheadOf(
  faceChainage: number,
  chainage: number,
  sense: ChainageSense = 'increasing',
): number {
  return chainageSign(sense) * (chainage - faceChainage);
}

/** One segment of the alignment, in the order the heading advances. */
export interface AlignmentSegment {
  /** Length along the alignment, metres (> 0). Only a final straight may be Infinity (open-ended). */
  length: number;
  /** Radius of a circular arc, metres (> 0); omitted for a straight. */
  radius?: number;
  /** Side of the arc's centre, looking in the drive direction; required with a radius. */
  turn?: 'left' | 'right';
}

/**
 * A heading's alignment from its start, in the direction of advance. The start is where the heading
 * begins (its start chainage and coordinates) and `startBearing` the drive direction there.
 */
export interface HeadingAlignment {
  startChainage: number;
  start: { east: number; north: number };
  /** Drive direction at the start, degrees clockwise from north. */
  startBearing: number;
  segments: readonly AlignmentSegment[];
  /** Default 'increasing'. */
  chainageSense?: ChainageSense;
  /** Gradient in per cent, positive rising in the drive direction (as on the heading); default 0. */
  gradientPercent?: number;
}

/** A point of the alignment at a chainage. */
export interface AlignmentPoint {
  chainage: number;
  /** Distance from the heading's start along the alignment, metres (≥ 0). */
  distance: number;
  east: number;
  north: number;
  /** Tangent bearing in the drive direction, degrees clockwise from north, [0, 360). */
  bearing: number;
  /** Index of the segment that holds the point. */
  segment: number;
}

const DEG = Math.PI / 180;
/** Chainages this close (m) outside the alignment are taken as its ends (rounding of stored values). */
const END_TOLERANCE = 1e-6;

function checkAlignment(alignment: HeadingAlignment): void {
  const { startChainage, start, startBearing, segments } = alignment;
  if (![startChainage, start.east, start.north, startBearing].every(Number.isFinite)) {
    throw new OrientationError(
      'An alignment needs a finite start chainage, start coordinates and start bearing.',
    );
  }
  chainageSign(alignment.chainageSense);
  if (alignment.gradientPercent !== undefined && !Number.isFinite(alignment.gradientPercent)) {
    throw new OrientationError('The gradient must be a finite number of per cent.');
  }
  if (segments.length === 0) throw new OrientationError('An alignment needs at least one segment.');
  segments.forEach((s, i) => {
    const where = `Segment ${i + 1}`;
    const last = i === segments.length - 1;
    const straight = s.radius === undefined;
    if (!(s.length > 0) || (s.length === Infinity && !(last && straight)) || Number.isNaN(s.length)) {
      throw new OrientationError(
        `${where}: the length must be more than 0 m (only a final straight may be open-ended).`,
      );
    }
    if (!straight) {
      if (!(s.radius !== undefined && s.radius > 0 && Number.isFinite(s.radius))) {
        throw new OrientationError(`${where}: an arc needs a radius of more than 0 m.`);
      }
      if (s.turn !== 'left' && s.turn !== 'right') {
        throw new OrientationError(
          `${where}: an arc needs its side, left or right (looking in the drive direction).`,
        );
      }
    } else if (s.turn !== undefined) {
      throw new OrientationError(`${where}: a straight has no side; give a radius for an arc.`);
    }
  });
}

/** Total length of the alignment, metres (Infinity when the last straight is open-ended). */
export function alignmentLength(alignment: HeadingAlignment): number {
  checkAlignment(alignment);
  return alignment.segments.reduce((sum, s) => sum + s.length, 0);
}

/** Moves along one segment by s metres from (east, north, bearing). */
function advance(
  east: number,
  north: number,
  bearing: number,
  segment: AlignmentSegment,
  s: number,
): { east: number; north: number; bearing: number } {
  if (segment.radius === undefined) {
    const b = bearing * DEG;
    return { east: east + s * Math.sin(b), north: north + s * Math.cos(b), bearing };
  }
  // Arc: the bearing turns by s/R (clockwise for a right turn); the chord 2R·sin(s/2R) points along the
  // bearing turned by half of that.
  const sign = segment.turn === 'right' ? 1 : -1;
  const angle = s / segment.radius;
  const chord = 2 * segment.radius * Math.sin(angle / 2);
  const mid = bearing * DEG + (sign * angle) / 2;
  return {
    east: east + chord * Math.sin(mid),
    north: north + chord * Math.cos(mid),
    bearing: bearing + (sign * angle) / DEG,
  };
}

/**
 * The point of the alignment at a chainage: plan position (east, north) and the tangent bearing in the
 * drive direction. The chainage must lie on the alignment (from the start chainage, in the chainage
 * sense, up to its length); RangeError otherwise.
 */
export function alignmentPointAt(alignment: HeadingAlignment, chainage: number): AlignmentPoint {
  checkAlignment(alignment);
  if (!Number.isFinite(chainage)) throw new RangeError('The chainage must be a finite number of metres.');
  const sign = chainageSign(alignment.chainageSense);
  let distance = sign * (chainage - alignment.startChainage);
  const total = alignment.segments.reduce((sum, s) => sum + s.length, 0);
  if (distance < -END_TOLERANCE || distance > total + END_TOLERANCE) {
    const end = alignment.startChainage + sign * total;
    throw new RangeError(
      `Chainage ${chainage} is not on the alignment, which runs from ${alignment.startChainage} to ${end} m.`,
    );
  }
  distance = Math.min(Math.max(distance, 0), total);
  let east = alignment.start.east;
  let north = alignment.start.north;
  let bearing = alignment.startBearing;
  let along = 0;
  const segments = alignment.segments;
  for (let i = 0; i < segments.length; i++) {
    const segment = segments[i];
    if (distance <= along + segment.length || i === segments.length - 1) {
      const p = advance(east, north, bearing, segment, distance - along);
      return {
        chainage,
        distance,
        east: p.east,
        north: p.north,
        bearing: normalizeAzimuth(p.bearing),
        segment: i,
      };
    }
    ({ east, north, bearing } = advance(east, north, bearing, segment, segment.length));
    along += segment.length;
  }
  throw new RangeError('unreachable');
}

/** Plan position (east, north) of the axis at a chainage. */
export function positionAt(alignment: HeadingAlignment, chainage: number): { east: number; north: number } {
  const p = alignmentPointAt(alignment, chainage);
  return { east: p.east, north: p.north };
}

/** Drive bearing (tangent in the direction of advance) at a chainage, degrees from north. */
export function driveBearingAt(alignment: HeadingAlignment, chainage: number): number {
  return alignmentPointAt(alignment, chainage).bearing;
}

/**
 * The drive at a chainage: the tangent bearing there and the plunge from the gradient (plunge > 0
 * descending, as the contract's Drive; gradient positive rising in the drive direction).
 */
export function driveAt(alignment: HeadingAlignment, chainage: number): Drive {
  const trend = driveBearingAt(alignment, chainage);
  const plunge = -gradientPercentToDegrees(alignment.gradientPercent ?? 0);
  return { trend, plunge: plunge === 0 ? 0 : plunge };
}

/**
 * A straight alignment from a heading's stored fields (start chainage, start coordinates or 0/0, drive
 * trend, gradient), open-ended, with the given chainage sense.
 */
export function straightAlignment(heading: {
  startChainage: number;
  driveTrend: number;
  gradientPercent?: number;
  startEasting?: number | null;
  startNorthing?: number | null;
  chainageSense?: ChainageSense;
}): HeadingAlignment {
  return {
    startChainage: heading.startChainage,
    start: { east: heading.startEasting ?? 0, north: heading.startNorthing ?? 0 },
    startBearing: heading.driveTrend,
    segments: [{ length: Infinity }],
    chainageSense: heading.chainageSense ?? 'increasing',
    gradientPercent: heading.gradientPercent ?? 0,
  };
}
