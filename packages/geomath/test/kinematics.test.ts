import {
  planarSlidingOut,
  rmrOrientationInTunnel,
  roofWedge,
  screenRound,
  surfaceFacing,
  wedgeSlidingOut,
} from '../src/rock-mass.js';
import type { KinematicFlag, ScreenedPlane } from '../src/rock-mass.js';
import { OrientationError, RatingError } from '../src/types.js';
import { expectAzimuthClose, expectClose } from './asserts.js';

describe('roofWedge (methods.md §5 vector form)', () => {
  it('sets 045/60, 165/60, 285/60 enclose the vertical: edges 105/40.9, 225/40.9, 345/40.9, c = 0.509 each → falls', () => {
    // Check values methods.md §5 [computed here]; rule from Hoek & Brown 1980 ch.7 and Goodman & Shi 1985, as
    // summarised in the Encyclopedia of Geology (2005) "Rock mechanics" Fig. 15 [source, seen].
    const r = roofWedge(
      [
        { dipDirection: 45, dip: 60 },
        { dipDirection: 165, dip: 60 },
        { dipDirection: 285, dip: 60 },
      ],
      30,
    );
    expect(r.mode).toBe('falls');
    expect(r.direction).toBeUndefined();
    [105, 225, 345].forEach((t, i) => expectAzimuthClose(r.edges[i].trend, t, 1e-6));
    r.edges.forEach((e) => expectClose(e.plunge, 40.9, 0.05));
    r.coefficients.forEach((c) => expectClose(c, 0.509, 1e-3));
  });

  it('sets 060/70, 160/70, 110/20: c = (1.448, −0.448, −0.448), slides along I12 = 110/60.5 at φ 30°', () => {
    // methods.md §5 [computed here].
    const planes: Parameters<typeof roofWedge>[0] = [
      { dipDirection: 60, dip: 70 },
      { dipDirection: 160, dip: 70 },
      { dipDirection: 110, dip: 20 },
    ];
    const r = roofWedge(planes, 30);
    expectClose(r.coefficients, [1.448, -0.448, -0.448], 1e-3);
    expect(r.mode).toBe('slides');
    expectAzimuthClose(r.direction?.trend ?? NaN, 110, 1e-6);
    expectClose(r.direction?.plunge ?? NaN, 60.5, 0.05);
  });

  it('is stable when the steepest admissible direction is not steeper than φ (equal counts as stable)', () => {
    const planes: Parameters<typeof roofWedge>[0] = [
      { dipDirection: 60, dip: 70 },
      { dipDirection: 160, dip: 70 },
      { dipDirection: 110, dip: 20 },
    ];
    const steepest = roofWedge(planes, 30).steepest.plunge;
    expect(roofWedge(planes, steepest - 1e-6).mode).toBe('slides');
    expect(roofWedge(planes, steepest).mode).toBe('stable');
    expect(roofWedge(planes, 70).mode).toBe('stable');
  });

  it('refuses two parallel planes and a bad friction angle', () => {
    const p = { dipDirection: 10, dip: 40 };
    expect(() => roofWedge([p, { ...p }, { dipDirection: 200, dip: 50 }], 30)).toThrow(OrientationError);
    expect(() => roofWedge([p, { dipDirection: 100, dip: 40 }, { dipDirection: 200, dip: 50 }], 95)).toThrow(
      RatingError,
    );
  });
});

describe('facing directions', () => {
  it('right wall looks toward drive − 90, left wall drive + 90, face drive + 180', () => {
    // methods.md §5.
    const drive = { trend: 60, plunge: 0 };
    expect(surfaceFacing(drive, 'right wall')).toBe(330);
    expect(surfaceFacing(drive, 'left wall')).toBe(150);
    expect(surfaceFacing(drive, 'face')).toBe(240);
  });
});

describe('planar sliding out of a surface (±20° window, Hoek & Bray 1981; Hudson & Harrison 1997 Fig. 18.2)', () => {
  const wall = { facing: 270, inclination: 90 };
  it('flags a plane dipping into the opening, steeper than φ', () => {
    expect(planarSlidingOut({ dipDirection: 270, dip: 50 }, wall, 30).flagged).toBe(true);
  });

  it('counts exactly 20° off the facing direction as inside the window, 20.01° as outside', () => {
    expect(planarSlidingOut({ dipDirection: 290, dip: 50 }, wall, 30).flagged).toBe(true);
    expect(planarSlidingOut({ dipDirection: 250, dip: 50 }, wall, 30).flagged).toBe(true);
    expect(planarSlidingOut({ dipDirection: 290.01, dip: 50 }, wall, 30).flagged).toBe(false);
  });

  it('needs a dip steeper than φ: equal does not slide', () => {
    expect(planarSlidingOut({ dipDirection: 270, dip: 30 }, wall, 30).flagged).toBe(false);
    expect(planarSlidingOut({ dipDirection: 270, dip: 30.01 }, wall, 30).flagged).toBe(true);
  });

  it('needs the plane to daylight: a dip equal to the wall inclination does not', () => {
    const inclined = { facing: 270, inclination: 70 };
    expect(planarSlidingOut({ dipDirection: 270, dip: 70 }, inclined, 30).flagged).toBe(false);
    expect(planarSlidingOut({ dipDirection: 270, dip: 69.9 }, inclined, 30).flagged).toBe(true);
    expect(planarSlidingOut({ dipDirection: 270, dip: 89.9 }, wall, 30).flagged).toBe(true);
  });

  it('explains each condition in words', () => {
    const r = planarSlidingOut({ dipDirection: 300, dip: 25 }, wall, 30);
    expect(r.flagged).toBe(false);
    expect(r.reason).toMatch(/more than ±20°/);
    expect(r.reason).toMatch(/not steeper than the friction angle 30°/);
  });

  it('a plane that slides out of the face is one the drive meets against its dip (Bieniawski table F)', () => {
    const drive = { trend: 0, plunge: 0 };
    const plane = { dipDirection: 175, dip: 60 };
    expect(
      planarSlidingOut(plane, { facing: surfaceFacing(drive, 'face'), inclination: 90 }, 30).flagged,
    ).toBe(true);
    expect(rmrOrientationInTunnel(plane, drive).driveSense).toBe('against dip');
  });
});

describe('wedge sliding out of a surface along an intersection line', () => {
  const rightWall = { facing: 270, inclination: 90 };
  const leftWall = { facing: 90, inclination: 90 };
  it('240/60 and 300/60 meet in 270/56.3, which slides out of a wall facing 270 but not one facing 090', () => {
    // Apparent dip of either plane toward 270: atan(tan 60°·cos 30°) = 56.31° [computed here].
    const r = wedgeSlidingOut({ dipDirection: 240, dip: 60 }, { dipDirection: 300, dip: 60 }, rightWall, 30);
    expect(r?.flagged).toBe(true);
    expectAzimuthClose(r?.direction.trend ?? NaN, 270, 1e-9);
    expectClose(
      r?.direction.plunge ?? NaN,
      (Math.atan(Math.tan(Math.PI / 3) * Math.cos(Math.PI / 6)) * 180) / Math.PI,
      1e-9,
    );
    expect(
      wedgeSlidingOut({ dipDirection: 240, dip: 60 }, { dipDirection: 300, dip: 60 }, leftWall, 30)?.flagged,
    ).toBe(false);
  });

  it('does not flag a line shallower than φ, and gives null for parallel planes', () => {
    expect(
      wedgeSlidingOut({ dipDirection: 240, dip: 30 }, { dipDirection: 300, dip: 30 }, rightWall, 30)?.flagged,
    ).toBe(false);
    expect(
      wedgeSlidingOut({ dipDirection: 240, dip: 30 }, { dipDirection: 240, dip: 30 }, rightWall, 30),
    ).toBeNull();
  });

  it('on an inclined wall the line must plunge less than the wall in its own direction', () => {
    // Wall 270/60; line 270/56.3 daylights; a wedge of 240/75 and 300/75 (line 270/72.8) does not.
    const wall = { facing: 270, inclination: 60 };
    expect(
      wedgeSlidingOut({ dipDirection: 240, dip: 60 }, { dipDirection: 300, dip: 60 }, wall, 30)?.flagged,
    ).toBe(true);
    expect(
      wedgeSlidingOut({ dipDirection: 240, dip: 75 }, { dipDirection: 300, dip: 75 }, wall, 30)?.flagged,
    ).toBe(false);
  });
});

describe('screenRound: every flagged combination for a round, with reasons', () => {
  const planes: ScreenedPlane[] = [
    { label: 'J1', kind: 'set', plane: { dipDirection: 45, dip: 60 } },
    { label: 'J2', kind: 'set', plane: { dipDirection: 165, dip: 60 } },
    { label: 'J3', kind: 'set', plane: { dipDirection: 285, dip: 60 } },
    { label: 'F1', kind: 'feature', plane: { dipDirection: 10, dip: 15 } },
  ];
  const flags = screenRound({ planes, drive: { trend: 0, plunge: 0 }, frictionAngle: 30 });
  const find = (mechanism: KinematicFlag['mechanism'], surface: KinematicFlag['surface'], labels: string[]) =>
    flags.find(
      (f) => f.mechanism === mechanism && f.surface === surface && f.labels.join() === labels.join(),
    );

  it('flags J3 sliding out of the right wall (dip direction 285 is 15° from 270)', () => {
    const f = find('planar sliding', 'right wall', ['J3']);
    expect(f?.reason).toMatch(/^set J3 \(285\/60\) can slide out of the right wall: it dips 15° from/);
  });

  it('flags J2 sliding out of the face (165 is 15° from 180)', () => {
    expect(find('planar sliding', 'face', ['J2'])).toBeDefined();
    expect(find('planar sliding', 'left wall', ['J2'])).toBeUndefined();
  });

  it('flags the J1–J2–J3 roof wedge as falling, and explains why', () => {
    const f = find('roof wedge falls', 'roof', ['J1', 'J2', 'J3']);
    expect(f?.reason).toMatch(
      /can drop straight down: the vertical lies inside its three edges \(105\/41, 225\/41, 345\/41\)/,
    );
  });

  it('does not flag the shallow feature F1 for planar sliding anywhere', () => {
    expect(flags.filter((f) => f.mechanism === 'planar sliding' && f.labels.includes('F1'))).toEqual([]);
  });

  it('lists wall wedges by their intersection line', () => {
    // J2 and J3 meet in a line trending about 225 that plunges 41°: it points out of the right wall (270).
    const f = find('wedge sliding', 'right wall', ['J2', 'J3']);
    expect(f).toBeDefined();
    expectAzimuthClose(f?.direction.trend ?? NaN, 225, 1e-6);
  });

  it('returns nothing for a single flat-lying set', () => {
    expect(screenRound({ planes: [planes[3]], drive: { trend: 0, plunge: 0 }, frictionAngle: 30 })).toEqual(
      [],
    );
  });

  it('rejects a vertical drive and a friction angle outside 0–90', () => {
    expect(() => screenRound({ planes, drive: { trend: 0, plunge: 90 }, frictionAngle: 30 })).toThrow(
      OrientationError,
    );
    expect(() => screenRound({ planes, drive: { trend: 0, plunge: 0 }, frictionAngle: -5 })).toThrow(
      RatingError,
    );
  });
});

describe('roofWedge without a tetrahedron', () => {
  it('refuses planes whose intersection line is horizontal (a prism along the roof)', () => {
    // 000/05 and 000/30 share the strike 090–270: their intersection line is horizontal.
    const planes: Parameters<typeof roofWedge>[0] = [
      { dipDirection: 0, dip: 5 },
      { dipDirection: 120, dip: 40 },
      { dipDirection: 0, dip: 30 },
    ];
    expect(() => roofWedge(planes, 30)).toThrow(/horizontal: they bound a prism/);
  });
});
