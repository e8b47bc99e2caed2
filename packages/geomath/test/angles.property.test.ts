import fc from 'fast-check';
import {
  angleBetweenLines,
  angleBetweenPlanes,
  intersectionOf,
  planeNormal,
  lineToVector,
} from '../src/index.js';

const plane = fc.record({
  dipDirection: fc.double({ min: 0, max: 360, maxExcluded: true, noNaN: true }),
  dip: fc.double({ min: 0, max: 90, noNaN: true }),
});
const line = fc.record({
  trend: fc.double({ min: 0, max: 360, maxExcluded: true, noNaN: true }),
  plunge: fc.double({ min: 0, max: 90, noNaN: true }),
});

describe('geometry properties', () => {
  it('the intersection lies on both planes (n·l = 0 within 1e-6)', () => {
    fc.assert(
      fc.property(plane, plane, (a, b) => {
        const l = intersectionOf(a, b);
        if (l === null) {
          expect(angleBetweenPlanes(a, b)).toBeLessThan(1e-6);
          return;
        }
        const v = lineToVector(l);
        const na = planeNormal(a);
        const nb = planeNormal(b);
        expect(Math.abs(v[0] * na[0] + v[1] * na[1] + v[2] * na[2])).toBeLessThan(1e-6);
        expect(Math.abs(v[0] * nb[0] + v[1] * nb[1] + v[2] * nb[2])).toBeLessThan(1e-6);
        expect(l.plunge).toBeGreaterThanOrEqual(0);
      }),
      { numRuns: 2000 },
    );
  });

  it('angles between lines are symmetric and in [0, 90]', () => {
    fc.assert(
      fc.property(line, line, (a, b) => {
        const ab = angleBetweenLines(a, b);
        expect(ab).toBe(angleBetweenLines(b, a));
        expect(ab).toBeGreaterThanOrEqual(0);
        expect(ab).toBeLessThanOrEqual(90);
        expect(angleBetweenLines(a, a)).toBeLessThan(1e-6);
      }),
      { numRuns: 2000 },
    );
  });

  it('angles between planes are symmetric, in [0, 90], and equal the angle between their poles', () => {
    fc.assert(
      fc.property(plane, plane, (a, b) => {
        const ab = angleBetweenPlanes(a, b);
        expect(ab).toBe(angleBetweenPlanes(b, a));
        expect(ab).toBeGreaterThanOrEqual(0);
        expect(ab).toBeLessThanOrEqual(90);
        const c = Math.abs(planeNormal(a).reduce((s, x, i) => s + x * planeNormal(b)[i], 0));
        expect(Math.abs(Math.cos((ab * Math.PI) / 180) - Math.min(1, c))).toBeLessThan(1e-9);
      }),
      { numRuns: 2000 },
    );
  });
});
