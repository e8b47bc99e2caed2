import fc from 'fast-check';
import {
  OrientationError,
  alignmentLength,
  alignmentPointAt,
  chainageAhead,
  distanceAheadOf,
  driveAt,
  driveBearingAt,
  planeCrossings,
  positionAt,
  roundsToCrownAndInvert,
  straightAlignment,
} from '../src/index.js';
import type { HeadingAlignment } from '../src/index.js';
import { expectAzimuthClose, expectClose } from './asserts.js';

const rad = (deg: number): number => (deg * Math.PI) / 180;

// An invented alignment: 100 m straight at 060°, a 200 m right-hand arc of radius 500 m, a 50 m straight.
const curved: HeadingAlignment = {
  startChainage: 2450,
  start: { east: 1000, north: 5000 },
  startBearing: 60,
  segments: [{ length: 100 }, { length: 200, radius: 500, turn: 'right' }, { length: 50 }],
};

describe('heading alignment: positions and drive bearings (plane geometry of straights and circular arcs; common practice)', () => {
  // Hand computation with the arc's centre (not the chord formula the code uses) [computed here]:
  // after the straight E = 1000 + 100 sin 60 = 1086.6025, N = 5000 + 100 cos 60 = 5050; centre 500 m
  // to the right (bearing 150) at (1336.6025, 4616.9873); the arc turns 200/500 rad = 22.9183°.
  it.each([
    [2450, 1000, 5000, 60],
    [2550, 1086.6025404, 5050, 60],
    [2650, 1177.6122396, 5091.0359077, 71.4591559],
    [2750, 1274.9603804, 5113.1729933, 82.9183118],
    [2800, 1324.57895, 5119.3372093, 82.9183118],
  ])('chainage %d: E %d, N %d, bearing %d', (chainage, east, north, bearing) => {
    const p = alignmentPointAt(curved, chainage);
    expectClose(p.east, east, 1e-6);
    expectClose(p.north, north, 1e-6);
    expectAzimuthClose(p.bearing, bearing, 1e-7);
    expectClose(positionAt(curved, chainage), { east, north }, 1e-6);
    expectAzimuthClose(driveBearingAt(curved, chainage), bearing, 1e-7);
  });

  it('a left-hand quarter circle from north ends heading west, R to the left and R ahead (common practice)', () => {
    const quarter: HeadingAlignment = {
      startChainage: 0,
      start: { east: 0, north: 0 },
      startBearing: 0,
      segments: [{ length: (Math.PI * 100) / 2, radius: 100, turn: 'left' }],
    };
    const end = alignmentPointAt(quarter, (Math.PI * 100) / 2);
    expectClose(end, { east: -100, north: 100 }, 1e-9);
    expectAzimuthClose(end.bearing, 270, 1e-9);
  });

  it('driven against the chainage: the same geometry with chainages decreasing from the start', () => {
    const against: HeadingAlignment = { ...curved, chainageSense: 'decreasing' };
    const p = alignmentPointAt(against, 2450 - 200);
    const q = alignmentPointAt(curved, 2450 + 200);
    expectClose(
      { east: p.east, north: p.north, bearing: p.bearing },
      { east: q.east, north: q.north, bearing: q.bearing },
      1e-9,
    );
    expect(p.distance).toBe(200);
    expect(() => alignmentPointAt(against, 2451)).toThrow(RangeError); // behind the start
    expect(() => alignmentPointAt(curved, 2801)).toThrow('runs from 2450 to 2800');
    expect(alignmentLength(curved)).toBe(350);
  });

  it('the drive at a chainage carries the gradient as a plunge (rising = climbing, negative plunge)', () => {
    const drive = driveAt({ ...curved, gradientPercent: 0.4 }, 2650);
    expectAzimuthClose(drive.trend, 71.4591559, 1e-7);
    expectClose(drive.plunge, -0.2291819, 1e-7); // −atan(0.004) [computed here]
    expect(driveAt(curved, 2450).plunge).toBe(0);
  });

  it('refuses a bad alignment with a message', () => {
    const bad = (segments: HeadingAlignment['segments']): HeadingAlignment => ({ ...curved, segments });
    expect(() => alignmentPointAt(bad([]), 2450)).toThrow(OrientationError);
    expect(() => alignmentPointAt(bad([{ length: 0 }]), 2450)).toThrow('more than 0 m');
    expect(() => alignmentPointAt(bad([{ length: 10, radius: 100 }]), 2450)).toThrow('left or right');
    expect(() => alignmentPointAt(bad([{ length: 10, radius: -5, turn: 'left' }]), 2450)).toThrow('radius');
    expect(() => alignmentPointAt(bad([{ length: 10, turn: 'left' }]), 2450)).toThrow(
      'a straight has no side',
    );
    expect(() => alignmentPointAt(bad([{ length: Infinity }, { length: 5 }]), 2450)).toThrow('open-ended');
    expect(() => alignmentPointAt({ ...curved, chainageSense: 'up' as never }, 2450)).toThrow(
      OrientationError,
    );
  });
});

describe('heading alignment: properties (common practice: plane trigonometry)', () => {
  it('a full-circle arc returns to its start with the start bearing', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 5000, noNaN: true }),
        fc.double({ min: 0, max: 359.999, noNaN: true }),
        fc.constantFrom('left' as const, 'right' as const),
        fc.double({ min: -1e5, max: 1e5, noNaN: true }),
        (radius, bearing, turn, e0) => {
          const a: HeadingAlignment = {
            startChainage: 100,
            start: { east: e0, north: -e0 / 2 },
            startBearing: bearing,
            segments: [{ length: 2 * Math.PI * radius, radius, turn }],
          };
          const end = alignmentPointAt(a, 100 + 2 * Math.PI * radius);
          expectClose(end.east, e0, 1e-9 * Math.max(1, radius, Math.abs(e0)));
          expectClose(end.north, -e0 / 2, 1e-9 * Math.max(1, radius, Math.abs(e0)));
          expectAzimuthClose(end.bearing, bearing, 1e-9);
          // Halfway round, the point is one diameter across, on the turning side.
          const half = alignmentPointAt(a, 100 + Math.PI * radius);
          const side = rad(bearing + (turn === 'right' ? 90 : -90));
          expectClose(half.east, e0 + 2 * radius * Math.sin(side), 1e-9 * Math.max(1, radius, Math.abs(e0)));
          expectClose(
            half.north,
            -e0 / 2 + 2 * radius * Math.cos(side),
            1e-9 * Math.max(1, radius, Math.abs(e0)),
          );
        },
      ),
    );
  });

  it('straight segments match plain trigonometry, E = E0 + s·sin β, N = N0 + s·cos β', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 359.999, noNaN: true }),
        fc.double({ min: 0, max: 3000, noNaN: true }),
        fc.constantFrom('increasing' as const, 'decreasing' as const),
        (bearing, s, sense) => {
          const a = straightAlignment({
            startChainage: 1000,
            driveTrend: bearing,
            startEasting: 200,
            startNorthing: 300,
            chainageSense: sense,
          });
          const p = positionAt(a, chainageAhead(1000, s, sense));
          expectClose(p.east, 200 + s * Math.sin(rad(bearing)), 1e-9 * Math.max(1, s));
          expectClose(p.north, 300 + s * Math.cos(rad(bearing)), 1e-9 * Math.max(1, s));
        },
      ),
    );
  });

  it('the tangent bearing is the direction of the path (finite difference), across segment joins', () => {
    for (let c = 2450; c <= 2799; c += 7) {
      const p = positionAt(curved, c);
      const q = positionAt(curved, c + 0.001);
      const direction = (Math.atan2(q.east - p.east, q.north - p.north) * 180) / Math.PI;
      expectAzimuthClose(direction, driveBearingAt(curved, c + 0.0005), 1e-4);
      // Each metre of chainage is a metre of path.
      expectClose(Math.hypot(q.east - p.east, q.north - p.north), 0.001, 1e-9);
    }
  });
});

describe('chainage sense (issue 10: a heading driven against the chainage; common practice)', () => {
  it('chainage d metres ahead of the face follows the sense', () => {
    expect(chainageAhead(2450, 3.5)).toBe(2453.5);
    expect(chainageAhead(2450, 3.5, 'decreasing')).toBe(2446.5);
    expect(distanceAheadOf(2450, 2446.5, 'decreasing')).toBe(3.5);
    expect(distanceAheadOf(2450, 2446.5)).toBe(-3.5);
  });

  // methods.md §6 worked example A (computed there): plane 240/60 mapped at (2, 1) m, drive 060, face at
  // 1000 m, r = 5 m: axis 999.423, crown 1002.309, invert 996.536 with chainage increasing.
  const exampleA = {
    plane: { dipDirection: 240, dip: 60 },
    chainage: 1000,
    offset: { right: 2, up: 1 },
    drive: { trend: 60, plunge: 0 },
    crownHeight: 5,
    invertDepth: 5,
    halfWidth: 5,
  };

  it('planeCrossings: default unchanged; against the chainage the same distances run to smaller chainages', () => {
    const up = planeCrossings(exampleA);
    expectClose(up.crown, 1002.309, 0.0005);
    expectClose(up.axis, 999.423, 0.0005);
    const down = planeCrossings({ ...exampleA, chainageSense: 'decreasing' });
    expectClose(down.crown, 1000 - 2.309, 0.0005); // 2.309 m ahead = chainage 997.691
    expectClose(down.invert, 1000 + 3.464, 0.0005); // 3.464 m behind = chainage 1003.464
    expectClose(down.axis, 1000 + 0.577, 0.0005);
  });

  it('roundsToCrownAndInvert against the chainage: ahead crossings at decreasing chainages, same rounds', () => {
    const input = {
      planes: [{ label: 'F1', kind: 'fault' as const, plane: exampleA.plane, offset: exampleA.offset }],
      faceChainage: 1000,
      roundLength: 1.5,
      drive: exampleA.drive,
      crownHeight: 5,
      invertDepth: 5,
      halfWidth: 5,
    };
    const [inc] = roundsToCrownAndInvert(input);
    const [dec] = roundsToCrownAndInvert({ ...input, chainageSense: 'decreasing' });
    expect(inc.crown).toMatchObject({ status: 'ahead', round: 2 });
    expect(dec.crown).toMatchObject({ status: 'ahead', round: 2 });
    if (dec.crown.status !== 'ahead' || inc.crown.status !== 'ahead') throw new Error('expected ahead');
    expectClose(dec.crown.distanceAhead, inc.crown.distanceAhead, 1e-12);
    expect(dec.crown.chainage).toBeLessThan(1000);
    expect(dec.summary).toContain('at chainage 997.7 (2.3 m ahead)');
    expect(dec.invert.status).toBe('behind');
  });
});
