import { geoCentroid, geoDistance } from 'd3-geo';
import {
  OrientationError,
  TERZAGHI_SAMPLING_LABELS,
  angleBetweenLines,
  fisherStatistics,
  findSets,
  terzaghiWeight,
  terzaghiWeightFor,
  terzaghiWeights,
} from '../src/index.js';
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

describe('Terzaghi weights by sampling geometry (Terzaghi 1965, from memory; Priest 1993 ch. 4, from memory; methods.md §3.3)', () => {
  const drive: Line = { trend: 60, plunge: 0 };
  /** A pole at angle θ from the drive (the face normal), in the vertical plane of the drive. */
  const at = (theta: number): Line => ({ trend: 60, plunge: theta });

  // Planar window (one face): w = 1/sin θ; the sheet's numbers with α = 90° − δ [computed here].
  it.each([
    [90, 1],
    [60, 1.155],
    [30, 2.0],
    [10, 5.759],
    [5.74, 9.999],
    [1, 10],
  ])('planar window: θ = %d° from the face normal weighs %d', (theta, w) => {
    expectClose(terzaghiWeightFor(at(theta), 'planar-window', drive), w, 0.0005);
  });

  it('scanline (the axis as the line) gives the old terzaghiWeight: w = 1/|cos δ|', () => {
    for (const delta of [0, 30, 60, 80, 84.26, 89]) {
      expect(terzaghiWeightFor(at(delta), 'scanline', drive)).toBe(terzaghiWeight(at(delta), drive));
    }
  });

  it('a set parallel to the face (pole along the drive) is sampled worst by a face and best by the axis', () => {
    const poleAlongDrive: Line = { trend: 240, plunge: 0 }; // set 060/90, strike across the tunnel
    expect(terzaghiWeightFor(poleAlongDrive, 'planar-window', drive)).toBe(10); // capped
    expectClose(terzaghiWeightFor(poleAlongDrive, 'scanline', drive), 1, 1e-12);
    const poleAcross: Line = { trend: 150, plunge: 0 }; // set 330/90 contains the axis
    expectClose(terzaghiWeightFor(poleAcross, 'planar-window', drive), 1, 1e-12);
    expect(terzaghiWeightFor(poleAcross, 'scanline', drive)).toBe(10);
  });

  it('a climbing drive (negative plunge) is the same axis; the cap can be set', () => {
    const climbing: Line = { trend: 60, plunge: -5 };
    const pole: Line = { trend: 100, plunge: 30 };
    const descending: Line = { trend: 240, plunge: 5 };
    expectClose(
      terzaghiWeightFor(pole, 'planar-window', climbing),
      terzaghiWeightFor(pole, 'planar-window', descending),
      1e-12,
    );
    expect(terzaghiWeightFor(at(5), 'planar-window', drive, 3)).toBe(3);
    expect(() => terzaghiWeightFor(at(5), 'planar-window', drive, 0.5)).toThrow(RangeError);
    expect(() => terzaghiWeightFor(at(5), 'window' as never, drive)).toThrow(RangeError);
  });

  it('terzaghiWeights returns the sampling used, its label and the capped poles', () => {
    const t = terzaghiWeights([at(90), at(30), at(0.5)], { sampling: 'planar-window', direction: drive });
    expect(t.sampling).toBe('planar-window');
    expect(t.label).toBe(TERZAGHI_SAMPLING_LABELS['planar-window']);
    expect(t.label).toContain('planar window (one face)');
    expect(t.cap).toBe(10);
    expectClose(t.weights, [1, 2, 10], 1e-9); // 1/sin 90, 1/sin 30, capped [computed here]
    expect(t.capped).toEqual([2]);
  });

  it('fisherStatistics and findSets state the weighting they used', () => {
    const poles = wessel.map((l) => ({ ...l }));
    const weighted = fisherStatistics(poles, {
      axial: true,
      terzaghi: { sampling: 'scanline', direction: drive },
    });
    expect(weighted.weighting).toEqual({
      method: 'terzaghi',
      sampling: 'scanline',
      label: TERZAGHI_SAMPLING_LABELS.scanline,
      cap: 10,
    });
    const same = fisherStatistics(poles, {
      axial: true,
      weights: poles.map((p) => terzaghiWeight(p, drive)),
    });
    expectClose(weighted.mean, same.mean, 1e-12);
    expectClose(weighted.k, same.k, 1e-9);
    expect(same.weighting).toBeUndefined();
    expect(() =>
      fisherStatistics(poles, {
        weights: [1, 1, 1, 1, 1, 1],
        terzaghi: { sampling: 'scanline', direction: drive },
      }),
    ).toThrow(OrientationError);
    const sets = findSets(poles, { terzaghi: { sampling: 'planar-window', direction: drive } });
    expect(sets.weighting?.sampling).toBe('planar-window');
    expect(findSets(poles).weighting).toBeUndefined();
  });
});
