import { cross as mathCross, norm as mathNorm } from 'mathjs';
import {
  OrientationError,
  angleBetweenLines,
  angleBetweenPlanes,
  apparentDip,
  intersectionOf,
  planeFromApparentDips,
  planeNormal,
  vectorToLine,
} from '../src/index.js';
import type { Vector3 } from '../src/index.js';
import { expectAzimuthClose, expectClose } from './asserts.js';
import { randomPlanes } from './random.js';

describe('intersection of two planes (methods.md §1.3)', () => {
  it('130/50 and 250/30 meet in 201/21 (graphical, ±1°)', () => {
    // Brady & Brown 2004, Rock Mechanics for Underground Mining 3rd ed., App. A.3 p.569–570 [source, seen]
    const l = intersectionOf({ dipDirection: 130, dip: 50 }, { dipDirection: 250, dip: 30 });
    expect(l).not.toBeNull();
    expectAzimuthClose(l?.trend ?? Number.NaN, 201, 1);
    expectClose(l?.plunge, 21, 1);
  });

  it('130/50 and 250/30 meet in 201.34/20.87 (computed here, to its 2 decimals)', () => {
    const l = intersectionOf({ dipDirection: 130, dip: 50 }, { dipDirection: 250, dip: 30 });
    expectClose(l, { trend: 201.34, plunge: 20.87 }, 0.005);
  });

  it('agrees with mathjs cross products for 1,000 random pairs (within 1e-9)', () => {
    const a = randomPlanes(1000, 11);
    const b = randomPlanes(1000, 12);
    for (let i = 0; i < a.length; i++) {
      const m = mathCross([...planeNormal(a[i])], [...planeNormal(b[i])]) as number[];
      if ((mathNorm(m) as number) < 1e-6) continue;
      const expected = vectorToLine(m as unknown as Vector3);
      const actual = intersectionOf(a[i], b[i]);
      expect(actual).not.toBeNull();
      expect(angleBetweenLines(actual ?? { trend: 0, plunge: 0 }, expected)).toBeLessThan(1e-6);
    }
  });

  it('parallel planes have no intersection: null', () => {
    expect(intersectionOf({ dipDirection: 130, dip: 50 }, { dipDirection: 130, dip: 50 })).toBeNull();
    expect(intersectionOf({ dipDirection: 130, dip: 90 }, { dipDirection: 310, dip: 90 })).toBeNull();
    expect(intersectionOf({ dipDirection: 10, dip: 0 }, { dipDirection: 250, dip: 0 })).toBeNull();
  });

  it('two vertical planes meet in the vertical; a horizontal plane meets another along its strike', () => {
    expect(intersectionOf({ dipDirection: 0, dip: 90 }, { dipDirection: 90, dip: 90 })).toEqual({
      trend: 0,
      plunge: 90,
    });
    expect(intersectionOf({ dipDirection: 0, dip: 0 }, { dipDirection: 90, dip: 40 })).toEqual({
      trend: 0,
      plunge: 0,
    });
    // the same line whichever plane comes first
    expect(intersectionOf({ dipDirection: 90, dip: 40 }, { dipDirection: 0, dip: 0 })).toEqual({
      trend: 0,
      plunge: 0,
    });
  });
});

describe('angles (methods.md §1.4)', () => {
  it('acute dihedral angle of 130/50 and 250/30 is 68.58° (computed here)', () => {
    expectClose(
      angleBetweenPlanes({ dipDirection: 130, dip: 50 }, { dipDirection: 250, dip: 30 }),
      68.58,
      0.005,
    );
  });

  it('lines 124/40 and 038/50 are 58.21° apart (computed here; the 56° of a web tutorial is not used)', () => {
    expectClose(angleBetweenLines({ trend: 124, plunge: 40 }, { trend: 38, plunge: 50 }), 58.21, 0.005);
  });

  it('returns the acute angle for undirected lines and exact values for simple cases', () => {
    expect(angleBetweenLines({ trend: 0, plunge: 0 }, { trend: 180, plunge: 0 })).toBe(0);
    expect(angleBetweenLines({ trend: 0, plunge: 0 }, { trend: 90, plunge: 0 })).toBe(90);
    expect(angleBetweenLines({ trend: 0, plunge: 0 }, { trend: 0, plunge: 90 })).toBe(90);
    expectClose(angleBetweenLines({ trend: 0, plunge: 0 }, { trend: 135, plunge: 0 }), 45, 1e-12);
    expect(angleBetweenPlanes({ dipDirection: 0, dip: 90 }, { dipDirection: 180, dip: 90 })).toBe(0);
    expect(angleBetweenPlanes({ dipDirection: 0, dip: 0 }, { dipDirection: 33, dip: 90 })).toBe(90);
  });

  it('a small angle is accurate (no acos round-off): 1e-7° apart', () => {
    expectClose(angleBetweenLines({ trend: 10, plunge: 30 }, { trend: 10, plunge: 30 + 1e-7 }), 1e-7, 1e-12);
  });
});

describe('apparent dip (methods.md §1.5)', () => {
  it('plane 120/40 in an E–W section (090) dips 36.005° (computed here)', () => {
    expectClose(apparentDip({ dipDirection: 120, dip: 40 }, 90), 36.005, 0.0005);
    expectClose(apparentDip({ dipDirection: 120, dip: 40 }, 270), 36.005, 0.0005);
  });

  it('tan α = tan δ·cos β, exact at β = 0 and along the strike', () => {
    expectClose(apparentDip({ dipDirection: 120, dip: 40 }, 120), 40, 1e-12);
    expect(apparentDip({ dipDirection: 120, dip: 40 }, 30)).toBe(0);
    expect(apparentDip({ dipDirection: 120, dip: 0 }, 75)).toBe(0);
    expect(apparentDip({ dipDirection: 120, dip: 90 }, 75)).toBe(90);
    expect(apparentDip({ dipDirection: 120, dip: 90 }, 30)).toBe(90); // contains every line of that trend
  });

  it('forward check: 110/44 seen in a 140° wall dips 39.9° (computed here)', () => {
    expectClose(apparentDip({ dipDirection: 110, dip: 44 }, 140), 39.91, 0.005);
  });

  it('tunnel wall 140–320 with a 40° trace to 140 and roof trace 020–200 give 110/44 (graphical, ±1°)', () => {
    // Brady & Brown 2004, Rock Mechanics for Underground Mining 3rd ed., App. A.5 p.571–572 [source, seen]
    const p = planeFromApparentDips({ trend: 20, plunge: 0 }, { trend: 140, plunge: 40 });
    expectAzimuthClose(p.dipDirection, 110, 1);
    expectClose(p.dip, 44, 1);
  });

  it('the same gives dip 44.10° exactly, atan(tan 40 / cos 30) (computed here)', () => {
    const p = planeFromApparentDips({ trend: 20, plunge: 0 }, { trend: 140, plunge: 40 });
    expectClose(
      p.dip,
      (Math.atan(Math.tan((40 * Math.PI) / 180) / Math.cos(Math.PI / 6)) * 180) / Math.PI,
      1e-9,
    );
    expectAzimuthClose(p.dipDirection, 110, 1e-9);
  });

  it('two identical traces do not define a plane', () => {
    expect(() => planeFromApparentDips({ trend: 20, plunge: 10 }, { trend: 20, plunge: 10 })).toThrow(
      OrientationError,
    );
  });
});
