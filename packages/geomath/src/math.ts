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
