import fc from 'fast-check';
import { qValue } from '../src/rock-mass.js';
import type { QInput } from '../src/rock-mass.js';

/** Uniform over [min, max] in 10⁶ steps, both ends included (fc.double crowds values near 0). */
const uniform = (min: number, max: number) =>
  fc.integer({ min: 0, max: 1_000_000 }).map((i) => min + ((max - min) * i) / 1_000_000);

// Q rises with RQD, Jr and Jw and falls with Jn, Ja and SRF (Barton, Lien & Lunde 1974: Q = (RQD/Jn)·(Jr/Ja)·(Jw/SRF)).
const input = fc.record({
  rqd: uniform(0, 100),
  jn: uniform(0.5, 20),
  jr: uniform(0.5, 4),
  ja: uniform(0.75, 20),
  jw: uniform(0.05, 1),
  srf: uniform(0.5, 400),
});

const ranges: Record<
  keyof Omit<QInput, 'location' | 'jrSpacingOver3m' | 'jrRowId'>,
  [number, number, 1 | -1]
> = {
  rqd: [0, 100, 1],
  jn: [0.5, 20, -1],
  jr: [0.5, 4, 1],
  ja: [0.75, 20, -1],
  jw: [0.05, 1, 1],
  srf: [0.5, 400, -1],
};

describe('Q is monotonic in each parameter in the published direction', () => {
  it.each(Object.entries(ranges))('%s', (key, [lo, hi, direction]) => {
    fc.assert(
      fc.property(
        input,
        fc.double({ min: lo, max: hi, noNaN: true }),
        fc.double({ min: lo, max: hi, noNaN: true }),
        (rest, a, b) => {
          const [small, large] = a <= b ? [a, b] : [b, a];
          const qSmall = qValue({ ...rest, [key]: small }).q;
          const qLarge = qValue({ ...rest, [key]: large }).q;
          if (direction === 1) expect(qLarge).toBeGreaterThanOrEqual(qSmall);
          else expect(qLarge).toBeLessThanOrEqual(qSmall);
          // Strictly so once RQD is above the floor of 10.
          if (large > small * (1 + 1e-9) && (key !== 'rqd' || small >= 10)) expect(qLarge).not.toBe(qSmall);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('RQD below 10 never changes Q (the floor)', () => {
    fc.assert(
      fc.property(input, uniform(0, 10), (rest, rqd) => {
        expect(qValue({ ...rest, rqd }).q).toBe(qValue({ ...rest, rqd: 10 }).q);
      }),
    );
  });
});
