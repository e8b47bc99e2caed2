/** One place for constants and safe trigonometry (after d3-geo's src/math.js). */
export const EPSILON = 1e-9;
export const DEG = Math.PI / 180;
export const RAD = 180 / Math.PI;

export const toRadians = (degrees: number): number => degrees * DEG;
export const toDegrees = (radians: number): number => radians * RAD;

/** acos with its argument clamped to [-1, 1] so rounding never yields NaN. */
export function acosSafe(x: number): number {
  return Math.acos(x > 1 ? 1 : x < -1 ? -1 : x);
}

/** asin with its argument clamped to [-1, 1]. */
export function asinSafe(x: number): number {
  return Math.asin(x > 1 ? 1 : x < -1 ? -1 : x);
}

/** Wraps an azimuth into [0, 360). Values within 1e-9 of 360 become 0. */
export function normalizeAzimuth(degrees: number): number {
  let a = degrees % 360;
  if (a < 0) a += 360;
  if (a >= 360 - 1e-9) a = 0;
  return a === 0 ? 0 : a; // no -0
}

/** Smallest absolute difference between two azimuths, in [0, 180]. */
export function azimuthDifference(a: number, b: number): number {
  const d = Math.abs(normalizeAzimuth(a) - normalizeAzimuth(b));
  return d > 180 ? 360 - d : d;
}

/**
 * Sine of an angle in degrees, exact (0, ±1) at multiples of 90° so that horizontal and vertical
 * orientations carry no rounding residue such as cos(90°) ≈ 6e-17.
 */
export function sinDeg(degrees: number): number {
  const r = degrees % 360;
  if (r % 90 === 0) {
    const q = (((r / 90) % 4) + 4) % 4;
    return q === 1 ? 1 : q === 3 ? -1 : 0;
  }
  return Math.sin(degrees * DEG);
}

/** Cosine of an angle in degrees, exact at multiples of 90°. */
export function cosDeg(degrees: number): number {
  const r = degrees % 360;
  if (r % 90 === 0) {
    const q = (((r / 90) % 4) + 4) % 4;
    return q === 0 ? 1 : q === 2 ? -1 : 0;
  }
  return Math.cos(degrees * DEG);
}
