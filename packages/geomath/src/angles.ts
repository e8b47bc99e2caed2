// Intersections, angles and apparent dips (methods.md §1.3–§1.5).
import { EPSILON, RAD, cosDeg, sinDeg } from './math.js';
import { OrientationError } from './types.js';
import type { Line, Plane, Vector3 } from './types.js';
import { cross, dot, norm, vectorToLine } from './vector.js';

/**
 * Lower-hemisphere line of an axis, with one more rule for horizontal axes: the trend is taken in
 * [0, 180) so that v and −v give the same line.
 */
export function axisToLine(v: Vector3): Line {
  const line = vectorToLine(v);
  if (line.plunge === 0 && line.trend >= 180) return { trend: line.trend - 180, plunge: 0 };
  return line;
}

/** Unit normal of a plane with exact components at dip and dip direction multiples of 90°. */
export function exactNormal(plane: Plane): Vector3 {
  const sd = sinDeg(plane.dip);
  return [-sd * cosDeg(plane.dipDirection), -sd * sinDeg(plane.dipDirection), cosDeg(plane.dip)];
}

/** Unit vector of a line with exact components at multiples of 90°. */
export function exactVector(line: Line): Vector3 {
  const cp = cosDeg(line.plunge);
  return [cp * cosDeg(line.trend), cp * sinDeg(line.trend), sinDeg(line.plunge)];
}

/**
 * Line of intersection of two planes: n1 × n2, flipped into the lower hemisphere (methods.md §1.3).
 * Returns null when the planes are parallel to within |n1 × n2| < 1e-9 (about 2e-7°). A horizontal
 * intersection is reported with trend in [0, 180).
 */
export function intersectionOf(a: Plane, b: Plane): Line | null {
  const l = cross(exactNormal(a), exactNormal(b));
  if (norm(l) < EPSILON) return null;
  return axisToLine(l);
}

/** Acute angle between two undirected unit vectors, atan2(|u × v|, |u · v|), in degrees [0, 90]. */
function acuteAngle(u: Vector3, v: Vector3): number {
  return Math.atan2(norm(cross(u, v)), Math.abs(dot(u, v))) * RAD;
}

/** Acute angle between two lines, 0–90° (the obtuse one is 180 minus it). */
export function angleBetweenLines(a: Line, b: Line): number {
  return acuteAngle(exactVector(a), exactVector(b));
}

/** Acute dihedral angle between two planes = acute angle between their poles, 0–90°. */
export function angleBetweenPlanes(a: Plane, b: Plane): number {
  return acuteAngle(exactNormal(a), exactNormal(b));
}

/**
 * Apparent dip of a plane in a vertical section of the given azimuth: tan α = tan δ·|cos β|, β the angle
 * between the dip direction and the azimuth (methods.md §1.5). Either direction of the section gives the
 * same value (≥ 0). Along the strike it is 0, except for a vertical plane, which then contains every line
 * of that trend and 90 (the steepest of them) is returned.
 */
export function apparentDip(plane: Plane, azimuth: number): number {
  const cb = Math.abs(cosDeg(azimuth - plane.dipDirection));
  const sd = sinDeg(plane.dip);
  const cd = cosDeg(plane.dip);
  if (cd === 0) return 90;
  return Math.atan2(sd * cb, cd) * RAD;
}

/**
 * Plane containing two apparent-dip lines (traces measured on two differently oriented faces): its pole is
 * l1 × l2 (methods.md §1.5). Throws when the two lines coincide.
 */
export function planeFromApparentDips(a: Line, b: Line): Plane {
  const n = cross(exactVector(a), exactVector(b));
  if (norm(n) < EPSILON) {
    throw new OrientationError(
      `The traces ${a.trend}/${a.plunge} and ${b.trend}/${b.plunge} are the same line, so they do not define a plane: ` +
        'give two traces measured in sections of different trend.',
    );
  }
  const pole = vectorToLine(n);
  return { dipDirection: (pole.trend + 180) % 360, dip: 90 - pole.plunge };
}
