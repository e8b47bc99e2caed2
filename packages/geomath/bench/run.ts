// Benchmark for issue 3: `npm run bench -w @roundbook/geomath`. Not a test: it prints figures and ratios
// measured in this one run and asserts nothing about time.
import { geoAzimuthalEqualArea, geoStereographic } from 'd3-geo';
import { densityNodes } from '../src/density.js';
import { densityGrid, exponentialK, findSets, lineToVector, project, rawDensity } from '../src/index.js';
import type { Line } from '../src/index.js';
import { randomLines } from '../test/random.js';
import { scatteredSet } from '../test/sets-data.js';

const now = (): number => performance.now();
const mb = (bytes: number): string => `${(bytes / 1024 / 1024).toFixed(2)} MB`;
const fmt = (ms: number): string => (ms >= 1000 ? `${(ms / 1000).toFixed(2)} s` : `${ms.toFixed(1)} ms`);

/** Best of `runs` timings of fn (ms); the first call also warms up the JIT. */
function best(runs: number, fn: () => number): { ms: number; check: number } {
  let ms = Number.POSITIVE_INFINITY;
  let check = 0;
  for (let r = 0; r < runs; r++) {
    const t = now();
    check = fn();
    ms = Math.min(ms, now() - t);
  }
  return { ms, check };
}

function benchProject(): void {
  const count = 1_000_000;
  const lines = randomLines(count, 42);
  const pairs = lines.map((l): [number, number] => [l.trend, l.plunge]);
  const ea = geoAzimuthalEqualArea()
    .rotate([0, -90])
    .scale(1 / Math.SQRT2)
    .translate([0, 0]);
  const st = geoStereographic().rotate([0, -90]).scale(1).translate([0, 0]).clipAngle(90);
  console.log(`\nproject: ${count.toLocaleString('en')} lines, best of 7 interleaved runs each`);
  for (const [net, d3] of [
    ['equal-area', ea],
    ['equal-angle', st],
  ] as const) {
    // interleaved so that both see the same machine load; best of 7 each
    let ours = { ms: Number.POSITIVE_INFINITY, check: 0 };
    let theirs = { ms: Number.POSITIVE_INFINITY, check: 0 };
    for (let run = 0; run < 7; run++) {
      const a = best(1, () => {
        let s = 0;
        for (let i = 0; i < count; i++) {
          const p = project(lines[i], net);
          s += p.x + p.y;
        }
        return s;
      });
      const b = best(1, () => {
        let s = 0;
        for (let i = 0; i < count; i++) {
          const p = d3(pairs[i]);
          if (p) s += p[0] + p[1];
        }
        return s;
      });
      if (a.ms < ours.ms) ours = a;
      if (b.ms < theirs.ms) theirs = b;
    }
    const perOurs = (ours.ms * 1e6) / count;
    const perTheirs = (theirs.ms * 1e6) / count;
    console.log(
      `  ${net.padEnd(11)} project ${fmt(ours.ms)} (${perOurs.toFixed(1)} ns/line)   d3-geo ${fmt(theirs.ms)} ` +
        `(${perTheirs.toFixed(1)} ns/line)   ratio ${(theirs.ms / ours.ms).toFixed(2)}×   ` +
        `checksums ${ours.check.toFixed(6)} / ${theirs.check.toFixed(6)}`,
    );
  }
}

/** Every pole–node kernel evaluation, no cut-off, no binning (the reference). */
function bareDensity(lines: Line[], cells: number): Float64Array {
  const nodes = densityNodes('equal-area', cells);
  const n = lines.length;
  const xyz = new Float64Array(3 * n);
  lines.forEach((l, i) => xyz.set(lineToVector(l), 3 * i));
  const k = exponentialK(n);
  const out = new Float64Array(cells * cells);
  for (let g = 0; g < out.length; g++) {
    const gx = nodes[3 * g];
    const gy = nodes[3 * g + 1];
    const gz = nodes[3 * g + 2];
    let s = 0;
    for (let i = 0; i < 3 * n; i += 3) {
      s += Math.exp(k * (Math.abs(xyz[i] * gx + xyz[i + 1] * gy + xyz[i + 2] * gz) - 1));
    }
    out[g] = s;
  }
  return out;
}

function fourSets(): Line[] {
  return [
    ...scatteredSet({ trend: 310, plunge: 40 }, 5000, 12, 1),
    ...scatteredSet({ trend: 30, plunge: 10 }, 5000, 10, 2),
    ...scatteredSet({ trend: 160, plunge: 70 }, 5000, 15, 3),
    ...scatteredSet({ trend: 220, plunge: 15 }, 5000, 8, 4),
  ];
}

function benchDensity(): number {
  const poles = fourSets();
  const cells = 100;
  console.log(
    `\ndensityGrid: ${poles.length.toLocaleString('en')} poles (4 sets), ${cells} × ${cells} cells, exponential kernel`,
  );
  const before = process.memoryUsage();
  let grid = densityGrid(poles, { method: 'exponential', net: 'equal-area', cells });
  const after = process.memoryUsage();
  const fast = best(5, () => {
    grid = densityGrid(poles, { method: 'exponential', net: 'equal-area', cells });
    return grid.values[0];
  });
  const t = now();
  const bare = bareDensity(poles, cells);
  const bareMs = now() - t;
  let worstPeak = 0;
  let worstE = 0;
  let peak = 0;
  for (let g = 0; g < bare.length; g++) peak = Math.max(peak, bare[g]);
  for (let g = 0; g < bare.length; g++) {
    const raw = rawDensity(grid, grid.values[g]);
    const d = Math.abs(raw - bare[g]);
    worstPeak = Math.max(worstPeak, d / peak);
    worstE = Math.max(worstE, d / Math.max(Math.abs(bare[g]), grid.expected));
  }
  const n = poles.length;
  const analytic = 4 * n * 8 + 2 * n * 4 * 8 + 2 * n * 4 + 3 * cells * cells * 8 + cells * cells * 8;
  console.log(
    `  densityGrid ${fmt(fast.ms)}   bare loop ${fmt(bareMs)} (${(n * cells * cells).toLocaleString('en')} kernel evaluations)   ` +
      `ratio ${(bareMs / fast.ms).toFixed(1)}×`,
  );
  console.log(
    `  largest difference: ${worstE.toExponential(2)} relative to max(|value|, E = ${grid.expected.toFixed(3)}), ` +
      `${worstPeak.toExponential(2)} relative to the peak ${peak.toFixed(1)}`,
  );
  console.log(
    `  memory: typed arrays of one call ${mb(analytic)} by count (poles 4 × N, binned copies 4 × 2N, cell index, ` +
      `node vectors, values); process.memoryUsage().arrayBuffers grew ` +
      `${mb(after.arrayBuffers - before.arrayBuffers)} during the first call`,
  );
  return fast.ms;
}

function benchSets(densityMs: number): void {
  const poles = fourSets();
  console.log(`\nfindSets: ${poles.length.toLocaleString('en')} poles in 4 sets`);
  let result = findSets(poles);
  const timed = best(3, () => {
    result = findSets(poles);
    return result.sets.length;
  });
  console.log(
    `  findSets ${fmt(timed.ms)}   ratio to one densityGrid call ${(timed.ms / densityMs).toFixed(2)}×   ` +
      `sets ${result.sets.length}: ${result.sets
        .map(
          (s) =>
            `${s.mean.trend.toFixed(1)}/${s.mean.plunge.toFixed(1)} (${s.members.length}, k ${s.k.toFixed(1)}, α95 ${s.alpha95.toFixed(2)}°)`,
        )
        .join(', ')}; unassigned ${result.unassigned.length}`,
  );
}

console.log(`@roundbook/geomath benchmark — Node ${process.version}, ${new Date().toISOString()}`);
benchProject();
const densityMs = benchDensity();
benchSets(densityMs);
