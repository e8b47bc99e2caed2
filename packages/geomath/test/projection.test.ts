import { geoAzimuthalEqualArea, geoStereographic } from 'd3-geo';
import proj4 from 'proj4';
import {
  OrientationError,
  angleBetweenLines,
  greatCircle,
  lineToVector,
  planeNormal,
  poleOf,
  project,
  smallCircle,
  unproject,
} from '../src/index.js';
import type { Line, Net } from '../src/index.js';
import { expectClose } from './asserts.js';
import { randomLines, randomPlanes } from './random.js';

describe('projection check values (R = 1; methods.md §2, computed here)', () => {
  it.each([
    [0, 0, [0, 1], [0, 1]],
    [90, 0, [1, 0], [1, 0]],
    [45, 30, [0.5, 0.5], [0.4082, 0.4082]],
    [310, 40, [-0.4578, 0.3842], [-0.3572, 0.2997]], // pole of 130/50
    [201, 21, [-0.2871, -0.7478], [-0.2463, -0.6416]],
    [123, 90, [0, 0], [0, 0]],
  ])('%d/%d', (trend, plunge, ea, st) => {
    const tol = ea[0] === 0.5 || Number.isInteger(ea[0]) ? 1e-12 : 5e-5; // exact values exactly, 4 d.p. otherwise
    expectClose(project({ trend, plunge }, 'equal-area'), { x: ea[0], y: ea[1] }, tol);
    expectClose(
      project({ trend, plunge }, 'equal-angle'),
      { x: st[0], y: st[1] },
      tol === 1e-12 && st[0] !== 0.4082 ? 1e-12 : 5e-5,
    );
  });

  it('scales with the net radius', () => {
    expectClose(project({ trend: 45, plunge: 30 }, 'equal-area', 10), { x: 5, y: 5 }, 1e-12);
  });

  it('equal-area: r = √2·sin(c/2) (Fisher, Lewis & Embleton 1987, ch. 3: Lambert ρ = 2 sin(θ/2) on a net of radius √2)', () => {
    for (const plunge of [0, 10, 33, 60, 89]) {
      const c = ((90 - plunge) * Math.PI) / 180;
      const { x, y } = project({ trend: 0, plunge }, 'equal-area');
      expectClose(Math.hypot(x, y), Math.SQRT2 * Math.sin(c / 2), 1e-12);
      const s = project({ trend: 0, plunge }, 'equal-angle');
      expectClose(Math.hypot(s.x, s.y), Math.tan(c / 2), 1e-12); // Wulff ρ = tan(θ/2), same source
    }
  });
});

describe('independent cross-checks on 1,000 random lines (methods.md §2.1)', () => {
  const lines = randomLines(1000, 7);

  it('d3-geo geoAzimuthalEqualArea and geoStereographic, rotate([0, −90]), agree within 1e-9', () => {
    const R = 1;
    const ea = geoAzimuthalEqualArea()
      .rotate([0, -90])
      .scale(R / Math.SQRT2)
      .translate([0, 0]);
    const st = geoStereographic().rotate([0, -90]).scale(R).translate([0, 0]).clipAngle(90);
    for (const l of lines) {
      const a = ea([l.trend, l.plunge]);
      const s = st([l.trend, l.plunge]);
      expect(a).not.toBeNull();
      expect(s).not.toBeNull();
      expectClose(project(l, 'equal-area', R), { x: a?.[0], y: a?.[1] }, 1e-9);
      expectClose(project(l, 'equal-angle', R), { x: s?.[0], y: s?.[1] }, 1e-9);
    }
  });

  it('proj4 laea and stere, south-polar aspect with latitude = −plunge, agree within 1e-9', () => {
    const R = 2;
    const s = R / Math.SQRT2;
    const t = R / 2;
    const ea = proj4(
      `+proj=longlat +a=${s} +b=${s} +no_defs`,
      `+proj=laea +lat_0=-90 +lon_0=0 +x_0=0 +y_0=0 +a=${s} +b=${s} +units=m +no_defs`,
    );
    const st = proj4(
      `+proj=longlat +a=${t} +b=${t} +no_defs`,
      `+proj=stere +lat_0=-90 +lat_ts=-90 +lon_0=0 +k_0=1 +x_0=0 +y_0=0 +a=${t} +b=${t} +units=m +no_defs`,
    );
    for (const l of lines) {
      const trend = l.trend > 180 ? l.trend - 360 : l.trend;
      const [ax, ay] = ea.forward([trend, -l.plunge]);
      const [sx, sy] = st.forward([trend, -l.plunge]);
      expectClose(project(l, 'equal-area', R), { x: ax, y: ay }, 1e-9);
      expectClose(project(l, 'equal-angle', R), { x: sx, y: sy }, 1e-9);
    }
  });
});

describe('unproject', () => {
  it('the centre is 000/90 and points on the primitive are horizontal', () => {
    expect(unproject({ x: 0, y: 0 }, 'equal-area')).toEqual({ trend: 0, plunge: 90 });
    expectClose(unproject({ x: 0, y: -1 }, 'equal-angle'), { trend: 180, plunge: 0 }, 1e-12);
    expectClose(unproject({ x: -3, y: 0 }, 'equal-area', 3), { trend: 270, plunge: 0 }, 1e-12);
  });

  it('a point outside the net is not an orientation', () => {
    expect(() => unproject({ x: 1, y: 1 }, 'equal-area')).toThrow(OrientationError);
    expect(() => unproject({ x: 1, y: 1 }, 'equal-area')).toThrow('outside the net');
  });
});

/** Perpendicular distance of a point from the straight line through the centre with unit direction u. */
const offLine = (p: { x: number; y: number }, u: { x: number; y: number }): number =>
  Math.abs(p.x * u.y - p.y * u.x);

describe('facts of the trade on the net (common practice)', () => {
  const nets: Net[] = ['equal-area', 'equal-angle'];

  it.each(nets)('%s: a vertical plane plots as a straight line through the centre', (net) => {
    const points = greatCircle({ dipDirection: 70, dip: 90 }, 36).map((l) => project(l, net));
    const strike = project({ trend: 340, plunge: 0 }, net);
    for (const p of points) expect(offLine(p, strike)).toBeLessThan(1e-12);
    const centre = points.reduce((m, p) => Math.min(m, Math.hypot(p.x, p.y)), 1);
    expect(centre).toBeLessThan(1e-12);
  });

  it.each(nets)('%s: a horizontal plane plots as the primitive, all round', (net) => {
    const lines = greatCircle({ dipDirection: 0, dip: 0 }, 72);
    expect(lines).toHaveLength(73);
    for (const l of lines) {
      expect(l.plunge).toBe(0);
      const p = project(l, net);
      expectClose(Math.hypot(p.x, p.y), 1, 1e-12);
    }
    const trends = new Set(lines.map((l) => Math.round(l.trend)));
    expect(trends.size).toBe(72);
  });

  it.each(nets)('%s: the pole plots 90° from the plane, on the side opposite its dip direction', (net) => {
    for (const plane of randomPlanes(50, 3)) {
      const pole = poleOf(plane);
      for (const l of greatCircle(plane, 18)) {
        expectClose(angleBetweenLines(pole, l), 90, 1e-9);
      }
      if (plane.dip > 1) {
        const pp = project(pole, net);
        const dp = project({ trend: plane.dipDirection, plunge: plane.dip }, net);
        expect(pp.x * dp.x + pp.y * dp.y).toBeLessThan(0);
      }
    }
  });

  it.each(nets)('%s: a steep plane runs near the centre, a gentle one near the edge', (net) => {
    const nearest = (dip: number): number =>
      Math.min(
        ...greatCircle({ dipDirection: 120, dip }, 90).map((l) =>
          Math.hypot(project(l, net).x, project(l, net).y),
        ),
      );
    expect(nearest(80)).toBeLessThan(0.15);
    expect(nearest(10)).toBeGreaterThan(0.8);
    expect(nearest(80)).toBeLessThan(nearest(50));
    expect(nearest(50)).toBeLessThan(nearest(10));
  });
});

describe('great and small circles', () => {
  it('great circle samples lie in the plane, on the lower hemisphere, from strike to strike', () => {
    const plane = { dipDirection: 130, dip: 50 };
    const lines = greatCircle(plane, 10);
    expect(lines).toHaveLength(11);
    const n = planeNormal(plane);
    for (const l of lines) {
      const v = lineToVector(l);
      expect(Math.abs(v[0] * n[0] + v[1] * n[1] + v[2] * n[2])).toBeLessThan(1e-12);
      expect(l.plunge).toBeGreaterThanOrEqual(0);
    }
    expectClose(lines[0], { trend: 40, plunge: 0 }, 1e-9);
    expectClose(lines[5], { trend: 130, plunge: 50 }, 1e-9);
    expectClose(lines[10], { trend: 220, plunge: 0 }, 1e-9);
  });

  it('a small circle keeps its half-angle from the axis', () => {
    const axis: Line = { trend: 200, plunge: 60 };
    const lines = smallCircle(axis, 15, 24);
    expect(lines).toHaveLength(25);
    for (const l of lines) expectClose(angleBetweenLines(axis, l), 15, 1e-9);
  });

  it('upper-hemisphere parts of a cone reappear on the opposite side of the net (axial data)', () => {
    const axis: Line = { trend: 90, plunge: 10 };
    const lines = smallCircle(axis, 30, 36);
    const east = lines.filter((l) => project(l, 'equal-area').x > 0);
    const west = lines.filter((l) => project(l, 'equal-area').x < 0);
    expect(east.length).toBeGreaterThan(0);
    expect(west.length).toBeGreaterThan(0);
    for (const l of lines) {
      expect(l.plunge).toBeGreaterThanOrEqual(0);
      expectClose(angleBetweenLines(axis, l), 30, 1e-9);
    }
  });

  it('rejects a cone wider than 180° or a bad segment count', () => {
    expect(() => smallCircle({ trend: 0, plunge: 30 }, 200)).toThrow(OrientationError);
    expect(() => greatCircle({ dipDirection: 0, dip: 30 }, 0)).toThrow(RangeError);
  });
});
