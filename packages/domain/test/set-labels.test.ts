// Sets that keep their names along the heading (issue 12 item 3): matching by orientation across rounds.
import { angleBetweenPlanes, type Plane } from '@roundbook/geomath';
import {
  findRoundSets,
  headingSetsOf,
  matchSetLabels,
  namedLabel,
  SET_MATCH_ANGLE,
  type HeadingSet,
  type RoundSets,
  type SetJoint,
} from '../src/index.js';

// Three invented sets far apart (computed here: ≥ 60° between any two poles, checked below).
const A: Plane = { dipDirection: 292, dip: 65 };
const B: Plane = { dipDirection: 40, dip: 30 };
const C: Plane = { dipDirection: 158, dip: 70 };
const D: Plane = { dipDirection: 220, dip: 80 };
// Fixed small scatter about a mean (degrees of dip direction, dip): a tight set, no random numbers.
const SCATTER = [
  [0, 0],
  [4, 2],
  [-4, -2],
  [3, -3],
  [-3, 3],
  [6, 1],
  [-6, -1],
  [2, 4],
] as const;
let ids = 0;
const setOf = (mean: Plane, n: number, shift = 0): SetJoint[] =>
  SCATTER.slice(0, n).map(([dd, dip]) => ({
    id: `j${++ids}`,
    plane: { dipDirection: (mean.dipDirection + dd + shift + 360) % 360, dip: mean.dip + dip },
    spacingM: null,
    override: null,
  }));
const labelNear = (sets: RoundSets, p: Plane) =>
  sets.sets.find((s) => angleBetweenPlanes(s.mean, p) < 10)?.label;

/** Rounds one after another, each matched to the heading's sets its earlier rounds left (as the API does). */
function mapRounds(faces: SetJoint[][], counts: number[]): RoundSets[] {
  const done: Array<{ chainage: number; sets: RoundSets['sets'] }> = [];
  return faces.map((joints, i) => {
    const sets = findRoundSets(
      joints,
      [],
      null,
      { windowM: 0, count: counts[i] },
      {
        sets: headingSetsOf(done),
      },
    );
    done.push({ chainage: 100 + 3 * i, sets: sets.sets });
    return sets;
  });
}

describe('set labels along the heading', () => {
  it('the invented sets are far apart (computed here with geomath angleBetweenPlanes)', () => {
    for (const [p, q] of [
      [A, B],
      [A, C],
      [B, C],
      [A, D],
      [B, D],
      [C, D],
    ])
      expect(angleBetweenPlanes(p, q)).toBeGreaterThan(40);
  });

  it('keeps S1, S2, S3 on the same sets across five rounds, though the largest set changes on round 3', () => {
    const sizes = [
      [6, 4, 3],
      [6, 5, 3],
      [3, 7, 5], // B and C are larger than A here: by size alone, B would be S1
      [5, 4, 3],
      [4, 4, 6],
    ];
    const faces = sizes.map(([a, b, c], i) => [...setOf(A, a, i), ...setOf(B, b, -i), ...setOf(C, c, i)]);
    const rounds = mapRounds(faces, [3, 3, 3, 3, 3]);
    for (const r of rounds) {
      expect(labelNear(r, A)).toBe('S1');
      expect(labelNear(r, B)).toBe('S2');
      expect(labelNear(r, C)).toBe('S3');
      expect(r.matching?.maxAngle).toBe(SET_MATCH_ANGLE);
    }
    // Round 2 onwards each set kept a label of the heading, a few degrees from it; round 1 had none to keep.
    expect(rounds[0].sets.every((s) => s.matchedAngle === null)).toBe(true);
    for (const r of rounds.slice(1))
      for (const s of r.sets) expect(s.matchedAngle).toBeLessThan(SET_MATCH_ANGLE);
    // Without the heading's sets the third round is labelled by size and B takes S1 (the swap this prevents).
    expect(labelNear(findRoundSets(faces[2], [], null, { windowM: 0, count: 3 }), B)).toBe('S1');
  });

  it('gives a set seen for the first time the next free label, past every label the heading has', () => {
    const faces = [
      [...setOf(A, 6), ...setOf(B, 5), ...setOf(C, 4)],
      [...setOf(A, 5), ...setOf(B, 5), ...setOf(C, 4), ...setOf(D, 7)],
    ];
    const [, second] = mapRounds(faces, [3, 4]);
    // D is the largest set of round 2 but new to the heading: S4, and S1–S3 stay where they were.
    expect(labelNear(second, D)).toBe('S4');
    expect([labelNear(second, A), labelNear(second, B), labelNear(second, C)]).toEqual(['S1', 'S2', 'S3']);
    expect(second.sets.find((s) => s.label === 'S4')?.matchedAngle).toBeNull();
    // A heading whose S2 was merged away keeps S2 unused: the next new set is S4 (past S3).
    const out = matchSetLabels(
      [{ mean: D }],
      [
        { label: 'S1', mean: A, alpha95: 5, chainage: 0 },
        { label: 'S3', mean: C, alpha95: 5, chainage: 0 },
      ],
    );
    expect(out).toEqual([{ label: 'S4', angle: null }]);
  });

  it('leaves a joint far from every set random, not in the nearest set', () => {
    const far: SetJoint = { id: 'far', plane: D, spacingM: null, override: null };
    const heading: HeadingSet[] = [
      { label: 'S1', mean: A, alpha95: 4, chainage: 0 },
      { label: 'S2', mean: B, alpha95: 4, chainage: 0 },
    ];
    const sets = findRoundSets(
      [...setOf(A, 6), ...setOf(B, 6), far],
      [],
      null,
      { windowM: 0, count: 2 },
      { sets: heading },
    );
    expect(sets.membership.far).toBe('');
    expect(sets.sets.flatMap((s) => s.memberIds)).not.toContain('far');
    expect(sets.sets.map((s) => s.label).sort()).toEqual(['S1', 'S2']);
  });

  it('matches within 20° or within the heading set’s cone when wider, one heading set to one round set, nearest first', () => {
    const shifted = (p: Plane, by: number): Plane => ({ dipDirection: p.dipDirection, dip: p.dip - by });
    // A mean 25° of dip away (angle between the poles 25°, computed here) is a new set under a 10° cone …
    expect(angleBetweenPlanes(shifted(A, 25), A)).toBeCloseTo(25, 6);
    expect(
      matchSetLabels([{ mean: shifted(A, 25) }], [{ label: 'S1', mean: A, alpha95: 10, chainage: 0 }]),
    ).toEqual([{ label: 'S2', angle: null }]);
    // … and the same set under a 30° cone.
    expect(
      matchSetLabels([{ mean: shifted(A, 25) }], [{ label: 'S1', mean: A, alpha95: 30, chainage: 0 }])[0]
        .label,
    ).toBe('S1');
    // Two sets of the round near one heading set: the nearer keeps S1, the other is new.
    const two = matchSetLabels(
      [{ mean: shifted(A, 12) }, { mean: shifted(A, 3) }],
      [{ label: 'S1', mean: A, alpha95: 5, chainage: 0 }],
    );
    expect(two.map((t) => t.label)).toEqual(['S2', 'S1']);
    expect(two[1].angle).toBeCloseTo(3, 6);
  });

  it('reads the geologist’s merge and rename: S3 merged into S1 is one set, S2 renamed keeps its joints', () => {
    const joints = [...setOf(A, 6), ...setOf(B, 5), ...setOf(C, 4)];
    const heading: HeadingSet[] = [
      { label: 'S1', mean: A, alpha95: 4, chainage: 0 },
      { label: 'S2', mean: B, alpha95: 4, chainage: 0 },
      { label: 'S3', mean: C, alpha95: 4, chainage: 0 },
    ];
    const plain = findRoundSets(joints, [], null, { windowM: 0, count: 3 }, { sets: heading });
    const named = findRoundSets(
      joints,
      [],
      null,
      { windowM: 0, count: 3 },
      { sets: heading, names: { S3: 'S1', S2: 'Foliation' } },
    );
    expect(named.sets.map((s) => s.label).sort()).toEqual(['Foliation', 'S1']);
    const s1 = named.sets.find((s) => s.label === 'S1')!;
    expect(s1.countHere).toBe(10);
    expect(new Set(s1.memberIds)).toEqual(
      new Set([
        ...plain.sets.find((s) => s.label === 'S1')!.memberIds,
        ...plain.sets.find((s) => s.label === 'S3')!.memberIds,
      ]),
    );
    // The merged mean is worked out again from all ten joints: it lies between the two old means.
    expect(angleBetweenPlanes(s1.mean, A)).toBeGreaterThan(5);
    expect(angleBetweenPlanes(s1.mean, C)).toBeGreaterThan(5);
    expect(named.sets.find((s) => s.label === 'Foliation')!.memberIds).toEqual(
      plain.sets.find((s) => s.label === 'S2')!.memberIds,
    );
    // An override to a merged label joins the set it was merged into.
    const moved = findRoundSets(
      [...joints, { id: 'o', plane: D, spacingM: null, override: 'S3' }],
      [],
      null,
      { windowM: 0, count: 3 },
      { sets: heading, names: { S3: 'S1' } },
    );
    expect(moved.membership.o).toBe('S1');
  });

  it('follows names through and stops at a loop; the heading’s sets are each label’s latest mean', () => {
    expect(namedLabel('S4', { S4: 'S2', S2: 'Bedding' })).toBe('Bedding');
    expect(namedLabel('S1', { S1: 'S2', S2: 'S1' })).toBe('S2');
    expect(namedLabel('S1', { S1: '  ' })).toBe('S1');
    const sets = headingSetsOf(
      [
        { chainage: 10, sets: [{ label: 'S1', mean: A, alpha95: 5 }] },
        {
          chainage: 13,
          sets: [
            { label: 'S1', mean: B, alpha95: 6 },
            { label: 'S4', mean: C, alpha95: 7 },
          ],
        },
      ],
      { S4: 'S2' },
    );
    expect(sets).toEqual([
      { label: 'S1', mean: B, alpha95: 6, chainage: 13 },
      { label: 'S2', mean: C, alpha95: 7, chainage: 13 },
    ]);
  });
});
