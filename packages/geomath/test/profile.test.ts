import fc from 'fast-check';
import {
  RatingError,
  planeCrossings,
  polygonArea,
  profileOutline,
  stageCrossings,
  stagePart,
  stageParts,
} from '../src/index.js';
import type { ProfileShape } from '../src/index.js';
import { expectClose } from './asserts.js';

const relative = (actual: number, expected: number): number => Math.abs(actual - expected) / expected;

describe('profile outlines: areas against closed forms (common practice: πr², w·h; the rest computed here)', () => {
  it('rectangle 6 × 4.5 m: 27 m² exactly, four corners', () => {
    const o = profileOutline({ shape: 'rectangular', width: 6, height: 4.5 });
    expect(o.points).toEqual([
      [-3, 0],
      [3, 0],
      [3, 4.5],
      [-3, 4.5],
    ]);
    expect(o.area).toBe(27);
  });

  it('circle of width 10: area πr² = 78.54 m² within 0.1 %; the inscribed polygon exactly (n/2)r²·sin(2π/n)', () => {
    const o = profileOutline({ shape: 'circular', width: 10, height: 10 });
    expect(o.height).toBe(10);
    expect(relative(o.area, Math.PI * 25)).toBeLessThan(1e-3);
    const n = o.points.length;
    expect(n).toBe(128);
    expectClose(o.area, (n / 2) * 25 * Math.sin((2 * Math.PI) / n), 1e-9);
    const fine = profileOutline({ shape: 'circular', width: 10, height: 0.1 }, { segments: 2048 });
    expect(relative(fine.area, Math.PI * 25)).toBeLessThan(2e-6); // the height of a circle is its width
    // every vertex on the circle centred at (0, r)
    for (const [x, y] of o.points) expectClose(Math.hypot(x, y - 5), 5, 1e-12);
  });

  it('D-shaped 8 × 7 m: walls 3 m under a half-circle of radius 4, area 2·4·3 + π·16/2 [computed here]', () => {
    const o = profileOutline({ shape: 'd-shaped', width: 8, height: 7 }, { segments: 1024 });
    expect(relative(o.area, 24 + 8 * Math.PI)).toBeLessThan(1e-5);
    expect(o.points).toContainEqual([4, 3]);
    expect(o.points).toContainEqual([-4, 3]);
    const top = Math.max(...o.points.map((p) => p[1]));
    expectClose(top, 7, 1e-12);
    // A low D (height under half the width) is a half-ellipse on the invert: π·w·h/2.
    const low = profileOutline({ shape: 'd-shaped', width: 8, height: 2 }, { segments: 1024 });
    expect(relative(low.area, (Math.PI * 4 * 2) / 2)).toBeLessThan(1e-5);
  });

  it('horseshoe 10 × 9 m: crown π·5·5/2 plus walls 2·(s/6)(1.7·foot + 4.3·w) = 76.437 m² [computed here]', () => {
    // Walls: quadratic Bézier (foot, 0) → control (w, 0.35 s) → (w, s), s = 4, foot = 3.75, w = 5;
    // ∫x dy along it by Simpson's rule, exact for its cubic integrand: (s/6)(1.7·foot + 4.3·w).
    const w = 5;
    const s = 4;
    const foot = 3.75;
    const expected = (Math.PI * w * 5) / 2 + 2 * (s / 6) * (1.7 * foot + 4.3 * w);
    expectClose(expected, 76.4366, 5e-5);
    const o = profileOutline({ shape: 'horseshoe', width: 10, height: 9 }, { segments: 2048 });
    expect(relative(o.area, expected)).toBeLessThan(1e-5);
    expect(o.points[0]).toEqual([-3.75, 0]);
    expect(o.points[1]).toEqual([3.75, 0]);
    expect(o.points).toContainEqual([5, 4]);
  });

  it('every outline is a counter-clockwise ring of positive area, symmetric about the centre line', () => {
    fc.assert(
      fc.property(
        fc.constantFrom<ProfileShape>('circular', 'horseshoe', 'd-shaped', 'rectangular'),
        fc.double({ min: 2, max: 20, noNaN: true }),
        fc.double({ min: 2, max: 20, noNaN: true }),
        (shape, width, height) => {
          const o = profileOutline({ shape, width, height });
          expect(o.area).toBeGreaterThan(0);
          expectClose(polygonArea(o.points), o.area, 1e-12);
          const xs = o.points.map((p) => p[0]);
          expectClose(Math.max(...xs), width / 2, 1e-9);
          expectClose(Math.min(...xs), -width / 2, 1e-9);
          const ys = o.points.map((p) => p[1]);
          expectClose(Math.min(...ys), 0, 1e-9);
          expectClose(Math.max(...ys), o.height, 1e-9 * o.height);
          // mirror symmetry: the mirrored ring has the same area
          expectClose(polygonArea(o.points.map(([x, y]) => [-x, y] as [number, number])), -o.area, 1e-9);
        },
      ),
    );
  });

  it('refuses bad sizes, shapes and segment counts', () => {
    expect(() => profileOutline({ shape: 'rectangular', width: 0, height: 4 })).toThrow(RatingError);
    expect(() => profileOutline({ shape: 'horseshoe', width: 5, height: Number.NaN })).toThrow(RatingError);
    expect(() => profileOutline({ shape: 'oval' as never, width: 5, height: 4 })).toThrow('not known');
    expect(() => profileOutline({ shape: 'circular', width: 5, height: 5 }, { segments: 3 })).toThrow(
      RangeError,
    );
  });
});

describe('stage parts of the profile (top heading above the bench line, bench, invert; common practice)', () => {
  const circle = { shape: 'circular' as const, width: 10, height: 10, axisHeight: 5 };

  it('circle r = 5: top heading above the axis is a half circle; the invert below 1 m a segment', () => {
    const [top, bench, invert] = stageParts(
      { ...circle, invertLine: 1 },
      ['top-heading', 'bench', 'invert'],
      {
        segments: 2048,
      },
    );
    expect(relative(top.area, (Math.PI * 25) / 2)).toBeLessThan(1e-5);
    expect(top).toMatchObject({ bottom: 5, top: 10, crownHeight: 5, invertDepth: 0 });
    expectClose(top.halfWidth, 5, 1e-12);
    // circular segment of height 1: r²·acos((r − h)/r) − (r − h)·√(2rh − h²) = 25·acos 0.8 − 12 [computed here]
    expect(relative(invert.area, 25 * Math.acos(0.8) - 12)).toBeLessThan(1e-4);
    expect(invert).toMatchObject({ bottom: 0, top: 1, crownHeight: -4, invertDepth: 5 });
    expectClose(invert.halfWidth, 3, 1e-4); // chord half-width √(2·5·1 − 1) = 3, on the polygon
    expect(bench).toMatchObject({ bottom: 1, top: 5, crownHeight: 0, invertDepth: 4 });
    const full = stagePart(circle, 'full-face', { segments: 2048 });
    expectClose(top.area + bench.area + invert.area, full.area, 1e-9);
    expect(full).toMatchObject({ crownHeight: 5, invertDepth: 5 });
  });

  it('rectangle 6 × 5, axis 2.5, bench line 3.2: top heading 6 × 1.8 m exactly', () => {
    const input = { shape: 'rectangular' as const, width: 6, height: 5, axisHeight: 2.5, benchLine: 3.2 };
    const top = stagePart(input, 'top-heading');
    expectClose(top.area, 6 * 1.8, 1e-12);
    expectClose(top.crownHeight, 2.5, 1e-12);
    expectClose(top.invertDepth, -0.7, 1e-12); // the top heading's floor is 0.7 m above the axis
    const bench = stagePart(input, 'bench');
    expectClose(bench.area, 6 * 3.2, 1e-12);
    expectClose(bench.crownHeight, 0.7, 1e-12);
  });

  it('the parts of every shape add up to the whole (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom<ProfileShape>('circular', 'horseshoe', 'd-shaped', 'rectangular'),
        fc.double({ min: 3, max: 15, noNaN: true }),
        fc.double({ min: 3, max: 15, noNaN: true }),
        fc.double({ min: 0.2, max: 0.8, noNaN: true }),
        fc.double({ min: 0.05, max: 0.9, noNaN: true }),
        (shape, width, height, benchShare, invertShare) => {
          const h = shape === 'circular' ? width : height;
          const benchLine = benchShare * h;
          const input = {
            shape,
            width,
            height,
            axisHeight: h / 2,
            benchLine,
            invertLine: invertShare * benchLine,
          };
          const parts = stageParts(input, ['top-heading', 'bench', 'invert']);
          const whole = stagePart(input, 'full-face');
          expectClose(
            parts.reduce((s, p) => s + p.area, 0),
            whole.area,
            1e-9 * whole.area,
          );
        },
      ),
    );
  });

  it('refuses an invert stage without its line, and lines outside the profile', () => {
    expect(() => stagePart(circle, 'invert')).toThrow('needs its top line');
    expect(() => stagePart({ ...circle, benchLine: 12 }, 'top-heading')).toThrow(RatingError);
    expect(() => stagePart({ ...circle, benchLine: 4, invertLine: 4 }, 'bench')).toThrow(RatingError);
    expect(() => stagePart({ ...circle, axisHeight: 11 }, 'bench')).toThrow('axis height');
    expect(() => stagePart(circle, 'heading' as never)).toThrow('not known');
  });

  it('stageCrossings: the top heading crossings equal planeCrossings with the same heights (methods.md §6)', () => {
    const face = {
      plane: { dipDirection: 240, dip: 60 },
      chainage: 1000,
      offset: { right: 2, up: 1 },
      drive: { trend: 60, plunge: 0 },
    };
    const top = stagePart(circle, 'top-heading');
    const a = stageCrossings(face, top);
    const b = planeCrossings({ ...face, crownHeight: 5, invertDepth: 0, halfWidth: top.halfWidth });
    expect(a).toEqual(b);
    expectClose(a.crown, 1002.309, 0.0005); // methods.md §6 example A, crown [computed there]
    // The invert stage's top lies below the axis: a negative crownHeight is accepted here.
    const invert = stagePart({ ...circle, invertLine: 1 }, 'invert');
    const c = stageCrossings(face, invert);
    // crown of the part 4 m below the axis: t = n·(P − Q0)/(n·a) with Q0 = −4·up (§6) [computed here]
    const full = planeCrossings({ ...face, crownHeight: 5, invertDepth: 4, halfWidth: 5 });
    expectClose(c.crown, full.invert, 1e-9);
    expect(() => stageCrossings(face, { crownHeight: -3, invertDepth: 1, halfWidth: 1 })).toThrow(
      RatingError,
    );
  });
});
