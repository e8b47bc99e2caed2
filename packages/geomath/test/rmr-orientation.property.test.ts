import fc from 'fast-check';
import { rmrOrientationInTunnel } from '../src/rock-mass.js';
import { expectClose } from './asserts.js';

/** Uniform over [min, max] in 10⁶ steps, both ends included (fc.double crowds values near 0). */
const uniform = (min: number, max: number) =>
  fc.integer({ min: 0, max: 1_000_000 }).map((i) => min + ((max - min) * i) / 1_000_000);

/**
 * A set at `gamma` degrees (strike to axis) on a given side, with or against the drive. gamma 90 is
 * perpendicular, 0 parallel.
 */
function setAt(driveTrend: number, gamma: number, withDip: boolean, side: 1 | -1, dip: number) {
  const fromDrive = withDip ? 90 - gamma : 90 + gamma;
  return { dipDirection: (((driveTrend + side * fromDrive) % 360) + 360) % 360, dip };
}

const scenario = fc.record({
  driveTrend: uniform(0, 359.999),
  plunge: uniform(-15, 15),
  dip: uniform(0, 90),
  withDip: fc.boolean(),
  side: fc.constantFrom<1 | -1>(1, -1),
  a: uniform(0, 90),
  b: uniform(0, 90),
});

describe('rotating a set toward the tunnel axis never improves its adjustment', () => {
  it("holds for every dip and sense, except the one step that Bieniawski's own table improves", () => {
    fc.assert(
      fc.property(scenario, (s) => {
        const [near, far] = s.a <= s.b ? [s.a, s.b] : [s.b, s.a]; // near is closer to the axis
        const drive = { trend: s.driveTrend, plunge: s.plunge };
        const rNear = rmrOrientationInTunnel(setAt(s.driveTrend, near, s.withDip, s.side, s.dip), drive);
        const rFar = rmrOrientationInTunnel(setAt(s.driveTrend, far, s.withDip, s.side, s.dip), drive);
        expectClose(rNear.strikeToAxis, near, 1e-6);
        if (rNear.adjustment > rFar.adjustment) {
          // Table F rates a 20–45° set with strike ∥ axis (fair, −5) better than one ⟂ axis driven against
          // the dip (unfavourable, −10). That is the only improvement allowed, and only into 'parallel'.
          expect(s.withDip).toBe(false);
          expect(s.dip).toBeGreaterThanOrEqual(20);
          expect(s.dip).toBeLessThan(45);
          expect(rNear.relation).toBe('parallel');
          expect([rFar.adjustment, rNear.adjustment]).toEqual([-10, -5]);
        }
      }),
      { numRuns: 2000 },
    );
  });

  it('holds without exception for sets dipping 45° or more, or driven with the dip', () => {
    fc.assert(
      fc.property(scenario, (s) => {
        fc.pre(s.dip >= 45 || s.withDip);
        const [near, far] = s.a <= s.b ? [s.a, s.b] : [s.b, s.a];
        const drive = { trend: s.driveTrend, plunge: s.plunge };
        const rNear = rmrOrientationInTunnel(setAt(s.driveTrend, near, s.withDip, s.side, s.dip), drive);
        const rFar = rmrOrientationInTunnel(setAt(s.driveTrend, far, s.withDip, s.side, s.dip), drive);
        expect(rNear.adjustment).toBeLessThanOrEqual(rFar.adjustment);
      }),
      { numRuns: 1000 },
    );
  });
});
