import fc from 'fast-check';
import { angleBetweenLines, project, unproject } from '../src/index.js';

const line = fc.record({
  trend: fc.double({ min: 0, max: 360, maxExcluded: true, noNaN: true }),
  plunge: fc.double({ min: 0, max: 90, noNaN: true }),
});
const net = fc.constantFrom('equal-area' as const, 'equal-angle' as const);
const radius = fc.double({ min: 0.01, max: 1000, noNaN: true });

describe('unproject ∘ project is the identity', () => {
  it('for any line, net and radius (angular error below 1e-6°)', () => {
    fc.assert(
      fc.property(line, net, radius, (l, n, r) => {
        const back = unproject(project(l, n, r), n, r);
        expect(angleBetweenLines(back, l)).toBeLessThan(1e-6);
        expect(back.plunge).toBeGreaterThanOrEqual(0);
        expect(back.plunge).toBeLessThanOrEqual(90);
      }),
      { numRuns: 5000 },
    );
  });

  it('project ∘ unproject is the identity inside the primitive', () => {
    const point = fc
      .record({
        a: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
        s: fc.double({ min: 0, max: 1, noNaN: true }),
      })
      .map(({ a, s }) => ({ x: s * Math.sin(a), y: s * Math.cos(a) }));
    fc.assert(
      fc.property(point, net, (p, n) => {
        const q = project(unproject(p, n), n);
        expect(Math.hypot(q.x - p.x, q.y - p.y)).toBeLessThan(1e-9);
      }),
      { numRuns: 5000 },
    );
  });
});
