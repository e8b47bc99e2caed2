import { densityNodes, exponentialMoments } from '../src/density.js';
import {
  densityContours,
  densityGrid,
  densityLegend,
  exponentialK,
  rawDensity,
  kambFraction,
  lineToVector,
  project,
} from '../src/index.js';
import type { Line, Net } from '../src/index.js';
import { expectClose } from './asserts.js';
import { randomLines, seededRandom } from './random.js';

/** Every pole–node kernel evaluation, no cut-off, no binning: the reference the fast path must equal. */
function bareLoop(lines: Line[], method: 'kamb' | 'exponential', net: Net, cells: number): Float64Array {
  const nodes = densityNodes(net, cells);
  const n = lines.length;
  const xyz = new Float64Array(3 * n);
  lines.forEach((l, i) => xyz.set(lineToVector(l), 3 * i));
  const k = exponentialK(n);
  const cosCap = 1 - kambFraction(n);
  const kamb = method === 'kamb';
  // local aliases: global look-ups are slow inside Jest's sandbox
  const abs = Math.abs;
  const exp = Math.exp;
  const out = new Float64Array(cells * cells);
  for (let g = 0; g < out.length; g++) {
    const gx = nodes[3 * g];
    const gy = nodes[3 * g + 1];
    const gz = nodes[3 * g + 2];
    let s = 0;
    for (let i = 0; i < 3 * n; i += 3) {
      const c = abs(xyz[i] * gx + xyz[i + 1] * gy + xyz[i + 2] * gz);
      if (kamb) s += c >= cosCap ? 1 : 0;
      else s += exp(k * (c - 1));
    }
    out[g] = s;
  }
  return out;
}

/** Clustered poles: a few sets plus scatter. */
function clustered(count: number, seed: number): Line[] {
  const rnd = seededRandom(seed);
  const centres = [
    { trend: 310, plunge: 40 },
    { trend: 30, plunge: 10 },
    { trend: 160, plunge: 75 },
  ];
  return Array.from({ length: count }, (_, i) => {
    if (i % 5 === 4) return { trend: rnd() * 360, plunge: (Math.asin(rnd()) * 180) / Math.PI };
    const c = centres[i % 3];
    const plunge = c.plunge + (rnd() - 0.5) * 16;
    return plunge < 0
      ? { trend: (c.trend + 180 + (rnd() - 0.5) * 16) % 360, plunge: -plunge }
      : { trend: (c.trend + (rnd() - 0.5) * 16 + 360) % 360, plunge };
  });
}

describe('Kamb counting (Kamb 1959; methods.md §3.2, formula from memory, numbers computed here)', () => {
  it.each([
    [50, 0.15254, 32.06, 7.627, 2.542],
    [100, 0.08257, 23.45, 8.257, 2.752],
  ])('N = %d: A = %d, θ = %d°, E = %d, σ = %d', (n, a, theta, e, sigma) => {
    expectClose(kambFraction(n), a, 5e-6);
    expectClose((Math.acos(1 - kambFraction(n)) * 180) / Math.PI, theta, 0.005);
    const grid = densityGrid(randomLines(n, 1), { method: 'kamb', net: 'equal-area', cells: 10 });
    expectClose(grid.expected, e, 0.0005);
    expectClose(grid.sigma, sigma, 0.0005);
    expectClose(grid.expected / grid.sigma, 3, 1e-9); // E = 3σ by design
  });

  it('counts with the binned index exactly as the bare loop does', () => {
    const lines = clustered(3000, 2);
    for (const net of ['equal-area', 'equal-angle'] as const) {
      const grid = densityGrid(lines, { method: 'kamb', net, cells: 30 });
      const bare = bareLoop(lines, 'kamb', net, 30);
      for (let g = 0; g < bare.length; g++) expectClose(rawDensity(grid, grid.values[g]), bare[g], 1e-9);
    }
  });
});

describe('exponential kernel (Vollmer 1995; methods.md §3.2, k from memory, numbers computed here)', () => {
  it.each([
    [50, 13.111, 3.814, 1.271],
    [100, 24.222, 4.128, 1.376],
  ])('N = %d: k = %d, E = %d, σ = %d', (n, k, e, sigma) => {
    expectClose(exponentialK(n), k, 0.0005);
    const grid = densityGrid(randomLines(n, 1), { method: 'exponential', net: 'equal-angle', cells: 10 });
    expectClose(grid.expected, e, 0.0005);
    expectClose(grid.sigma, sigma, 0.0005);
  });

  it('kernel moments for N = 100: mean 0.041284, variance 0.018938 (computed here)', () => {
    const { expected, sigma } = exponentialMoments(exponentialK(100), 1, 1);
    expectClose(expected, 0.041284, 5e-7);
    expectClose(sigma * sigma, 0.018938, 5e-7);
  });

  it('the cut-off and binning change no value by more than 1e-9 relative (to max(|value|, E))', () => {
    const lines = clustered(2500, 3);
    for (const net of ['equal-area', 'equal-angle'] as const) {
      const grid = densityGrid(lines, { method: 'exponential', net, cells: 30 });
      const bare = bareLoop(lines, 'exponential', net, 30);
      let worst = 0;
      for (let g = 0; g < bare.length; g++) {
        const raw = rawDensity(grid, grid.values[g]);
        worst = Math.max(worst, Math.abs(raw - bare[g]) / Math.max(Math.abs(bare[g]), grid.expected));
      }
      expect(worst).toBeLessThan(1e-9);
    }
  });

  // The σ-above-uniform convention is kept as a named option: uniform reads 0 there, 3 lower than Kamb's
  // own units (methods.md §3.2).
  it('uniform data average 0σ above E over the net (units: sigma-above-uniform)', () => {
    const grid = densityGrid(randomLines(3000, 9), {
      method: 'exponential',
      net: 'equal-area',
      cells: 40,
      units: 'sigma-above-uniform',
    });
    let sum = 0;
    let count = 0;
    for (let j = 0; j < 40; j++) {
      for (let i = 0; i < 40; i++) {
        const x = -1 + (i + 0.5) / 20;
        const y = 1 - (j + 0.5) / 20;
        if (x * x + y * y < 1) {
          sum += grid.values[i + j * 40];
          count++;
        }
      }
    }
    expect(Math.abs(sum / count)).toBeLessThan(0.1);
  });
});

/** Mean of the grid values over the cells inside the primitive. */
function meanInside(values: Float64Array, cells: number): number {
  let sum = 0;
  let count = 0;
  for (let j = 0; j < cells; j++) {
    for (let i = 0; i < cells; i++) {
      const x = -1 + ((i + 0.5) * 2) / cells;
      const y = 1 - ((j + 0.5) * 2) / cells;
      if (x * x + y * y < 1) {
        sum += values[i + j * cells];
        count++;
      }
    }
  }
  return sum / count;
}

describe("density units: Kamb's own multiples of σ by default (Kamb 1959; Vollmer 1995; methods.md §3.2)", () => {
  it.each(['kamb', 'exponential'] as const)(
    '%s: uniform data read 3σ on average (Kamb 1959, from memory: E = 3σ)',
    (method) => {
      const grid = densityGrid(randomLines(3000, 9), { method, net: 'equal-area', cells: 40 });
      expect(grid.units).toBe('multiples-of-sigma');
      expectClose(grid.uniformValue, 3, 1e-3); // E/σ = 3 by the choice of A and k [computed here]
      expect(Math.abs(meanInside(grid.values, 40) - 3)).toBeLessThan(0.1);
    },
  );

  it('Kamb: a cell with no pole in its cap reads 0 (Kamb 1959, from memory)', () => {
    // 20 vertical poles: A = 9/29, cap half-angle acos(20/29) = 46.4° [computed here]; the rim is 90° away.
    const poles = Array.from({ length: 20 }, () => ({ trend: 0, plunge: 90 }));
    const grid = densityGrid(poles, { method: 'kamb', net: 'equal-area', cells: 20 });
    expect(grid.values[0 + 10 * 20]).toBe(0); // west rim
    expectClose(grid.values[10 + 10 * 20], 20 / grid.sigma, 1e-12); // centre: all 20 counted
  });

  it('N = 50 Kamb: a cell with the uniform count E = 7.627 reads 3.000σ, the old convention 0 (methods.md §3.2, computed here)', () => {
    const lines = randomLines(50, 1);
    const kamb = densityGrid(lines, { method: 'kamb', net: 'equal-area', cells: 10 });
    const above = densityGrid(lines, {
      method: 'kamb',
      net: 'equal-area',
      cells: 10,
      units: 'sigma-above-uniform',
    });
    const ratio = densityGrid(lines, {
      method: 'kamb',
      net: 'equal-area',
      cells: 10,
      units: 'multiples-of-uniform',
    });
    for (let g = 0; g < kamb.values.length; g++) {
      expectClose(kamb.values[g] - above.values[g], 3, 1e-9); // the two conventions differ by E/σ = 3
      expectClose(ratio.values[g], (kamb.values[g] * kamb.sigma) / kamb.expected, 1e-12);
    }
    expectClose(kamb.expected / kamb.sigma, 7.627 / 2.542, 0.001);
    expect(above.uniformValue).toBe(0);
    expectClose(ratio.uniformValue, 1, 1e-12);
  });

  it('names the units on the legend (issue 10 wording; Kamb 1959, Vollmer 1995)', () => {
    const lines = randomLines(30, 4);
    const grid = densityGrid(lines, { method: 'kamb', net: 'equal-area', cells: 8 });
    expect(densityLegend(grid)).toBe('multiples of σ, Kamb 1959; uniform = 3σ');
    expect(densityLegend({ method: 'exponential', units: 'multiples-of-sigma' })).toBe(
      'multiples of σ, exponential kernel, Vollmer 1995; uniform = 3σ',
    );
    expect(densityLegend({ method: 'kamb', units: 'sigma-above-uniform' })).toBe(
      'σ above uniform, Kamb 1959; uniform = 0σ',
    );
    expect(densityLegend({ method: 'kamb', units: 'multiples-of-uniform' })).toBe(
      'multiples of uniform, Kamb 1959; uniform = 1',
    );
    // Weights move E/σ off 3, and the legend states the grid's own uniform value. Kamb, N = 2, weights 1
    // and 3: A = 9/11, E = 4·9/11, σ = √(10·(9/11)·(2/11)) = √180/11, E/σ = 36/√180 = 2.683 [computed here].
    const weighted = densityGrid(lines.slice(0, 2), {
      method: 'kamb',
      net: 'equal-area',
      cells: 8,
      weights: [1, 3],
    });
    expectClose(weighted.uniformValue, 36 / Math.sqrt(180), 1e-12);
    expect(densityLegend(weighted)).toBe('multiples of σ, Kamb 1959; uniform = 2.7σ');
  });

  it('rejects unknown units', () => {
    expect(() =>
      densityGrid([{ trend: 0, plunge: 0 }], {
        method: 'kamb',
        net: 'equal-area',
        cells: 4,
        units: 'percent' as never,
      }),
    ).toThrow(RangeError);
  });
});

describe('density grid layout', () => {
  it('peaks where the poles are, row 0 at the north, column 0 at the west', () => {
    const pole: Line = { trend: 310, plunge: 40 };
    const grid = densityGrid([pole, pole, pole], { method: 'exponential', net: 'equal-area', cells: 50 });
    let best = 0;
    for (let g = 1; g < grid.values.length; g++) if (grid.values[g] > grid.values[best]) best = g;
    const p = project(pole, 'equal-area');
    const x = -1 + ((best % 50) + 0.5) / 25;
    const y = 1 - (Math.floor(best / 50) + 0.5) / 25;
    expect(Math.hypot(x - p.x, y - p.y)).toBeLessThan(0.03);
  });

  it('a horizontal pole (axial) is dense on both rims, east and west', () => {
    const grid = densityGrid([{ trend: 90, plunge: 0 }], { method: 'kamb', net: 'equal-area', cells: 20 });
    const east = grid.values[19 + 10 * 20];
    const west = grid.values[0 + 10 * 20];
    const north = grid.values[10 + 0 * 20];
    expect(east).toBeCloseTo(west, 12);
    expect(east).toBeGreaterThan(north);
  });

  it('weights count: a pole of weight 3 equals three copies', () => {
    const a = densityGrid(
      [
        { trend: 10, plunge: 20 },
        { trend: 200, plunge: 60 },
      ],
      {
        method: 'exponential',
        net: 'equal-area',
        cells: 12,
        weights: [3, 1],
      },
    );
    const lines = [
      { trend: 10, plunge: 20 },
      { trend: 10, plunge: 20 },
      { trend: 10, plunge: 20 },
      { trend: 200, plunge: 60 },
    ];
    const b = bareLoop(lines, 'exponential', 'equal-area', 12);
    // same kernel only if k is the same: k follows the number of poles, so compare shapes through k(2)
    const k2 = exponentialK(2);
    const nodes = densityNodes('equal-area', 12);
    for (let g = 0; g < b.length; g++) {
      const v1 = lineToVector(lines[0]);
      const v2 = lineToVector(lines[3]);
      const c1 = Math.abs(v1[0] * nodes[3 * g] + v1[1] * nodes[3 * g + 1] + v1[2] * nodes[3 * g + 2]);
      const c2 = Math.abs(v2[0] * nodes[3 * g] + v2[1] * nodes[3 * g + 1] + v2[2] * nodes[3 * g + 2]);
      const raw = 3 * Math.exp(k2 * (c1 - 1)) + Math.exp(k2 * (c2 - 1));
      expectClose(rawDensity(a, a.values[g]), raw, 1e-9);
    }
  });

  it('rejects a bad grid size and an empty list', () => {
    expect(() =>
      densityGrid([{ trend: 0, plunge: 0 }], { method: 'kamb', net: 'equal-area', cells: 1 }),
    ).toThrow(RangeError);
    expect(() => densityGrid([], { method: 'kamb', net: 'equal-area', cells: 10 })).toThrow('No poles given');
  });
});

describe('contours (d3-contour)', () => {
  it('encloses the dense spot in net coordinates', () => {
    const pole: Line = { trend: 130, plunge: 50 };
    const lines = Array.from({ length: 20 }, () => pole);
    const grid = densityGrid(lines, { method: 'exponential', net: 'equal-area', cells: 60 });
    const [c] = densityContours(grid, [6]);
    expect(c.level).toBe(6);
    expect(c.polygons.length).toBeGreaterThan(0);
    const ring = c.polygons[0][0];
    const cx = ring.reduce((s, p) => s + p[0], 0) / ring.length;
    const cy = ring.reduce((s, p) => s + p[1], 0) / ring.length;
    const p = project(pole, 'equal-area');
    expect(Math.hypot(cx - p.x, cy - p.y)).toBeLessThan(0.03);
    for (const [x, y] of ring) {
      expect(Math.abs(x)).toBeLessThanOrEqual(1);
      expect(Math.abs(y)).toBeLessThanOrEqual(1);
    }
  });
});
