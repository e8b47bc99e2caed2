// Lower-hemisphere projections (methods.md §2): equal-area (Lambert azimuthal, Schmidt net) and equal-angle
// (stereographic, Wulff net). Net coordinates x east, y north (y up), primitive radius R (default 1).
import { exactNormal, exactVector } from './angles.js';
import { DEG, RAD, normalizeAzimuth } from './math.js';
import { cosSmall, quadrantOf, sinSmall } from './trig.js';
import { OrientationError } from './types.js';
import type { Line, Plane, Vector3 } from './types.js';
import { cross, normalize } from './vector.js';

export type Net = 'equal-area' | 'equal-angle';

const HALF_PI = Math.PI / 2;
const HALF_DEG = DEG / 2;
const QUARTER_PI = Math.PI / 4;

/**
 * Projects a line onto the net. With c = 90° − plunge: equal-area r = R·√2·sin(c/2), equal-angle
 * r = R·tan(c/2); x = r sin(trend), y = r cos(trend). A negative plunge is
 * read as the antipodal (lower-hemisphere) line.
 */
export function project(line: Line, net: Net, radius = 1): { x: number; y: number } {
  let t = line.trend;
  let p = line.plunge;
  if (p < 0) {
    p = -p;
    t += 180;
  }
  // half the angle from the vertical, c/2 = (90° − p)/2 in radians: exact near the centre
  const h = (90 - p) * HALF_DEG;
  let r: number;
  if (h >= 0 && h <= QUARTER_PI) {
    r = net === 'equal-area' ? radius * Math.SQRT2 * sinSmall(h) : (radius * sinSmall(h)) / cosSmall(h);
  } else {
    r = net === 'equal-area' ? radius * Math.SQRT2 * Math.sin(h) : radius * Math.tan(h);
  }
  const q = quadrantOf(t);
  const x = (t - 90 * q) * DEG;
  const s = sinSmall(x);
  const c = cosSmall(x);
  switch (q & 3) {
    case 0:
      return { x: r * s, y: r * c };
    case 1:
      return { x: r * c, y: -r * s };
    case 2:
      return { x: -r * s, y: -r * c };
    default:
      return { x: -r * c, y: r * s };
  }
}

/**
 * Line at a point of the net (inverse of `project`). Points up to 1e-9·R outside the primitive are taken
 * as on it; points farther out throw an OrientationError. The centre is 000/90.
 */
export function unproject(point: { x: number; y: number }, net: Net, radius = 1): Line {
  const rho = Math.hypot(point.x, point.y) / radius;
  if (!(rho <= 1 + 1e-9)) {
    throw new OrientationError(
      `The point (${point.x}, ${point.y}) lies outside the net of radius ${radius}: only points on or inside the primitive circle are orientations.`,
    );
  }
  const r = Math.min(rho, 1);
  // colatitude from the centre: equal-area r = √2·sin(c/2), equal-angle r = tan(c/2)
  const c = net === 'equal-area' ? 2 * Math.asin(Math.min(1, r / Math.SQRT2)) : 2 * Math.atan(r);
  const plunge = HALF_PI - c;
  const trend = rho === 0 ? 0 : normalizeAzimuth(Math.atan2(point.x, point.y) * RAD);
  return { trend, plunge: Math.max(0, plunge * RAD) };
}

function lineOf(v: Vector3): Line {
  let [n, e, d] = v;
  if (d < 0) {
    n = -n;
    e = -e;
    d = -d;
  }
  const h = Math.hypot(n, e);
  if (Math.abs(d) < 1e-15) d = 0;
  const plunge = Math.atan2(d, h) * RAD;
  const trend = h < 1e-15 ? 0 : normalizeAzimuth(Math.atan2(e, n) * RAD);
  return { trend, plunge };
}

function checkSegments(segments: number, what: string): void {
  if (!Number.isInteger(segments) || segments < 1 || segments > 100_000) {
    throw new RangeError(`${what} needs a whole number of segments from 1 to 100000, not ${segments}.`);
  }
}

/**
 * Great circle of a plane as lines, l(t) = cos t·s + sin t·d for t from 0° to 180° (s the strike vector by
 * the right-hand rule, d the dip vector), `segments` intervals with both ends included. Every sample is
 * on the lower hemisphere. A vertical plane gives a straight line through the centre; a horizontal plane
 * gives the whole primitive (t from 0° to 360°, first and last sample equal).
 */
export function greatCircle(plane: Plane, segments = 90): Line[] {
  checkSegments(segments, 'A great circle');
  const n = exactNormal(plane);
  if (!Number.isFinite(n[0] + n[1] + n[2]) || plane.dip < 0 || plane.dip > 90) {
    throw new OrientationError(
      `The plane ${plane.dipDirection}/${plane.dip} is not valid: dip direction must be 0–360° and dip 0–90°.`,
    );
  }
  const s = exactVector({ trend: plane.dipDirection - 90, plunge: 0 });
  const d = exactVector({ trend: plane.dipDirection, plunge: plane.dip });
  const span = plane.dip === 0 ? 360 : 180;
  const out: Line[] = [];
  for (let i = 0; i <= segments; i++) {
    const t = (span * i) / segments;
    const ct = t === 90 || t === 270 ? 0 : Math.cos(t * DEG);
    const st = t === 180 || t === 360 ? 0 : Math.sin(t * DEG);
    out.push(lineOf([ct * s[0] + st * d[0], ct * s[1] + st * d[1], ct * s[2] + st * d[2]]));
  }
  return out;
}

/**
 * Small circle (cone) of the given half-angle (0–180°) about an axis, sampled at `segments` intervals
 * around the cone, both ends included: l(t) = cos ρ·a + sin ρ·(cos t·u + sin t·v). Samples on the upper
 * hemisphere are replaced by their antipodes (axial data), so the cone reappears on the opposite side of
 * the net; a polyline should be broken where consecutive samples jump across the net.
 */
export function smallCircle(axis: Line, halfAngle: number, segments = 120): Line[] {
  checkSegments(segments, 'A small circle');
  if (!Number.isFinite(halfAngle) || halfAngle < 0 || halfAngle > 180) {
    throw new OrientationError(`Cone half-angle ${halfAngle} is out of range: it must be 0–180°.`);
  }
  const a = exactVector(axis);
  const z: Vector3 = [0, 0, 1];
  const c = cross(a, z);
  const u = Math.hypot(c[0], c[1], c[2]) < 1e-12 ? ([1, 0, 0] as const) : normalize(c);
  const v = cross(a, u);
  const cr = Math.cos(halfAngle * DEG);
  const sr = Math.sin(halfAngle * DEG);
  const out: Line[] = [];
  for (let i = 0; i <= segments; i++) {
    const t = (2 * Math.PI * i) / segments;
    const ct = Math.cos(t);
    const st = Math.sin(t);
    out.push(
      lineOf([
        cr * a[0] + sr * (ct * u[0] + st * v[0]),
        cr * a[1] + sr * (ct * u[1] + st * v[1]),
        cr * a[2] + sr * (ct * u[2] + st * v[2]),
      ]),
    );
  }
  return out;
}
