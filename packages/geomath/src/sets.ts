// Axial set finding (methods.md §3.4): seeds from density maxima (or a given count), sign-invariant
// assignment by the largest |x·c|, refinement of each set's Fisher mean to convergence, and poles left
// unassigned when they lie outside every set's cone.
import { axisToLine } from './angles.js';
import { densityNodes, exponentialK, exponentialMoments, kernelSums, toUnitVectors } from './density.js';
import type { UnitVectors } from './kernel-index.js';
import { RAD } from './math.js';
import { checkWeights, fisherFromResultant, resolveWeights } from './statistics.js';
import type { TerzaghiOptions, WeightingUsed } from './statistics.js';
import type { Line, Vector3 } from './types.js';

export interface JointSet {
  mean: Line;
  members: number[];
  k: number;
  alpha95: number;
}

/** Seeds closer than this (axial angle) are taken as one set. */
export const SET_SEPARATION = 20;
/** Automatic seeds must stand this many σ above the uniform density. */
export const SET_SIGNIFICANCE = 5;
/** Grid and kernel used to look for density maxima. */
const SEED_CELLS = 64;
const SEED_MAX_K = 100;
/** At most this many poles (every m-th, by input order) are used to look for density maxima. */
const SEED_MAX_POLES = 4000;
/** Cone that holds a set: 1 − cos θ = ln(1000)/k (99.9 % of a Fisher distribution), clamped. */
const CONE_LOG = Math.log(1000);
const CONE_MIN = 3;
const CONE_MAX = 45;
const MAX_ITERATIONS = 100;

// Module-level alias: cheaper than a global look-up in hot loops.
const { abs } = Math;

const absDot = (d: UnitVectors, i: number, c: Vector3): number =>
  abs(d.x[i] * c[0] + d.y[i] * c[1] + d.z[i] * c[2]);

/** Every m-th pole so that at most `limit` remain (by input order, so antipodes change nothing). */
function subsample(data: UnitVectors, limit: number): UnitVectors {
  if (data.count <= limit) return data;
  const step = Math.ceil(data.count / limit);
  const count = Math.ceil(data.count / step);
  const pick = (a: Float64Array): Float64Array => {
    const out = new Float64Array(count);
    for (let i = 0; i < count; i++) out[i] = a[i * step];
    return out;
  };
  return { x: pick(data.x), y: pick(data.y), z: pick(data.z), w: pick(data.w), count };
}

/** Density maxima of the poles (axial), strongest first, at least SET_SEPARATION apart. */
function densitySeeds(all: UnitVectors, significance: number): Vector3[] {
  const data = subsample(all, SEED_MAX_POLES);
  const n = SEED_CELLS;
  const k = Math.min(exponentialK(data.count), SEED_MAX_K);
  const nodes = densityNodes('equal-area', n);
  const raw = kernelSums(data, nodes, 'exponential', k, 4);
  let sumW = 0;
  let sumW2 = 0;
  for (let i = 0; i < data.count; i++) {
    sumW += data.w[i];
    sumW2 += data.w[i] * data.w[i];
  }
  const { expected, sigma } = exponentialMoments(k, sumW, sumW2);
  const candidates: number[] = [];
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      const g = i + j * n;
      // Cells outside the primitive repeat the rim's directions (densityNodes): they are compared with as
      // neighbours but never seed a set, or a rim cell near a set's antipode seeds a set of its own.
      const x = -1 + ((i + 0.5) * 2) / n;
      const y = 1 - ((j + 0.5) * 2) / n;
      if (x * x + y * y >= 1) continue;
      const v = raw[g];
      if (sigma > 0 && (v - expected) / sigma < significance) continue;
      let peak = true;
      for (let dj = -1; dj <= 1 && peak; dj++) {
        for (let di = -1; di <= 1; di++) {
          const ii = i + di;
          const jj = j + dj;
          if ((di || dj) && ii >= 0 && jj >= 0 && ii < n && jj < n && raw[ii + jj * n] > v) {
            peak = false;
            break;
          }
        }
      }
      if (peak) candidates.push(g);
    }
  }
  candidates.sort((a, b) => raw[b] - raw[a] || a - b);
  const cosSep = Math.cos(SET_SEPARATION / RAD);
  const seeds: Vector3[] = [];
  for (const g of candidates) {
    const v: Vector3 = [nodes[3 * g], nodes[3 * g + 1], nodes[3 * g + 2]];
    if (seeds.every((s) => abs(s[0] * v[0] + s[1] * v[1] + s[2] * v[2]) < cosSep)) seeds.push(v);
  }
  return seeds;
}

/** Adds seeds at the poles farthest (axially) from all seeds so far, until there are `count`. */
function fillSeeds(data: UnitVectors, seeds: Vector3[], count: number): void {
  while (seeds.length < count && seeds.length < data.count) {
    let best = -1;
    let bestGap = -1;
    for (let i = 0; i < data.count; i++) {
      let nearest = 0;
      for (const s of seeds) nearest = Math.max(nearest, absDot(data, i, s));
      const gap = 1 - nearest;
      if (gap > bestGap) {
        bestGap = gap;
        best = i;
      }
    }
    seeds.push([data.x[best], data.y[best], data.z[best]]);
  }
}

/**
 * Finds joint sets among poles (axial data: a pole and its antipode are the same). Seeds are the density
 * maxima (exponential kernel, k = min(2(1 + N/9), 100), on a 64 × 64 equal-area grid, from at most 4000
 * poles taken at a regular stride of the input) that stand at least 5σ above the uniform density
 * and 20° apart; with `count`, the `count` strongest maxima regardless of σ, completed by the poles
 * farthest from the seeds. Each pole joins the set whose mean is nearest (largest |x·c|) if it lies within
 * that set's cone (1 − cos θ = ln 1000/k, θ between 3° and 45°); means are axial Fisher means of the
 * members, iterated until no pole changes set. Sets with fewer than two members are dissolved. Sets are
 * returned largest first, members in input order; k and α95 as in `fisherStatistics` (weighted when
 * weights are given, or Terzaghi-weighted with `terzaghi`, in which case the result names the sampling).
 */
export function findSets(
  poles: Line[],
  options?: { count?: number; weights?: number[]; terzaghi?: TerzaghiOptions },
): { sets: JointSet[]; unassigned: number[]; weighting?: WeightingUsed } {
  const count = options?.count;
  if (count !== undefined && (!Number.isInteger(count) || count < 1)) {
    throw new RangeError(`The number of sets must be a whole number of 1 or more, not ${count}.`);
  }
  checkWeights(options?.weights, poles.length);
  const { weights, weighting } = resolveWeights(poles, options);
  const found = findSetsWeighted(poles, count, weights);
  return weighting ? { ...found, weighting } : found;
}

function findSetsWeighted(
  poles: Line[],
  count: number | undefined,
  weights: number[] | undefined,
): { sets: JointSet[]; unassigned: number[] } {
  if (poles.length === 0) return { sets: [], unassigned: [] };
  const data = toUnitVectors(poles, weights);
  const seeds = densitySeeds(data, count === undefined ? SET_SIGNIFICANCE : Number.NEGATIVE_INFINITY);
  if (count !== undefined) {
    seeds.length = Math.min(seeds.length, count);
    fillSeeds(data, seeds, count);
  }
  let centres = seeds;
  let cones = centres.map(() => 0); // cos of each set's cone; 0 = 90°, everything nearest joins at first
  const assignment = new Int32Array(data.count).fill(-2);
  let stats: Array<{ n: number; r: number; sum: Vector3 }> = [];
  for (let iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
    let changed = false;
    for (let i = 0; i < data.count; i++) {
      let best = -1;
      let bestDot = -1;
      for (let s = 0; s < centres.length; s++) {
        const d = absDot(data, i, centres[s]);
        if (d > bestDot) {
          bestDot = d;
          best = s;
        }
      }
      const set = best >= 0 && bestDot >= cones[best] ? best : -1;
      if (assignment[i] !== set) {
        assignment[i] = set;
        changed = true;
      }
    }
    stats = centres.map(() => ({ n: 0, r: 0, sum: [0, 0, 0] as Vector3 }));
    for (let i = 0; i < data.count; i++) {
      const s = assignment[i];
      if (s < 0) continue;
      const c = centres[s];
      const dotc = data.x[i] * c[0] + data.y[i] * c[1] + data.z[i] * c[2];
      const w = dotc < 0 ? -data.w[i] : data.w[i];
      const st = stats[s];
      st.n += data.w[i];
      st.sum = [st.sum[0] + w * data.x[i], st.sum[1] + w * data.y[i], st.sum[2] + w * data.z[i]];
    }
    if (!changed) break;
    const next: Vector3[] = [];
    const nextCones: number[] = [];
    for (let s = 0; s < centres.length; s++) {
      const st = stats[s];
      const r = Math.hypot(st.sum[0], st.sum[1], st.sum[2]);
      st.r = r;
      if (r === 0) {
        next.push(centres[s]);
        nextCones.push(cones[s]);
        continue;
      }
      next.push([st.sum[0] / r, st.sum[1] / r, st.sum[2] / r]);
      const k = st.n > 1 ? fisherFromResultant(st.n, r).k : Number.POSITIVE_INFINITY;
      const theta = Math.min(CONE_MAX, Math.max(CONE_MIN, Math.acos(Math.max(-1, 1 - CONE_LOG / k)) * RAD));
      nextCones.push(Math.cos(theta / RAD));
    }
    centres = next;
    cones = nextCones;
  }
  const members: number[][] = centres.map(() => []);
  const unassigned: number[] = [];
  for (let i = 0; i < data.count; i++) {
    const s = assignment[i];
    if (s < 0) unassigned.push(i);
    else members[s].push(i);
  }
  const sets: JointSet[] = [];
  for (let s = 0; s < centres.length; s++) {
    const st = stats[s];
    const r = Math.hypot(st.sum[0], st.sum[1], st.sum[2]);
    if (members[s].length < 2 || !(st.n > 1) || r === 0) {
      unassigned.push(...members[s]);
      continue;
    }
    const { k, alpha95 } = fisherFromResultant(st.n, r);
    sets.push({ mean: axisToLine(st.sum), members: members[s], k, alpha95 });
  }
  unassigned.sort((a, b) => a - b);
  sets.sort((a, b) => b.members.length - a.members.length || a.members[0] - b.members[0]);
  return { sets, unassigned };
}
