// Fisher (1953) statistics and Terzaghi (1965) weights (methods.md §3.1, §3.3).
import { axisToLine, exactVector } from './angles.js';
import { symmetricEigen } from './eigen.js';
import { RAD, acosSafe } from './math.js';
import { OrientationError } from './types.js';
import type { Line, Vector3 } from './types.js';

export interface FisherResult {
  mean: Line;
  count: number;
  resultantLength: number;
  k: number;
  alpha95: number;
  /** Present when the statistics were Terzaghi-weighted through the `terzaghi` option. */
  weighting?: WeightingUsed;
}

/** Which weighting a result used, for the UI to state beside it. */
export interface WeightingUsed {
  method: 'terzaghi';
  sampling: TerzaghiSampling;
  label: string;
  cap: number;
}

/**
 * Resolves `weights` or `terzaghi` (not both) into one weight per line and the weighting used.
 */
export function resolveWeights(
  lines: readonly Line[],
  options?: { weights?: number[]; terzaghi?: TerzaghiOptions },
): { weights?: number[]; weighting?: WeightingUsed } {
  if (options?.terzaghi === undefined) return { weights: options?.weights };
  if (options.weights !== undefined) {
    throw new OrientationError('Give either weights or a Terzaghi weighting, not both.');
  }
  const t = terzaghiWeights(lines, options.terzaghi);
  return {
    weights: t.weights,
    weighting: { method: 'terzaghi', sampling: t.sampling, label: t.label, cap: t.cap },
  };
}

/** Checks optional weights: one finite, non-negative number per item. */
export function checkWeights(weights: number[] | undefined, count: number): void {
  if (weights === undefined) return;
  if (weights.length !== count) {
    throw new OrientationError(
      `There are ${weights.length} weights for ${count} orientations: give one weight per orientation.`,
    );
  }
  for (const w of weights) {
    if (!Number.isFinite(w) || w < 0) {
      throw new OrientationError(
        `The weight ${w} is not usable: weights must be finite numbers of 0 or more.`,
      );
    }
  }
}

/**
 * Fisher k and α95 from N (count or sum of weights) and the resultant length R (Fisher 1953):
 * k = (N − 1)/(N − R); cos α95 = 1 − ((N − R)/R)·((1/0.05)^(1/(N − 1)) − 1), α95 = 180° when that
 * falls below −1. R = N (all identical) gives k = Infinity and α95 = 0.
 */
export function fisherFromResultant(n: number, r: number): { k: number; alpha95: number } {
  const spread = Math.max(0, n - r);
  const k = spread === 0 ? Number.POSITIVE_INFINITY : (n - 1) / spread;
  if (r <= 0) return { k, alpha95: 180 };
  const cosA = 1 - (spread / r) * (Math.pow(1 / 0.05, 1 / (n - 1)) - 1);
  return { k, alpha95: cosA < -1 ? 180 : acosSafe(cosA) * RAD };
}

/** Sum of weighted vectors, each flipped (axial) to point within 90° of the reference when one is given. */
export function weightedResultant(
  vectors: readonly Vector3[],
  weights: readonly number[] | undefined,
  reference?: Vector3,
): Vector3 {
  let sx = 0;
  let sy = 0;
  let sz = 0;
  for (let i = 0; i < vectors.length; i++) {
    const v = vectors[i];
    let w = weights ? weights[i] : 1;
    if (reference && v[0] * reference[0] + v[1] * reference[1] + v[2] * reference[2] < 0) w = -w;
    sx += w * v[0];
    sy += w * v[1];
    sz += w * v[2];
  }
  return [sx, sy, sz];
}

/** Principal axis of the (weighted) orientation tensor T = Σ w x xᵀ. */
export function principalAxis(vectors: readonly Vector3[], weights?: readonly number[]): Vector3 {
  let a00 = 0;
  let a01 = 0;
  let a02 = 0;
  let a11 = 0;
  let a12 = 0;
  let a22 = 0;
  for (let i = 0; i < vectors.length; i++) {
    const [x, y, z] = vectors[i];
    const w = weights ? weights[i] : 1;
    a00 += w * x * x;
    a01 += w * x * y;
    a02 += w * x * z;
    a11 += w * y * y;
    a12 += w * y * z;
    a22 += w * z * z;
  }
  return symmetricEigen([a00, a01, a02, a11, a12, a22]).vectors[0];
}

/**
 * Fisher statistics of lines (Fisher 1953; formulas as in Tauxe et al., Essentials of Paleomagnetism,
 * ch. 11). Directional unless `axial: true`; axial data are first flipped toward the principal axis of
 * the orientation tensor. With weights each vector is scaled by its weight and N = Σ weights; with
 * `terzaghi` the weights are Terzaghi's for the named sampling geometry and the result says which.
 * Needs N > 1. The mean is returned on the lower hemisphere.
 */
export function fisherStatistics(
  lines: Line[],
  options?: { axial?: boolean; weights?: number[]; terzaghi?: TerzaghiOptions },
): FisherResult {
  const { weights, weighting } = resolveWeights(lines, options);
  checkWeights(weights, lines.length);
  const vectors = lines.map((l) => {
    if (!Number.isFinite(l.trend) || !Number.isFinite(l.plunge)) {
      throw new OrientationError(
        `The line ${l.trend}/${l.plunge} is not a number: trend and plunge must be numbers in degrees.`,
      );
    }
    return exactVector(l);
  });
  const n = weights ? weights.reduce((s, w) => s + w, 0) : lines.length;
  if (lines.length < 2 || !(n > 1)) {
    throw new OrientationError(
      `Fisher statistics need at least two orientations (and a total weight above 1); ${lines.length} given.`,
    );
  }
  const reference = options?.axial ? principalAxis(vectors, weights) : undefined;
  const s = weightedResultant(vectors, weights, reference);
  const r = Math.hypot(s[0], s[1], s[2]);
  const { k, alpha95 } = fisherFromResultant(n, r);
  const mean = r > 0 ? axisToLine(s) : { trend: 0, plunge: 90 };
  const result: FisherResult = { mean, count: n, resultantLength: r, k, alpha95 };
  if (weighting) result.weighting = weighting;
  return result;
}

/**
 * How a set of discontinuities was sampled, which decides its Terzaghi (1965) weight (methods.md §3.3):
 * - 'planar-window': one mapped face, a window whose normal is the drive direction. A set is seen in
 *   proportion to sin θ, θ between its pole and the face normal: w = 1/sin θ.
 * - 'scanline': features recorded once where a line crosses them (a scanline, a borehole, or the tunnel
 *   axis when the faces of a heading are pooled, each feature counted once). A set is crossed in
 *   proportion to |cos δ|, δ between its pole and the line: w = 1/|cos δ|.
 */
export type TerzaghiSampling = 'planar-window' | 'scanline';

export const TERZAGHI_SAMPLINGS: readonly TerzaghiSampling[] = ['planar-window', 'scanline'];

/** Words for the UI beside every weighted statistic: which sampling geometry the weights assume. */
export const TERZAGHI_SAMPLING_LABELS: Readonly<Record<TerzaghiSampling, string>> = {
  'planar-window':
    'Terzaghi weighting, planar window (one face): w = 1/sin θ, θ between the pole and the face normal (the drive)',
  scanline:
    'Terzaghi weighting, scanline (faces pooled along the heading, the axis as the line): w = 1/cos δ, δ between the pole and the axis',
};

/** Default cap on a Terzaghi weight (the blind zone; common practice, from memory). */
export const TERZAGHI_DEFAULT_CAP = 10;

function checkCap(cap: number): void {
  if (!(cap >= 1)) throw new RangeError(`The Terzaghi weight cap must be 1 or more, not ${cap}.`);
}

/** |cos| and sin of the angle between a pole and a sampling direction (either sign of each). */
function cosSin(pole: Line, direction: Line): { c: number; s: number } {
  const a = exactVector(pole);
  const b = exactVector(direction);
  const c = Math.abs(a[0] * b[0] + a[1] * b[1] + a[2] * b[2]);
  const s = Math.hypot(a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]);
  if (!Number.isFinite(c) || !Number.isFinite(s)) {
    throw new OrientationError('The pole and the sampling direction must both be numbers in degrees.');
  }
  return { c, s };
}

/**
 * Terzaghi (1965) weight of a pole sampled along a line — the scanline case (scanline, borehole, or the
 * tunnel axis when the faces of a heading are pooled): w = 1/|cos δ|, δ the angle between the pole and
 * the sampling direction, capped at `cap` (default 10, i.e. δ ≥ 84.26° all weigh 10) for the blind zone.
 * For one face (a planar window) use `terzaghiWeightFor(pole, 'planar-window', drive)`.
 */
export function terzaghiWeight(pole: Line, samplingDirection: Line, cap = TERZAGHI_DEFAULT_CAP): number {
  checkCap(cap);
  const { c } = cosSin(pole, samplingDirection);
  return c * cap <= 1 ? cap : 1 / c;
}

/**
 * Terzaghi (1965) weight by sampling geometry (methods.md §3.3): 'planar-window' w = 1/sin θ with θ between
 * the pole and the face normal (give the drive direction); 'scanline' w = 1/|cos δ| with δ between the pole
 * and the line (give the axis). Capped at `cap` (default 10). A Drive may be passed as the direction
 * (a climbing drive's negative plunge is the same axis).
 */
export function terzaghiWeightFor(
  pole: Line,
  sampling: TerzaghiSampling,
  direction: Line,
  cap = TERZAGHI_DEFAULT_CAP,
): number {
  checkCap(cap);
  const { c, s } = cosSin(pole, direction);
  switch (sampling) {
    case 'scanline':
      return c * cap <= 1 ? cap : 1 / c;
    case 'planar-window':
      return s * cap <= 1 ? cap : 1 / s;
    default:
      throw new RangeError(
        `Unknown sampling geometry ${String(sampling)}: expected ${TERZAGHI_SAMPLINGS.join(' or ')}.`,
      );
  }
}

/** Terzaghi weighting to apply, named by its sampling geometry. */
export interface TerzaghiOptions {
  sampling: TerzaghiSampling;
  /** The face normal (the drive) for a planar window; the line (the axis) for a scanline. */
  direction: Line;
  /** Default 10. */
  cap?: number;
}

/** Weights of a list of poles, with the sampling geometry used, for the UI to state beside the result. */
export interface TerzaghiWeights {
  sampling: TerzaghiSampling;
  label: string;
  cap: number;
  weights: number[];
  /** Indices of the poles whose weight was capped (in the blind zone of this sampling). */
  capped: number[];
}

export function terzaghiWeights(poles: readonly Line[], options: TerzaghiOptions): TerzaghiWeights {
  const cap = options.cap ?? TERZAGHI_DEFAULT_CAP;
  const weights = poles.map((p) => terzaghiWeightFor(p, options.sampling, options.direction, cap));
  const capped: number[] = [];
  weights.forEach((w, i) => {
    if (w === cap) capped.push(i);
  });
  return {
    sampling: options.sampling,
    label: TERZAGHI_SAMPLING_LABELS[options.sampling],
    cap,
    weights,
    capped,
  };
}
