import { applyChoices, threeWayMerge } from '@/lib/sync/merge';

interface Doc {
  faceChainage: string;
  distantParts: string;
  groundNotes: string;
  q: { jr: string; ja: string };
  joints: { key: string; orientationText: string; notes: string }[];
  sketch: { elements: string[] };
}

const base: Doc = {
  faceChainage: '1+250.0',
  distantParts: '',
  groundNotes: 'Blocky',
  q: { jr: '1.5', ja: '1' },
  joints: [
    { key: 'a', orientationText: '130/50', notes: '' },
    { key: 'b', orientationText: '315/70', notes: '' },
  ],
  sketch: { elements: ['crown'] },
};

const edit = (patch: Partial<Doc>): Doc => ({ ...structuredClone(base), ...patch });

describe('threeWayMerge', () => {
  it('takes each side where only that side changed a field (different fields: no question asked)', () => {
    const mine = edit({ groundNotes: 'Blocky, wet in the crown', q: { jr: '1.5', ja: '2' } });
    const theirs = edit({ faceChainage: '1+252.5', q: { jr: '3', ja: '1' } });
    const r = threeWayMerge(base, mine, theirs);
    expect(r.conflicts).toEqual([]);
    expect(r.merged.groundNotes).toBe('Blocky, wet in the crown');
    expect(r.merged.faceChainage).toBe('1+252.5');
    expect(r.merged.q).toEqual({ jr: '3', ja: '2' });
    expect(r.fromTheirs.sort()).toEqual(['faceChainage', 'q.jr']);
    expect(r.fromMine.sort()).toEqual(['groundNotes', 'q.ja']);
  });

  it('names a field both changed as a conflict, and keeps mine there until the person chooses', () => {
    const mine = edit({ groundNotes: 'My notes from the face' });
    const theirs = edit({ groundNotes: 'Their office notes' });
    const r = threeWayMerge(base, mine, theirs);
    expect(r.conflicts).toEqual([
      { path: 'groundNotes', base: 'Blocky', mine: 'My notes from the face', theirs: 'Their office notes' },
    ]);
    expect(r.merged.groundNotes).toBe('My notes from the face');
    expect(applyChoices(r, {}).groundNotes).toBe('My notes from the face');
    expect(applyChoices(r, { groundNotes: 'theirs' }).groundNotes).toBe('Their office notes');
  });

  it('merges joints row by row and field by field; rows added on either side are all kept', () => {
    const mine = edit({
      joints: [
        { key: 'a', orientationText: '130/50', notes: 'Slickensided' },
        { key: 'b', orientationText: '315/70', notes: '' },
        { key: 'c', orientationText: '040/20', notes: 'New here' },
      ],
    });
    const theirs = edit({
      joints: [
        { key: 'a', orientationText: '132/50', notes: '' },
        { key: 'b', orientationText: '315/70', notes: '' },
        { key: 'd', orientationText: '200/80', notes: 'New there' },
      ],
    });
    const r = threeWayMerge(base, mine, theirs);
    expect(r.conflicts).toEqual([]);
    expect(r.merged.joints).toEqual([
      { key: 'a', orientationText: '132/50', notes: 'Slickensided' },
      { key: 'b', orientationText: '315/70', notes: '' },
      { key: 'c', orientationText: '040/20', notes: 'New here' },
      { key: 'd', orientationText: '200/80', notes: 'New there' },
    ]);
  });

  it('a row removed on one side and changed on the other is a conflict; mine keeps the changed row', () => {
    const mine = edit({
      joints: [
        { key: 'a', orientationText: '130/50', notes: 'Open 5 mm' },
        { key: 'b', orientationText: '315/70', notes: '' },
      ],
    });
    const theirs = edit({ joints: [{ key: 'b', orientationText: '315/70', notes: '' }] });
    const r = threeWayMerge(base, mine, theirs);
    expect(r.conflicts.map((c) => c.path)).toEqual(['joints[a]']);
    expect(r.merged.joints.map((j) => j.key)).toEqual(['a', 'b']);
    expect(applyChoices(r, { 'joints[a]': 'theirs' }).joints.map((j) => j.key)).toEqual(['b']);
  });

  it('a row removed on one side and untouched on the other is removed', () => {
    const mine = edit({ joints: [base.joints[1]] });
    const r = threeWayMerge(base, mine, edit({}));
    expect(r.merged.joints.map((j) => j.key)).toEqual(['b']);
    expect(r.conflicts).toEqual([]);
  });

  it('keeps an atomic field whole (a sketch changed on both sides is one question)', () => {
    const mine = edit({ sketch: { elements: ['crown', 'fault'] } });
    const theirs = edit({ sketch: { elements: ['crown', 'wedge'] } });
    const r = threeWayMerge(base, mine, theirs, { atomic: ['sketch'] });
    expect(r.conflicts.map((c) => c.path)).toEqual(['sketch']);
    expect(r.merged.sketch).toEqual({ elements: ['crown', 'fault'] });
  });

  it('without the starting version, every difference is a question and mine stands by default', () => {
    const mine = edit({ groundNotes: 'Mine' });
    const theirs = edit({ faceChainage: '1+260.0' });
    const r = threeWayMerge(null, mine, theirs);
    expect(r.conflicts.map((c) => c.path).sort()).toEqual(['faceChainage', 'groundNotes']);
    expect(applyChoices(r, {})).toEqual(mine);
  });
});
