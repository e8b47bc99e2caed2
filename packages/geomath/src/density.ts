// Density of poles over the net (methods.md §3.2): Kamb (1959) counting and the exponential ("modified
// Kamb") kernel of Vollmer (1995), reported by default in Kamb's own units, multiples of σ (value =
// density/σ, so a uniform distribution reads 3σ and an empty cell 0). "σ above uniform" ((density − E)/σ)
// and multiples of the uniform density (density/E) are named options. Contour lines are traced by
// d3-contour.
import { contours } from 'd3-contour';
import { exactVector } from './angles.js';
import { AxialIndex } from './kernel-index.js';
import type { UnitVectors } from './kernel-index.js';
import type { Net } from './projection.js';
import { checkWeights } from './statistics.js';
import { OrientationError } from './types.js';
import type { Line } from './types.js';

// Module-level aliases: cheaper than global look-ups in hot loops (notably in sandboxed test runs).
const { exp, abs, sqrt } = Math;

export type DensityMethod = 'kamb' | 'exponential';

/**
 * Units of a density grid's values (methods.md §3.2):
 * - 'multiples-of-sigma' (default): density/σ, Kamb's (1959) own units; uniform = E/σ = 3σ by construction,
 *   an empty cell 0;
 * - 'sigma-above-uniform': (density − E)/σ; uniform = 0, an empty cell −3;
 * - 'multiples-of-uniform': density/E; uniform = 1, an empty cell 0.
 */
export type DensityUnits = 'multiples-of-sigma' | 'sigma-above-uniform' | 'multiples-of-uniform';

export const DENSITY_UNITS: readonly DensityUnits[] = [
  'multiples-of-sigma',
  'sigma-above-uniform',
  'multiples-of-uniform',
];

export interface DensityGrid {
  /** Cells along each side; values has cells × cells entries. */
  cells: number;
  /**
   * Row-major, row 0 at the top (north) and column 0 at the left (west), as an image. Value of the cell
   * centred at x = −1 + (i + ½)·2/cells, y = 1 − (j + ½)·2/cells (net radius 1) is values[i + j·cells], in
   * `units` (default multiples of σ: raw density = value·sigma; see `rawDensity`). Cells outside the
   * primitive hold the value at the point of the primitive on the same radius, so contours stay closed.
   */
  values: Float64Array;
  /** What the values mean; show `densityLegend(grid)` beside every plot. */
  units: DensityUnits;
  method: DensityMethod;
  /** The value a uniform distribution gives in these units (3 in multiples of σ, unweighted). */
  uniformValue: number;
  /** Raw density expected at every cell under a uniform distribution (counts, or kernel sum). */
  expected: number;
  /** Standard deviation of the raw density under a uniform distribution. */
  sigma: number;
}

/** Kernel values below 1e-12/k are left out: at any cell the omitted total is below 1e-12·E. */
const CUTOFF_DECADES = 12;

/** Unit vectors of the cell centres of a cells × cells grid over the net (radius 1), row 0 north. */
export function densityNodes(net: Net, cells: number): Float64Array {
  const out = new Float64Array(3 * cells * cells);
  const step = 2 / cells;
  for (let j = 0; j < cells; j++) {
    const y = 1 - (j + 0.5) * step;
    for (let i = 0; i < cells; i++) {
      const x = -1 + (i + 0.5) * step;
      const rho2 = x * x + y * y;
      const rho = sqrt(rho2);
      let sp: number;
      let cp: number;
      if (rho >= 1) {
        sp = 0;
        cp = 1;
      } else if (net === 'equal-area') {
        sp = 1 - rho2;
        cp = sqrt(Math.max(0, 1 - sp * sp));
      } else {
        sp = (1 - rho2) / (1 + rho2);
        cp = (2 * rho) / (1 + rho2);
      }
      const o = 3 * (i + j * cells);
      if (rho === 0) {
        out[o] = 0;
        out[o + 1] = 0;
        out[o + 2] = 1;
      } else {
        out[o] = (cp * y) / rho; // north = cos p·cos τ, cos τ = y/ρ
        out[o + 1] = (cp * x) / rho; // east = cos p·sin τ
        out[o + 2] = sp;
      }
    }
  }
  return out;
}

/** Poles as flat unit vectors with weights (1 when none are given). */
export function toUnitVectors(lines: readonly Line[], weights?: readonly number[]): UnitVectors {
  const count = lines.length;
  const data: UnitVectors = {
    x: new Float64Array(count),
    y: new Float64Array(count),
    z: new Float64Array(count),
    w: new Float64Array(count),
    count,
  };
  for (let i = 0; i < count; i++) {
    const line = lines[i];
    if (!Number.isFinite(line.trend) || !Number.isFinite(line.plunge)) {
      throw new OrientationError(
        `Pole ${i + 1} (${line.trend}/${line.plunge}) is not a number: trend and plunge must be numbers in degrees.`,
      );
    }
    const v = exactVector(line);
    data.x[i] = v[0];
    data.y[i] = v[1];
    data.z[i] = v[2];
    data.w[i] = weights ? weights[i] : 1;
  }
  return data;
}

/** Vollmer's (1995) kernel concentration for N data: k = 2(1 + N/9), which makes E = 3σ. */
export const exponentialK = (count: number): number => 2 * (1 + count / 9);

/**
 * Uniform expectation and σ of a kernel sum Σ wᵢ·exp(k(|cos θᵢ| − 1)) from the exact kernel moments
 * over uniform axes: mean (1 − e^(−k))/k, second moment (1 − e^(−2k))/(2k).
 */
export function exponentialMoments(
  k: number,
  sumW: number,
  sumW2: number,
): { expected: number; sigma: number } {
  const m1 = -Math.expm1(-k) / k;
  const m2 = -Math.expm1(-2 * k) / (2 * k);
  return { expected: sumW * m1, sigma: sqrt(sumW2 * Math.max(0, m2 - m1 * m1)) };
}

/** Kamb's counting cap for N data: area fraction A = 9/(N + 9) of the hemisphere, 1 − cos θ = A. */
export const kambFraction = (count: number): number => 9 / (count + 9);

/**
 * Raw kernel sums at arbitrary unit vectors (flat xyz), with the cut-off index when it pays. For the
 * exponential kernel `parameter` is k and values below 10^(−decades)/k are skipped; for Kamb it is A.
 */
export function kernelSums(
  data: UnitVectors,
  nodes: Float64Array,
  method: DensityMethod,
  parameter: number,
  decades = CUTOFF_DECADES,
): Float64Array {
  const n = nodes.length / 3;
  const out = new Float64Array(n);
  const cosCut =
    method === 'kamb' ? 1 - parameter : 1 - (Math.log(parameter) + decades * Math.LN10) / parameter;
  if (cosCut > 0.05 && data.count > 64) {
    const index = new AxialIndex(data, cosCut);
    for (let g = 0; g < n; g++) {
      const gx = nodes[3 * g];
      const gy = nodes[3 * g + 1];
      const gz = nodes[3 * g + 2];
      out[g] = method === 'kamb' ? index.sumWithin(gx, gy, gz) : index.sumExp(gx, gy, gz, parameter);
    }
    return out;
  }
  const { x, y, z, w, count } = data;
  for (let g = 0; g < n; g++) {
    const gx = nodes[3 * g];
    const gy = nodes[3 * g + 1];
    const gz = nodes[3 * g + 2];
    let sum = 0;
    for (let p = 0; p < count; p++) {
      const c = abs(x[p] * gx + y[p] * gy + z[p] * gz);
      if (method === 'kamb') {
        if (c >= cosCut) sum += w[p];
      } else {
        sum += w[p] * exp(parameter * (c - 1));
      }
    }
    out[g] = sum;
  }
  return out;
}

/**
 * Density of poles (axial data: each pole counts with its antipode) on a cells × cells grid over the
 * net. Kamb (1959): count within a cap of area fraction A = 9/(N + 9), E = N·A, σ = √(N·A·(1 − A)).
 * Exponential kernel (Vollmer 1995): Σ exp(k(|cos θ| − 1)) with k = 2(1 + N/9), E and σ from the exact
 * kernel moments. With weights, E and σ use Σw and Σw² (N stays the number of poles for A and k).
 * Kernel values below 1e-12/k are skipped (poles are binned in space), which changes no value by more
 * than 1e-12·E. Values are in `units`, by default Kamb's multiples of σ (density/σ; uniform = 3σ,
 * empty = 0); 'sigma-above-uniform' and 'multiples-of-uniform' must be asked for by name.
 */
export function densityGrid(
  lines: Line[],
  options: {
    method: DensityMethod;
    net: Net;
    cells: number;
    weights?: number[];
    /** Default 'multiples-of-sigma' (Kamb 1959). */
    units?: DensityUnits;
  },
): DensityGrid {
  const { method, net, cells, weights } = options;
  const units = options.units ?? 'multiples-of-sigma';
  if (!DENSITY_UNITS.includes(units)) {
    throw new RangeError(`Unknown density units ${String(units)}: expected ${DENSITY_UNITS.join(', ')}.`);
  }
  if (!Number.isInteger(cells) || cells < 2 || cells > 2000) {
    throw new RangeError(
      `A density grid needs a whole number of cells from 2 to 2000 per side, not ${cells}.`,
    );
  }
  if (lines.length === 0) throw new OrientationError('No poles given: a density needs at least one pole.');
  checkWeights(weights, lines.length);
  const data = toUnitVectors(lines, weights);
  let sumW = 0;
  let sumW2 = 0;
  for (let i = 0; i < data.count; i++) {
    sumW += data.w[i];
    sumW2 += data.w[i] * data.w[i];
  }
  const count = lines.length;
  let expected: number;
  let sigma: number;
  let parameter: number;
  if (method === 'kamb') {
    const a = kambFraction(count);
    parameter = a;
    expected = sumW * a;
    sigma = sqrt(sumW2 * a * (1 - a));
  } else {
    parameter = exponentialK(count);
    ({ expected, sigma } = exponentialMoments(parameter, sumW, sumW2));
  }
  const raw = kernelSums(data, densityNodes(net, cells), method, parameter);
  const values = raw;
  const { offset, scale } = unitTransform(units, expected, sigma);
  for (let g = 0; g < values.length; g++) values[g] = (raw[g] - offset) * scale;
  return {
    cells,
    values,
    expected,
    sigma,
    units,
    method,
    uniformValue: (expected - offset) * scale,
  };
}

/** value = (raw − offset)·scale for each unit. */
function unitTransform(
  units: DensityUnits,
  expected: number,
  sigma: number,
): { offset: number; scale: number } {
  switch (units) {
    case 'multiples-of-sigma':
      return { offset: 0, scale: sigma > 0 ? 1 / sigma : 0 };
    case 'sigma-above-uniform':
      return { offset: expected, scale: sigma > 0 ? 1 / sigma : 0 };
    case 'multiples-of-uniform':
      return { offset: 0, scale: expected > 0 ? 1 / expected : 0 };
  }
}

/** The raw density (count in the cap, or kernel sum) behind a value of the grid. */
export function rawDensity(grid: Pick<DensityGrid, 'units' | 'expected' | 'sigma'>, value: number): number {
  switch (grid.units) {
    case 'multiples-of-sigma':
      return value * grid.sigma;
    case 'sigma-above-uniform':
      return grid.expected + value * grid.sigma;
    case 'multiples-of-uniform':
      return value * grid.expected;
  }
}

const METHOD_NAMES: Record<DensityMethod, string> = {
  kamb: 'Kamb 1959',
  exponential: 'exponential kernel, Vollmer 1995',
};

const formatUniform = (value: number): string => {
  const rounded = Math.round(value * 10) / 10;
  return Number.isInteger(rounded) ? String(rounded) : rounded.toFixed(1);
};

/**
 * The legend text for a density plot, naming the units, the method and what a uniform distribution reads:
 * "multiples of σ, Kamb 1959; uniform = 3σ", "σ above uniform, exponential kernel, Vollmer 1995;
 * uniform = 0σ", "multiples of uniform, Kamb 1959; uniform = 1". With a grid, the uniform value is the
 * grid's own (weights can move it off 3σ); with only a method and units, the unweighted value.
 */
export function densityLegend(
  grid: Pick<DensityGrid, 'units' | 'method'> & { uniformValue?: number },
): string {
  const uniform =
    grid.uniformValue ??
    (grid.units === 'multiples-of-sigma' ? 3 : grid.units === 'sigma-above-uniform' ? 0 : 1);
  const method = METHOD_NAMES[grid.method];
  switch (grid.units) {
    case 'multiples-of-sigma':
      return `multiples of σ, ${method}; uniform = ${formatUniform(uniform)}σ`;
    case 'sigma-above-uniform':
      return `σ above uniform, ${method}; uniform = ${formatUniform(uniform)}σ`;
    case 'multiples-of-uniform':
      return `multiples of uniform, ${method}; uniform = ${formatUniform(uniform)}`;
  }
}

/** One contour level: polygons (rings of [x, y] in net coordinates, radius 1) enclosing value ≥ level. */
export interface DensityContour {
  level: number;
  polygons: Array<Array<Array<[number, number]>>>;
}

/**
 * Contour lines of a density grid at the given levels (in the grid's units), traced by d3-contour and mapped to
 * net coordinates (x east, y north, radius 1). Clip them to the primitive when drawing.
 */
export function densityContours(grid: DensityGrid, levels: number[]): DensityContour[] {
  const n = grid.cells;
  const generator = contours().size([n, n]).thresholds(levels);
  return generator(Array.from(grid.values)).map((mp) => ({
    level: mp.value,
    polygons: mp.coordinates.map((polygon) =>
      polygon.map((ring) => ring.map(([gx, gy]): [number, number] => [-1 + (gx * 2) / n, 1 - (gy * 2) / n])),
    ),
  }));
}
