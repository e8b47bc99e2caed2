import { apparentDip, planarSlidingOut, surfaceFacing } from '@roundbook/geomath';
import type { Drive, Plane } from '@roundbook/geomath';
import type { FreeSurface } from './daylight';
import { daylightDips, daylightsOn, surfacesOf } from './daylight';

const on = (drive: Drive, surface: FreeSurface) => {
  const s = surfacesOf(drive).find((x) => x.surface === surface);
  if (!s) throw new Error(surface);
  return (plane: Plane) => daylightsOn(plane, s);
};

// Every case below is computed here by hand: a plane daylights when its dip vector points out of the rock
// through the surface (dip direction within ±90° of the surface's outward direction and gentler than the
// surface's apparent dip there; steeper for an overhanging surface).
describe('daylight on the free surfaces of a drive', () => {
  const level: Drive = { trend: 0, plunge: 0 };

  it('puts the walls, crown and face where the drive says (level drive to the north)', () => {
    const s = Object.fromEntries(surfacesOf(level).map((x) => [x.surface, x]));
    // Right wall on the east side looks west into the tunnel; the face looks back south (geomath surfaceFacing).
    expect(s['right wall'].facing).toBeCloseTo(270, 6);
    expect(s['right wall'].plane.dip).toBeCloseTo(90, 6);
    expect(s['left wall'].facing).toBeCloseTo(90, 6);
    expect(s.face.facing).toBeCloseTo(180, 6);
    expect(s.face.plane.dip).toBeCloseTo(90, 6);
    expect(s.crown.facing).toBeNull();
    expect(s.crown.plane.dip).toBeCloseTo(0, 6);
    for (const t of [37, 215]) {
      const drive = { trend: t, plunge: 0 };
      for (const x of surfacesOf(drive)) {
        if (x.surface !== 'crown') expect(x.facing).toBeCloseTo(surfaceFacing(drive, x.surface), 6);
      }
    }
  });

  it("agrees with geomath's planar test opened to ±90° with no friction, on vertical walls and face", () => {
    // planarSlidingOut(±90°, φ = 0) flags a plane when it dips out of the surface and daylights — the
    // same condition, away from the boundaries (whole-degree dip directions miss the ±90° edges at half degrees).
    const drive = { trend: 57.5, plunge: 0 };
    let agreed = 0;
    for (const x of surfacesOf(drive)) {
      if (x.surface === 'crown') continue;
      const geometry = { facing: surfaceFacing(drive, x.surface), inclination: 90 };
      for (let dd = 1; dd < 360; dd += 7) {
        for (const dip of [5, 30, 60, 85]) {
          const plane = { dipDirection: dd, dip };
          expect(daylightsOn(plane, x)).toBe(planarSlidingOut(plane, geometry, 0, 90).flagged);
          agreed++;
        }
      }
    }
    expect(agreed).toBe(3 * 52 * 4);
  });

  it('walls: planes dipping into the tunnel from that side daylight, others not (computed here)', () => {
    const right = on(level, 'right wall');
    const left = on(level, 'left wall');
    expect(right({ dipDirection: 270, dip: 40 })).toBe(true);
    expect(right({ dipDirection: 200, dip: 85 })).toBe(true); // 70° off the facing, still out of the wall
    expect(left({ dipDirection: 270, dip: 40 })).toBe(false);
    expect(left({ dipDirection: 100, dip: 10 })).toBe(true);
    // Dipping along the tunnel (90° from either facing) daylights on neither wall.
    expect(right({ dipDirection: 180, dip: 60 })).toBe(false);
    expect(left({ dipDirection: 180, dip: 60 })).toBe(false);
    // A vertical plane is not gentler than the vertical wall; a horizontal one has no dip vector.
    expect(right({ dipDirection: 270, dip: 90 })).toBe(false);
    expect(right({ dipDirection: 270, dip: 0 })).toBe(false);
  });

  it('face of a level drive: planes dipping back toward the tunnel daylight', () => {
    const face = on(level, 'face');
    expect(face({ dipDirection: 180, dip: 60 })).toBe(true);
    expect(face({ dipDirection: 200, dip: 89.9 })).toBe(true);
    expect(face({ dipDirection: 0, dip: 60 })).toBe(false);
    expect(face({ dipDirection: 270, dip: 60 })).toBe(false);
  });

  it('face of a drive 10° downhill leans back 80°: the apparent dip decides (computed here)', () => {
    const face = on({ trend: 0, plunge: 10 }, 'face');
    // Face inclination 90 − 10 = 80°, facing 180. Dipping 180: daylights below 80°.
    expect(face({ dipDirection: 180, dip: 75 })).toBe(true);
    expect(face({ dipDirection: 180, dip: 85 })).toBe(false);
    // Dipping 135 (45° off): apparent dip atan(tan 80° · cos 45°) = atan(4.010) = 76.0°.
    expect(face({ dipDirection: 135, dip: 75 })).toBe(true);
    expect(face({ dipDirection: 135, dip: 77 })).toBe(false);
    const s = surfacesOf({ trend: 0, plunge: 10 }).find((x) => x.surface === 'face')!;
    expect(daylightDips(s, 135)?.[1]).toBeCloseTo(76.0, 1);
    expect(apparentDip(s.plane, 135)).toBeCloseTo(76.0, 1);
  });

  it('face of a drive 10° uphill overhangs: steep planes dipping ahead daylight (computed here)', () => {
    const face = on({ trend: 0, plunge: -10 }, 'face');
    // n_out = (−cos 10°, 0, sin 10°) north-east-down; 000/85: d·n = −0.0872·0.9848 + 0.9962·0.1736 = 0.087 > 0.
    expect(face({ dipDirection: 0, dip: 85 })).toBe(true);
    expect(face({ dipDirection: 0, dip: 75 })).toBe(false);
    expect(face({ dipDirection: 180, dip: 30 })).toBe(true);
  });

  it('crown: every dipping plane of a level drive; of a 10° downhill drive, not those gentler than the roof ahead', () => {
    const flat = on(level, 'crown');
    expect(flat({ dipDirection: 0, dip: 5 })).toBe(true);
    expect(flat({ dipDirection: 123, dip: 80 })).toBe(true);
    expect(flat({ dipDirection: 0, dip: 0 })).toBe(false);
    const down = on({ trend: 0, plunge: 10 }, 'crown');
    // n_out = (−sin 10°, 0, cos 10°); 000/δ: d·n = sin(δ − 10°).
    expect(down({ dipDirection: 0, dip: 5 })).toBe(false);
    expect(down({ dipDirection: 0, dip: 15 })).toBe(true);
    expect(down({ dipDirection: 180, dip: 5 })).toBe(true);
  });
});
