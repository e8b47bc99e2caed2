import fc from 'fast-check';
import { angleBetweenLines, findSets } from '../src/index.js';
import type { Line } from '../src/index.js';
import { scatteredSet } from './sets-data.js';

/** The antipode of a line, written with a negative plunge (or the reversed trend when horizontal). */
const antipodeOf = (l: Line): Line =>
  l.plunge === 0
    ? { trend: (l.trend + 180) % 360, plunge: 0 }
    : { trend: (l.trend + 180) % 360, plunge: -l.plunge };

describe('findSets is unchanged when poles are replaced by their antipodes', () => {
  it('for any clustered data and any choice of poles to flip', () => {
    const mean = fc.record({
      trend: fc.integer({ min: 0, max: 359 }),
      plunge: fc.integer({ min: 0, max: 90 }),
    });
    const data = fc
      .tuple(fc.array(mean, { minLength: 1, maxLength: 3 }), fc.integer({ min: 1, max: 1000 }), fc.boolean())
      .map(([means, seed, horizontal]) => [
        ...means.flatMap((m, i) => scatteredSet(m, 15 + 5 * i, 8, seed + i)),
        ...(horizontal
          ? [
              { trend: 33, plunge: 0 },
              { trend: 35, plunge: 0 },
            ]
          : []),
      ]);
    fc.assert(
      fc.property(data, fc.array(fc.boolean(), { minLength: 80, maxLength: 80 }), (poles, flips) => {
        const flipped = poles.map((p, i) => (flips[i] ? antipodeOf(p) : p));
        const a = findSets(poles);
        const b = findSets(flipped);
        expect(b.unassigned).toEqual(a.unassigned);
        expect(b.sets.map((s) => s.members)).toEqual(a.sets.map((s) => s.members));
        a.sets.forEach((s, i) => {
          expect(angleBetweenLines(s.mean, b.sets[i].mean)).toBeLessThan(1e-9);
          expect(Math.abs(s.alpha95 - b.sets[i].alpha95)).toBeLessThan(1e-9);
        });
      }),
      { numRuns: 60 },
    );
  });
});
