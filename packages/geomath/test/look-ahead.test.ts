import { ALONG_TUNNEL_LIMIT, planeCrossings, roundsToCrownAndInvert, tunnelFrame } from '../src/rock-mass.js';
import type { PlaneCrossingsInput } from '../src/rock-mass.js';
import { OrientationError, RatingError } from '../src/types.js';
import { expectClose } from './asserts.js';

// methods.md §6 worked examples [computed here; cross-checked there with mathjs.intersect]: circular tunnel
// r = 5 m, drive 060 horizontal, face at chainage 1000.000 m.
const tunnel = {
  chainage: 1000,
  drive: { trend: 60, plunge: 0 },
  crownHeight: 5,
  invertDepth: 5,
  halfWidth: 5,
};
const planeA: PlaneCrossingsInput = {
  ...tunnel,
  plane: { dipDirection: 240, dip: 60 },
  offset: { right: 2, up: 1 },
};
const planeB: PlaneCrossingsInput = {
  ...tunnel,
  plane: { dipDirection: 60, dip: 45 },
  offset: { right: 0, up: 0 },
};
const planeD: PlaneCrossingsInput = {
  ...tunnel,
  plane: { dipDirection: 150, dip: 80 },
  offset: { right: 0, up: 0 },
};

describe('planeCrossings: the chainage table of methods.md §6', () => {
  it('A 240/60 mapped 2 m right and 1 m up dips back toward the tunnel: crown 1002.309 ahead, invert 996.536 behind', () => {
    expectClose(
      planeCrossings(planeA),
      {
        axis: 999.423,
        crown: 1002.309,
        invert: 996.536,
        rightWall: 999.423,
        leftWall: 999.423,
      },
      1e-3,
    );
  });

  it('A: crown − invert = 10/tan 60° = 5.773 and crown − mapped level = 4/tan 60° = 2.309', () => {
    const r = planeCrossings(planeA);
    expectClose((r.crown ?? NaN) - (r.invert ?? NaN), 10 / Math.tan(Math.PI / 3), 1e-9);
    // The mapped point sits 1 m up, so it lies 4 m under the crown; it is on the face (chainage 1000).
    expectClose((r.crown ?? NaN) - 1000, 4 / Math.tan(Math.PI / 3), 1e-9);
  });

  it('B 060/45 through the axis dips ahead: crown 995 behind, invert 1005 ahead', () => {
    expectClose(
      planeCrossings(planeB),
      { axis: 1000, crown: 995, invert: 1005, rightWall: 1000, leftWall: 1000 },
      1e-9,
    );
  });

  it('D 150/80 strikes along the axis: every crossing is null', () => {
    expect(planeCrossings(planeD)).toEqual({
      axis: null,
      crown: null,
      invert: null,
      rightWall: null,
      leftWall: null,
    });
  });

  it('treats |n·a| below sin 0.5° as running along the tunnel', () => {
    // A vertical plane whose strike is x degrees off the axis has |n·a| = sin x.
    const vertical = (x: number): PlaneCrossingsInput => ({
      ...planeB,
      plane: { dipDirection: 150 + x, dip: 90 },
    });
    expect(planeCrossings(vertical(0.49)).axis).toBeNull();
    expect(planeCrossings(vertical(0.51)).axis).not.toBeNull();
    expectClose(ALONG_TUNNEL_LIMIT, Math.sin((0.5 * Math.PI) / 180), 1e-15);
  });

  it('measures chainage along an inclined axis (a plane square to a climbing drive crosses at the mapped point)', () => {
    // Plane square to a drive 060 climbing at 10°: its pole is 240/10, so the plane is 060/80; through the axis
    // it meets every line parallel to the axis at the face chainage.
    const r = planeCrossings({
      ...planeB,
      drive: { trend: 60, plunge: -10 },
      plane: { dipDirection: 60, dip: 80 },
    });
    expectClose(r, { axis: 1000, crown: 1000, invert: 1000, rightWall: 1000, leftWall: 1000 }, 1e-9);
  });

  it('rejects a vertical drive, a bad plane and negative sizes', () => {
    expect(() => planeCrossings({ ...planeA, drive: { trend: 0, plunge: 90 } })).toThrow(OrientationError);
    expect(() => planeCrossings({ ...planeA, plane: { dipDirection: 10, dip: 91 } })).toThrow(
      OrientationError,
    );
    expect(() => planeCrossings({ ...planeA, crownHeight: -1 })).toThrow(/crown height -1 m is not valid/);
    expect(() => planeCrossings({ ...planeA, chainage: Number.NaN })).toThrow(RatingError);
  });
});

describe('roundsToCrownAndInvert: in which coming round a plane reaches the crown or the invert', () => {
  const planes = [
    { label: 'F1', kind: 'fault' as const, plane: planeA.plane, offset: planeA.offset },
    { label: 'J2', kind: 'set' as const, plane: planeB.plane },
    { label: 'J3', kind: 'set' as const, plane: planeD.plane },
  ];
  const base = { ...tunnel, faceChainage: 1000, planes };

  it('with 3 m rounds: F1 reaches the crown in round 1, J2 the invert in round 2, J3 runs along', () => {
    const [f1, j2, j3] = roundsToCrownAndInvert({ ...base, roundLength: 3 });
    expect(f1.crown).toMatchObject({ status: 'ahead', round: 1 });
    expect(f1.invert).toMatchObject({ status: 'behind' });
    expect(j2.crown).toMatchObject({ status: 'behind', chainage: 995 });
    expect(j2.invert).toMatchObject({ status: 'ahead', round: 2, chainage: 1005 });
    expect(j3.crown).toEqual({ status: 'runs along the tunnel' });
    expect(f1.summary).toMatch(/^F1 \(fault\) reaches the crown in round 1 from now, at chainage 1002\.3/);
  });

  it('a crossing exactly at the end of a round belongs to that round', () => {
    // J2 reaches the invert at 1005.000: the end of round 1 for 5 m rounds, of round 2 for 2.5 m rounds.
    expect(roundsToCrownAndInvert({ ...base, roundLength: 5 })[1].invert).toMatchObject({ round: 1 });
    expect(roundsToCrownAndInvert({ ...base, roundLength: 2.5 })[1].invert).toMatchObject({ round: 2 });
    expect(roundsToCrownAndInvert({ ...base, roundLength: 2.4 })[1].invert).toMatchObject({ round: 3 });
  });

  it('a crossing exactly at the face counts as behind it', () => {
    const r = roundsToCrownAndInvert({ ...base, crownHeight: 0, roundLength: 3 })[1];
    expect(r.crown).toMatchObject({ status: 'behind', distanceAhead: 0 });
  });

  it('rejects a round length of 0 or less', () => {
    expect(() => roundsToCrownAndInvert({ ...base, roundLength: 0 })).toThrow(
      /round length 0 m is not valid/,
    );
  });
});

describe('tunnelFrame', () => {
  it('drive 060 level: forward (0.5, 0.866, 0), up (0, 0, −1), right (−0.866, 0.5, 0) = trend 150 (methods.md §6)', () => {
    const f = tunnelFrame({ trend: 60, plunge: 0 });
    expectClose(f.forward, [0.5, 0.866025, 0], 1e-6);
    expectClose(f.up, [0, 0, -1], 1e-12);
    expectClose(f.right, [-0.866025, 0.5, 0], 1e-6);
  });

  it('leans forward on a descending drive, staying square to the axis', () => {
    const f = tunnelFrame({ trend: 0, plunge: 10 });
    expectClose(f.up, [Math.sin(Math.PI / 18), 0, -Math.cos(Math.PI / 18)], 1e-12);
    expectClose(f.up[0] * f.forward[0] + f.up[1] * f.forward[1] + f.up[2] * f.forward[2], 0, 1e-12);
  });
});
