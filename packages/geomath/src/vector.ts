import { EPSILON, asinSafe, normalizeAzimuth, toDegrees, toRadians } from './math.js';
import type { Line, Plane, Vector3 } from './types.js';

/** Vector algebra in the north-east-down frame (x = north, y = east, z = down). */
export const dot = (a: Vector3, b: Vector3): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];

export const cross = (a: Vector3, b: Vector3): Vector3 => [
  a[1] * b[2] - a[2] * b[1],
  a[2] * b[0] - a[0] * b[2],
  a[0] * b[1] - a[1] * b[0],
];

export const norm = (a: Vector3): number => Math.hypot(a[0], a[1], a[2]);

export const scale = (a: Vector3, k: number): Vector3 => [a[0] * k, a[1] * k, a[2] * k];

export const add = (a: Vector3, b: Vector3): Vector3 => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];

export const sub = (a: Vector3, b: Vector3): Vector3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];

export function normalize(a: Vector3): Vector3 {
  const n = norm(a);
  if (n < EPSILON) throw new RangeError('Cannot normalise a zero vector');
  return [a[0] / n, a[1] / n, a[2] / n];
}

/** Unit vector of a line: (cos p cos t, cos p sin t, sin p). Plunge may be negative (upward). */
export function lineToVector(line: Line): Vector3 {
  const t = toRadians(line.trend);
  const p = toRadians(line.plunge);
  const c = Math.cos(p);
  return [c * Math.cos(t), c * Math.sin(t), Math.sin(p)];
}

/**
 * Line of a vector, flipped into the lower hemisphere (plunge >= 0). A horizontal vector keeps its own
 * trend. The zero vector throws a RangeError.
 */
export function vectorToLine(v: Vector3): Line {
  let [n, e, d] = normalize(v);
  if (d < 0) {
    n = -n;
    e = -e;
    d = -d;
  }
  if (Math.abs(d) < 1e-12) d = 0;
  const plunge = toDegrees(asinSafe(d));
  const trend = Math.hypot(n, e) < 1e-12 ? 0 : normalizeAzimuth(toDegrees(Math.atan2(e, n)));
  return { trend, plunge };
}

/** Lower-hemisphere normal (pole) of a plane: (−sin δ cos α, −sin δ sin α, cos δ). */
export function planeNormal(plane: Plane): Vector3 {
  const a = toRadians(plane.dipDirection);
  const d = toRadians(plane.dip);
  return [-Math.sin(d) * Math.cos(a), -Math.sin(d) * Math.sin(a), Math.cos(d)];
}

/** Dip vector (line of steepest descent) of a plane. */
export function dipVector(plane: Plane): Vector3 {
  return lineToVector({ trend: plane.dipDirection, plunge: plane.dip });
}

/** Horizontal strike vector, right-hand rule (trend = dip direction − 90). */
export function strikeVector(plane: Plane): Vector3 {
  return lineToVector({ trend: plane.dipDirection - 90, plunge: 0 });
}
