import { cosDeg, project, sinDeg } from '../src/index.js';
import { sinCosDeg } from '../src/trig.js';
import { seededRandom } from './random.js';

describe('sine and cosine of the projection (range reduction + Taylor polynomials)', () => {
  // Math.sin(deg·π/180) itself carries the rounding of deg·π/180 (about |r|·1.1e-16), so the comparison
  // allows for it; within ±45° no reduction happens and the polynomials alone are compared.
  it.each([
    [45, 3e-16],
    [720, 3e-15],
  ])('agree with Math.sin and Math.cos on 100,000 angles within ±%d° (to %d)', (range, tolerance) => {
    const rnd = seededRandom(99);
    let worst = 0;
    for (let i = 0; i < 100_000; i++) {
      const deg = (rnd() - 0.5) * 2 * range;
      const [s, c] = sinCosDeg(deg);
      const r = (deg * Math.PI) / 180;
      worst = Math.max(worst, Math.abs(s - Math.sin(r)), Math.abs(c - Math.cos(r)));
    }
    expect(worst).toBeLessThan(tolerance);
  });

  it('are exact at multiples of 90°, so cardinal lines project onto the axes exactly', () => {
    expect(sinCosDeg(0)).toEqual([0, 1]);
    expect(sinCosDeg(90)).toEqual([1, -0]);
    expect(sinCosDeg(180)).toEqual([-0, -1]);
    expect(sinCosDeg(270)).toEqual([-1, 0]);
    expect(sinCosDeg(-90)).toEqual([-1, 0]);
    const east = project({ trend: 90, plunge: 0 }, 'equal-area');
    expect(east.x).toBe(1);
    expect(Math.abs(east.y)).toBe(0);
  });
});

describe('sinDeg and cosDeg (used for exact horizontal and vertical orientations)', () => {
  it('are exact at multiples of 90° and agree with Math elsewhere', () => {
    expect([sinDeg(0), sinDeg(90), sinDeg(180), sinDeg(270), sinDeg(-90), sinDeg(450)]).toEqual([
      0, 1, 0, -1, -1, 1,
    ]);
    expect([cosDeg(0), cosDeg(90), cosDeg(180), cosDeg(270), cosDeg(-180), cosDeg(360)]).toEqual([
      1, 0, -1, 0, -1, 1,
    ]);
    expect(Math.abs(sinDeg(30) - 0.5)).toBeLessThan(1e-15);
    expect(Math.abs(cosDeg(60) - 0.5)).toBeLessThan(1e-15);
  });
});
