import { geoCentroid, geoDistance } from 'd3-geo';
import { OrientationError, angleBetweenLines, fisherStatistics, terzaghiWeight } from '../src/index.js';
import type { Line } from '../src/index.js';
import { expectAzimuthClose, expectClose } from './asserts.js';
import { seededRandom } from './random.js';

// Wessel, Data Analysis course notes (SOEST, Univ. Hawai'i), ch. 9, example 1: six directions (D, I)
// [source, seen]. Declination D is read as trend, inclination I as plunge.
const wessel: Line[] = [
  [105, 40],
  [130, 49],
  [115, 57],
  [120, 32],
  [118, 55],
  [145, 45],
].map(([trend, plunge]) => ({ trend, plunge }));

describe('Fisher statistics (Fisher 1953; methods.md §3.1)', () => {
  const f = fisherStatistics(wessel);

  it('Wessel ch. 9 example 1: R = 5.86, R̄ = 0.977, D̄ = 122.1° (published, to their last digit)', () => {
    // Wessel, Data Analysis course notes, ch. 9 [source, seen]
    expectClose(f.resultantLength, 5.86, 0.005);
    expectClose(f.resultantLength / f.count, 0.977, 0.0005);
    expectAzimuthClose(f.mean.trend, 122.1, 0.05);
    expect(f.count).toBe(6);
  });

  it('the same data: Ī = 47.07°, R = 5.86275, k = 36.43, α95 = 11.25° (computed here)', () => {
    // methods.md §3.1: the notes' Ī = 45.7° divides by N instead of R and is not used here.
    expectClose(f.mean.plunge, 47.07, 0.005);
    expectClose(f.resultantLength, 5.86275, 5e-6);
    expectClose(f.k, 36.43, 0.005);
    expectClose(f.alpha95, 11.25, 0.005);
  });

  it('the same data: ψ to (120, 45) is 2.53° (Wessel ch. 9 [source, seen]) and d3-geo geoDistance agrees', () => {
    const psi = angleBetweenLines(f.mean, { trend: 120, plunge: 45 });
    expectClose(psi, 2.53, 0.005);
    const d3 = (geoDistance([f.mean.trend, f.mean.plunge], [120, 45]) * 180) / Math.PI;
    expectClose(psi, d3, 1e-9);
  });

  it('the mean direction equals d3-geo geoCentroid of the points (vector resultant)', () => {
    const [lon, lat] = geoCentroid({
      type: 'MultiPoint',
      coordinates: wessel.map((l) => [l.trend, l.plunge]),
    });
    expectAzimuthClose(f.mean.trend, lon, 1e-9);
    expectClose(f.mean.plunge, lat, 1e-9);
  });

  it('exact α95 from cos α95 = 1 − ((N − R)/R)(20^(1/(N−1)) − 1), independent arithmetic', () => {
    const n = 6;
    const r = f.resultantLength;
    const expected = (Math.acos(1 - ((n - r) / r) * (Math.pow(20, 1 / (n - 1)) - 1)) * 180) / Math.PI;
    expectClose(f.alpha95, expected, 1e-9);
    expectClose(f.k, (n - 1) / (n - r), 1e-9);
  });

  it('integer weights are the same as repeating the data', () => {
    const weights = [1, 2, 3, 1, 1, 2];
    const repeated = wessel.flatMap((l, i) => Array.from({ length: weights[i] }, () => l));
    const a = fisherStatistics(wessel, { weights });
    const b = fisherStatistics(repeated);
    expectClose(a, { ...b, mean: b.mean }, 1e-9);
  });

  it('axial data: antipodal copies of lines give the same mean, R and k', () => {
    const rnd = seededRandom(5);
    const set: Line[] = Array.from({ length: 30 }, () => ({
      trend: 200 + 10 * rnd(),
      plunge: 2 + 6 * rnd(),
    }));
    const flipped = set.map((l, i) =>
      i % 3 === 0 ? { trend: (l.trend + 180) % 360, plunge: -l.plunge } : l,
    );
    const a = fisherStatistics(set, { axial: true });
    const b = fisherStatistics(flipped, { axial: true });
    expect(angleBetweenLines(a.mean, b.mean)).toBeLessThan(1e-9);
    expectClose(a.resultantLength, b.resultantLength, 1e-9);
    // taken as directions, the same flipped data lose most of their resultant
    expect(fisherStatistics(flipped).resultantLength).toBeLessThan(b.resultantLength * 0.5);
  });

  it('identical lines have k = ∞ and α95 = 0; fewer than two lines are refused', () => {
    const same = fisherStatistics([
      { trend: 10, plunge: 20 },
      { trend: 10, plunge: 20 },
    ]);
    expect(same.k).toBe(Number.POSITIVE_INFINITY);
    expect(same.alpha95).toBe(0);
    expect(() => fisherStatistics([{ trend: 10, plunge: 20 }])).toThrow(OrientationError);
    expect(() => fisherStatistics(wessel, { weights: [1] })).toThrow('one weight per orientation');
  });
});

describe('Terzaghi weights (Terzaghi 1965; methods.md §3.3, computed here)', () => {
  const axis: Line = { trend: 60, plunge: 0 };
  /** A pole at angle δ from the sampling axis. */
  const at = (delta: number): Line => ({ trend: 60, plunge: delta });

  it.each([
    [0, 1],
    [30, 1.155],
    [60, 2.0],
    [80, 5.759],
    [84.26, 9.999],
    [89, 10],
  ])('δ = %d° weighs %d', (delta, w) => {
    expectClose(terzaghiWeight(at(delta), axis), w, 0.0005);
  });

  it('the cap is 10 by default and can be set; a pole across the axis weighs the cap', () => {
    expect(terzaghiWeight({ trend: 150, plunge: 0 }, axis)).toBe(10);
    expect(terzaghiWeight(at(80), axis, 3)).toBe(3);
    expectClose(terzaghiWeight(at(60), { trend: 240, plunge: 0 }), 2, 1e-12); // sign of the axis is irrelevant
  });
});
