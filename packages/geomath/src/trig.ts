// Sine and cosine for the projection's inner loop: exact range reduction in degrees to |x| ≤ 45° and
// Taylor polynomials to x¹⁵ (sine) and x¹⁶ (cosine), whose remainders at π/4 are below 5e-17. In V8 this
// is several times cheaper than Math.sin + Math.cos (evaluated by Estrin's scheme for short dependency
// chains); multiples of 90° give exact 0 and ±1.
import { DEG } from './math.js';

const S3 = -1 / 6;
const S5 = 1 / 120;
const S7 = -1 / 5040;
const S9 = 1 / 362880;
const S11 = -1 / 39916800;
const S13 = 1 / 6227020800;
const S15 = -1 / 1307674368000;
const C2 = -1 / 2;
const C4 = 1 / 24;
const C6 = -1 / 720;
const C8 = 1 / 40320;
const C10 = -1 / 3628800;
const C12 = 1 / 479001600;
const C14 = -1 / 87178291200;
const C16 = 1 / 20922789888000;

/** sin x for |x| ≤ π/4 (radians). Estrin's scheme: short dependency chains. */
export function sinSmall(x: number): number {
  const y = x * x;
  const y2 = y * y;
  const y4 = y2 * y2;
  const p = S3 + S5 * y + (S7 + S9 * y) * y2 + (S11 + S13 * y + S15 * y2) * y4;
  return x + x * y * p;
}

/** cos x for |x| ≤ π/4 (radians). Estrin's scheme. */
export function cosSmall(x: number): number {
  const y = x * x;
  const y2 = y * y;
  const y4 = y2 * y2;
  const q = C2 + C4 * y + (C6 + C8 * y) * y2 + (C10 + C12 * y + (C14 + C16 * y) * y2) * y4;
  return 1 + y * q;
}

/** Quadrant count q (x = θ − 90°·q within ±45°) of an angle in degrees. */
export function quadrantOf(degrees: number): number {
  return degrees >= 0 && degrees < 1e9 ? (degrees * (1 / 90) + 0.5) | 0 : Math.round(degrees / 90);
}

/** sin θ and cos θ of an angle in degrees (any finite value). */
export function sinCosDeg(degrees: number): [number, number] {
  const q = quadrantOf(degrees);
  const x = (degrees - 90 * q) * DEG;
  const s = sinSmall(x);
  const c = cosSmall(x);
  switch (q & 3) {
    case 0:
      return [s, c];
    case 1:
      return [c, -s];
    case 2:
      return [-s, -c];
    default:
      return [-c, s];
  }
}
