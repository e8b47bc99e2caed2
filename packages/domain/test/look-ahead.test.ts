// The heading's look-ahead for the handover. Crossings from featureReaches (geomath stageCrossings); the check
// values are methods.md §6's worked examples [computed there]: circular tunnel r = 5 m, drive 060°,
// horizontal, face at 1000.000 m. Which round meets it: common practice (⌈distance / round length⌉).
import {
  featureReaches,
  headingLookAhead,
  roundsAheadLabel,
  type FactJoint,
  type LookAheadSource,
  type RoundFacts,
} from '../src/index.js';

const circle = { driveTrend: 60, gradientPercent: 0, profileHeight: 10, profileWidth: 10, axisHeight: 5 };
const facts = (faceChainage: number, joints: FactJoint[]): RoundFacts => ({
  q: null,
  rmr: null,
  inflowPer10m: null,
  overbreakM3: null,
  faceChainage,
  recommendedClassId: null,
  previousClassId: null,
  joints,
});
/** Plane A of methods.md §6: 240/60 through (2 m right, 1 m up); crown 1002.309, invert 996.536. */
const faultA: FactJoint = {
  id: 'a',
  kind: 'fault',
  setLabel: null,
  dipDirection: 240,
  dip: 60,
  faceOffset: { right: 2, up: 1 },
};
/** Plane B: 060/45 through the face centre; crown 995.000 (behind), invert 1005.000 (ahead). */
const shearB: FactJoint = { id: 'b', kind: 'shear-zone', setLabel: null, dipDirection: 60, dip: 45 };
/** Plane D: 150/80, strike along the axis: no crossing. */
const faultD: FactJoint = { id: 'd', kind: 'fault', setLabel: null, dipDirection: 150, dip: 80 };

const source = (
  roundNumber: number,
  face: number,
  joints: FactJoint[],
  sense: 1 | -1 = 1,
): LookAheadSource => ({
  roundNumber,
  faceChainage: face,
  reaches: featureReaches(facts(face, joints), { ...circle, chainageSense: sense }),
});

describe('headingLookAhead', () => {
  it('lists the crown crossing ahead of the face with its chainages and the round it is met in (example A)', () => {
    const [a] = headingLookAhead([source(7, 1000, [faultA])], {
      faceChainage: 1000,
      chainageSense: 1,
      roundLength: 3,
    });
    expect(a).toMatchObject({ label: 'fault 1', roundNumber: 7, firstAt: 'crown', roundsAhead: 1 });
    expect(a.crownChainage).toBeCloseTo(1002.309, 3);
    expect(a.invertChainage).toBeCloseTo(996.536, 3);
    expect(a.crownAhead).toBeCloseTo(2.309, 3);
    expect(a.invertAhead).toBeCloseTo(-3.464, 3); // already passed at the invert
    expect(a.nearestAhead).toBeCloseTo(2.309, 3);
  });

  it('measures from today’s face, not the face of the round that mapped it', () => {
    const [a] = headingLookAhead([source(7, 1000, [faultA])], {
      faceChainage: 1001.5,
      chainageSense: 1,
      roundLength: 1.5,
    });
    expect(a.nearestAhead).toBeCloseTo(0.809, 3);
    expect(a.roundsAhead).toBe(1);
    // Once the face is past the crown crossing too, the feature leaves the list.
    expect(
      headingLookAhead([source(7, 1000, [faultA])], { faceChainage: 1003, chainageSense: 1, roundLength: 3 }),
    ).toEqual([]);
  });

  it('takes the invert when only the invert lies ahead (example B), and counts the rounds to it', () => {
    const [b] = headingLookAhead([source(4, 1000, [shearB])], {
      faceChainage: 1000,
      chainageSense: 1,
      roundLength: 2,
    });
    expect(b).toMatchObject({ label: 'shear zone 1', firstAt: 'invert', roundsAhead: 3 });
    expect(b.invertChainage).toBeCloseTo(1005, 3);
    expect(b.crownAhead).toBeCloseTo(-5, 3);
  });

  it('follows a heading driven against the chainage: the chainages ahead decrease', () => {
    const [a] = headingLookAhead([source(7, 1000, [faultA], -1)], {
      faceChainage: 999,
      chainageSense: -1,
      roundLength: 3,
    });
    expect(a.crownChainage).toBeCloseTo(997.691, 3);
    expect(a.crownAhead).toBeCloseTo(1.309, 3);
    expect(a.firstAt).toBe('crown');
  });

  it('leaves out a plane that runs along the tunnel (example D) and sorts the rest nearest first', () => {
    const items = headingLookAhead([source(8, 1000, [faultD, shearB]), source(7, 1000, [faultA])], {
      faceChainage: 1000,
      chainageSense: 1,
      roundLength: null,
    });
    expect(items.map((i) => [i.label, i.roundNumber])).toEqual([
      ['fault 1', 7],
      ['shear zone 2', 8],
    ]);
    expect(items.every((i) => i.roundsAhead === null)).toBe(true);
  });

  it('puts a crossing exactly at a round’s end in that round, and one just beyond in the next', () => {
    const at = (ch: number): LookAheadSource => ({
      roundNumber: 1,
      faceChainage: 100,
      reaches: [
        {
          label: 'fault 1',
          chainage: { crown: ch, invert: null, rightWall: null, leftWall: null },
          traceKnown: true,
        },
      ],
    });
    const o = { faceChainage: 100, chainageSense: 1 as const, roundLength: 3 };
    expect(headingLookAhead([at(103)], o)[0].roundsAhead).toBe(1);
    expect(headingLookAhead([at(103.01)], o)[0].roundsAhead).toBe(2);
    expect(headingLookAhead([at(100)], o)).toEqual([]); // at the face, not ahead
  });
});

describe('roundsAheadLabel', () => {
  it('says which coming round', () => {
    expect(roundsAheadLabel(1)).toBe('in the next round');
    expect(roundsAheadLabel(3)).toBe('in round 3 from now');
    expect(roundsAheadLabel(null)).toBe('round length not known');
  });
});
