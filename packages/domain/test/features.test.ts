// "Same feature as": a persistent feature seen on several faces is one feature when a stretch of tunnel is
// analysed (issue 10 item 2; the rule and the choice of the latest observation: common practice, see
// src/features.ts). Crossings: methods.md §6 example A (circular tunnel r = 5 m, drive 060°, horizontal).
import {
  featureReaches,
  findRoundSets,
  foldedCount,
  headingLookAhead,
  onePerFeature,
  sameFeatureCandidates,
  type FactJoint,
  type FeatureCandidate,
  type NearbyPlane,
  type RoundFacts,
  type SetJoint,
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
const fault = (id: string, sameAsJointId: string | null): FactJoint => ({
  id,
  kind: 'fault',
  setLabel: null,
  dipDirection: 240,
  dip: 60,
  faceOffset: { right: 2, up: 1 },
  sameAsJointId,
});

describe('onePerFeature', () => {
  it('keeps the latest observation of a linked feature and every unlinked one, in order', () => {
    const items = [
      { id: 'a1', roundNumber: 1 },
      { id: 'x', roundNumber: 1 },
      { id: 'a3', roundNumber: 3, sameAsJointId: 'a1' },
      { id: 'a2', roundNumber: 2, sameAsJointId: 'a1' },
    ];
    const kept = onePerFeature(items, (a, b) => a.roundNumber - b.roundNumber);
    expect(kept.map((i) => i.id)).toEqual(['x', 'a3']);
    expect(foldedCount(items)).toBe(2);
    // Unlinked, the same four observations are four features.
    expect(onePerFeature(items.map((i) => ({ id: i.id })))).toHaveLength(4);
  });
});

describe('headingLookAhead with a fault seen on two faces', () => {
  // Round 2 (face 1000) maps the fault; round 3 (face 1001) maps it again, 1 m further on.
  const sources = (linked: boolean) => [
    {
      roundNumber: 3,
      faceChainage: 1001,
      reaches: featureReaches(facts(1001, [fault('f3', linked ? 'f2' : null)]), circle),
    },
    { roundNumber: 2, faceChainage: 1000, reaches: featureReaches(facts(1000, [fault('f2', null)]), circle) },
  ];
  const options = { faceChainage: 1001, chainageSense: 1 as const, roundLength: 3 };

  it('lists a linked fault once, from its latest observation', () => {
    const items = headingLookAhead(sources(true), options);
    expect(items).toHaveLength(1);
    expect(items[0].roundNumber).toBe(3);
    // Example A from the face at 1001: the crown crossing 2.309 m ahead, at 1003.309.
    expect(items[0].crownChainage).toBeCloseTo(1003.309, 3);
  });

  it('lists the two observations twice when they are not linked', () => {
    const items = headingLookAhead(sources(false), options);
    expect(items.map((i) => i.roundNumber)).toEqual([2, 3]); // nearest first: round 2's crossing is at 1002.309
    expect(items[0].nearestAhead).toBeCloseTo(1.309, 3);
  });
});

describe('findRoundSets with a named joint seen on the previous face', () => {
  // Two sets on both faces: A about 090/60, B about 200/30. The named joint N (a persistent A joint) is on
  // both faces.
  const a = (id: string, dd: number, dip: number, extra: Partial<SetJoint> = {}): SetJoint => ({
    id,
    plane: { dipDirection: dd, dip },
    spacingM: null,
    override: null,
    ...extra,
  });
  const here: SetJoint[] = [
    a('h1', 88, 60),
    a('h2', 92, 62),
    a('h3', 200, 30),
    a('h4', 204, 28),
    a('n-here', 90, 61, { sameAsJointId: 'n-before' }),
  ];
  const near = (linked: boolean): NearbyPlane[] => [
    { id: 'e1', roundId: 'r1', roundNumber: 1, plane: { dipDirection: 91, dip: 59 } },
    { id: 'e2', roundId: 'r1', roundNumber: 1, plane: { dipDirection: 198, dip: 31 } },
    { id: 'n-before', roundId: 'r1', roundNumber: 1, plane: { dipDirection: 89, dip: 60 } },
    ...(linked
      ? []
      : [
          {
            id: 'n-other',
            roundId: 'r1',
            roundNumber: 1,
            plane: { dipDirection: 90, dip: 60 },
          } as NearbyPlane,
        ]),
  ];

  it('counts the linked named joint once (this face), the unlinked earlier joints once each', () => {
    const linked = findRoundSets(here, near(true), null, { windowM: 25, count: 2 });
    const setA = linked.sets.find((s) => s.memberIds.includes('n-here'))!;
    expect(setA.count).toBe(4); // h1, h2, n-here, e1 — n-before is the same feature as n-here
    expect(setA.nearbyMemberIds).toEqual(['e1']);
    expect(linked.used).toBe(7);
    expect(linked.linkedLeftOut).toBe(1);
  });

  it('counts it twice when not linked', () => {
    const unlinked = findRoundSets(
      here.map((j) => ({ ...j, sameAsJointId: null })),
      near(true),
      null,
      { windowM: 25, count: 2 },
    );
    const setA = unlinked.sets.find((s) => s.memberIds.includes('n-here'))!;
    expect(setA.count).toBe(5);
    expect(setA.nearbyMemberIds.sort()).toEqual(['e1', 'n-before']);
    expect(unlinked.linkedLeftOut).toBe(0);
  });

  it('of two earlier observations of one other feature keeps one, the later', () => {
    const sets = findRoundSets(
      here,
      [
        ...near(true),
        { id: 'm1', roundId: 'r1', roundNumber: 1, plane: { dipDirection: 202, dip: 29 } },
        {
          id: 'm2',
          roundId: 'r2',
          roundNumber: 2,
          plane: { dipDirection: 201, dip: 30 },
          sameAsJointId: 'm1',
        },
      ],
      null,
      { windowM: 25, count: 2 },
    );
    const setB = sets.sets.find((s) => s.memberIds.includes('h3'))!;
    expect(setB.nearbyMemberIds.sort()).toEqual(['e2', 'm2']);
    expect(sets.linkedLeftOut).toBe(2);
  });
});

describe('sameFeatureCandidates', () => {
  const c = (
    id: string,
    roundNumber: number,
    faceChainage: number,
    dd: number,
    dip: number,
  ): FeatureCandidate => ({
    id,
    roundId: `r${roundNumber}`,
    roundNumber,
    faceChainage,
    kind: 'fault',
    dipDirection: dd,
    dip,
  });
  const all = [
    c('near-same', 4, 1010, 242, 58),
    c('near-other', 4, 1010, 150, 80), // 80°-odd apart: not offered
    c('far-same', 1, 950, 240, 60), // 60 m back: not offered
    c('older-same', 3, 1007, 238, 61),
    { ...c('linked-later', 4, 1010, 239, 60), sameAsJointId: 'older-same' },
    c('own-round', 5, 1013, 240, 60),
  ];

  it('offers other rounds within the distance and the orientation tolerance, one per feature, closest first', () => {
    const offered = sameFeatureCandidates(all, {
      plane: { dipDirection: 240, dip: 60 },
      faceChainage: 1013,
      roundId: 'r5',
    });
    expect(offered.map((o) => o.candidate.id)).toEqual(['linked-later', 'near-same']);
    expect(offered[0].angle!).toBeLessThan(1.1);
    expect(offered[1].distance).toBe(3);
  });

  it('offers by distance alone while the orientation cannot be read, and follows a tighter tolerance', () => {
    expect(
      sameFeatureCandidates(all, { plane: null, faceChainage: 1013, roundId: 'r5' }).map(
        (o) => o.candidate.id,
      ),
    ).toEqual(['near-same', 'near-other', 'linked-later']);
    expect(
      sameFeatureCandidates(all, {
        plane: { dipDirection: 240, dip: 60 },
        faceChainage: 1013,
        roundId: 'r5',
        toleranceDeg: 1,
      }).map((o) => o.candidate.id),
    ).toEqual(['linked-later']);
  });
});
