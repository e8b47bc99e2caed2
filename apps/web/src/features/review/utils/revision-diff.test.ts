import { flatten, revisionDiff } from '@/features/review/utils/revision-diff';

describe('revision difference, field by field', () => {
  it('lists only the fields that changed, with their paths in words', () => {
    const before = {
      faceChainage: 1003,
      ground: { inflowLpm: 3, waterDescription: '' },
      joints: [{ id: 'j1', orientationText: '130/50' }],
      recommendedClassId: 'c1',
    };
    const after = {
      faceChainage: 1003,
      ground: { inflowLpm: 12, waterDescription: 'Drips from the crown' },
      joints: [
        { id: 'j1', orientationText: '130/52' },
        { id: 'j2', orientationText: '315/70' },
      ],
      recommendedClassId: 'c1',
    };
    expect(revisionDiff(before, after)).toEqual([
      { field: 'ground › inflowLpm', before: '3', after: '12' },
      { field: 'ground › waterDescription', before: '—', after: 'Drips from the crown' },
      { field: 'joints › 1 › orientationText', before: '130/50', after: '130/52' },
      { field: 'joints › 2 › orientationText', before: '—', after: '315/70' },
    ]);
  });
  it('finds nothing between equal records, and keeps a field the later one dropped', () => {
    expect(revisionDiff({ a: { b: 1 } }, { a: { b: 1 } })).toEqual([]);
    expect(revisionDiff({ a: 1, gone: 'x' }, { a: 1 })).toEqual([{ field: 'gone', before: 'x', after: '—' }]);
  });
  it('flattens arrays by 1-based position', () => {
    expect([...flatten({ units: [{ name: 'gneiss' }] }).entries()]).toEqual([['units › 1 › name', 'gneiss']]);
  });
});
