import fc from 'fast-check';
import { intersect } from 'mathjs';
import { planeCrossings } from '../src/rock-mass.js';
import type { PlaneCrossings } from '../src/rock-mass.js';

/** Uniform over [min, max] in 10⁶ steps, both ends included (fc.double crowds values near 0). */
const uniform = (min: number, max: number) =>
  fc.integer({ min: 0, max: 1_000_000 }).map((i) => min + ((max - min) * i) / 1_000_000);

const rad = Math.PI / 180;
type V = [number, number, number];
const dot = (a: V, b: V) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const add = (a: V, b: V, k = 1): V => [a[0] + k * b[0], a[1] + k * b[1], a[2] + k * b[2]];

/** Frame from methods.md §6, written out here independently of src/tunnel-frame.ts. */
function frame(trend: number, plunge: number): { a: V; up: V; right: V } {
  const a: V = [
    Math.cos(plunge * rad) * Math.cos(trend * rad),
    Math.cos(plunge * rad) * Math.sin(trend * rad),
    Math.sin(plunge * rad),
  ];
  // up = −(z − (z·a)a) normalised, with z = (0, 0, 1)
  const h: V = [-a[2] * a[0], -a[2] * a[1], 1 - a[2] * a[2]];
  const l = Math.hypot(...h);
  const up: V = [-h[0] / l, -h[1] / l, -h[2] / l];
  const right: V = [a[1] * up[2] - a[2] * up[1], a[2] * up[0] - a[0] * up[2], a[0] * up[1] - a[1] * up[0]];
  return { a, up, right };
}

const scenario = fc.record({
  dipDirection: uniform(0, 359.99),
  dip: uniform(0, 90),
  trend: uniform(0, 359.99),
  plunge: uniform(-25, 25),
  chainage: uniform(0, 20000),
  right: uniform(-6, 6),
  up: uniform(-6, 6),
  crownHeight: uniform(0, 10),
  invertDepth: uniform(0, 10),
  halfWidth: uniform(0, 10),
});

describe('planeCrossings agrees with mathjs intersect for random planes and drives', () => {
  it('for the axis, crown, invert and both walls', () => {
    fc.assert(
      fc.property(scenario, (s) => {
        const { a, up, right } = frame(s.trend, s.plunge);
        const d = s.dip * rad;
        const al = s.dipDirection * rad;
        const n: V = [-Math.sin(d) * Math.cos(al), -Math.sin(d) * Math.sin(al), Math.cos(d)];
        fc.pre(Math.abs(dot(n, a)) > 0.05); // far from running along the tunnel
        const face: V = [0, 0, 0];
        const p = add(add(face, right, s.right), up, s.up);
        const r = planeCrossings({
          plane: { dipDirection: s.dipDirection, dip: s.dip },
          chainage: s.chainage,
          offset: { right: s.right, up: s.up },
          drive: { trend: s.trend, plunge: s.plunge },
          crownHeight: s.crownHeight,
          invertDepth: s.invertDepth,
          halfWidth: s.halfWidth,
        });
        const origins: [keyof PlaneCrossings, V][] = [
          ['axis', face],
          ['crown', add(face, up, s.crownHeight)],
          ['invert', add(face, up, -s.invertDepth)],
          ['rightWall', add(face, right, s.halfWidth)],
          ['leftWall', add(face, right, -s.halfWidth)],
        ];
        for (const [key, q0] of origins) {
          const x = intersect(q0, add(q0, a, 100), [n[0], n[1], n[2], dot(n, p)]) as unknown as V;
          const expected = s.chainage + dot(add(x, q0, -1), a);
          const got = r[key];
          expect(got).not.toBeNull();
          expect(Math.abs((got ?? NaN) - expected)).toBeLessThan(
            1e-6 * (1 + Math.abs(expected - s.chainage)),
          );
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe('identities for horizontal drives (methods.md §6)', () => {
  it('crown to invert = (crown height + invert depth)/tan(apparent dip along the axis)', () => {
    fc.assert(
      fc.property(scenario, (s) => {
        // Apparent dip along the axis: tan α = tan δ·|cos β|, β between the dip direction and the drive.
        const beta = (s.dipDirection - s.trend) * rad;
        const apparent = Math.atan(Math.tan(s.dip * rad) * Math.abs(Math.cos(beta)));
        // |n·a| = sin δ·|cos β| must stay clear of the 'runs along the tunnel' limit (sin 0.5°).
        fc.pre(Math.sin(s.dip * rad) * Math.abs(Math.cos(beta)) > 0.02 && s.dip < 89.9);
        const r = planeCrossings({
          plane: { dipDirection: s.dipDirection, dip: s.dip },
          chainage: s.chainage,
          offset: { right: s.right, up: s.up },
          drive: { trend: s.trend, plunge: 0 },
          crownHeight: s.crownHeight,
          invertDepth: s.invertDepth,
          halfWidth: s.halfWidth,
        });
        const expected = (s.crownHeight + s.invertDepth) / Math.tan(apparent);
        const got = Math.abs((r.crown ?? NaN) - (r.invert ?? NaN));
        expect(Math.abs(got - expected)).toBeLessThan(1e-7 * (1 + expected));
      }),
      { numRuns: 300 },
    );
  });

  it('wall to wall = 2·half-width/tan(acute angle between strike and axis)', () => {
    fc.assert(
      fc.property(scenario, (s) => {
        let gamma = Math.abs((((s.dipDirection - 90 - s.trend) % 180) + 180) % 180);
        if (gamma > 90) gamma = 180 - gamma;
        fc.pre(Math.sin(s.dip * rad) * Math.sin(gamma * rad) > 0.02);
        const r = planeCrossings({
          plane: { dipDirection: s.dipDirection, dip: s.dip },
          chainage: s.chainage,
          offset: { right: s.right, up: s.up },
          drive: { trend: s.trend, plunge: 0 },
          crownHeight: s.crownHeight,
          invertDepth: s.invertDepth,
          halfWidth: s.halfWidth,
        });
        const expected = (2 * s.halfWidth) / Math.tan(gamma * rad);
        const got = Math.abs((r.rightWall ?? NaN) - (r.leftWall ?? NaN));
        expect(Math.abs(got - expected)).toBeLessThan(1e-7 * (1 + expected));
      }),
      { numRuns: 300 },
    );
  });
});
