import { chainageOf, chainageInputOf } from './round-form';

describe('chainage fields', () => {
  it('open in the heading’s style and never round the stored value (issue 19, item 7)', () => {
    const kmPlus = { style: 'km+m' as const, decimals: 1 };
    expect(chainageInputOf(1254, kmPlus)).toBe('1+254.0');
    expect(chainageInputOf(2483, kmPlus)).toBe('2+483.0');
    // More decimals stored than the heading shows: all of them kept, so a re-save changes nothing.
    expect(chainageInputOf(1254.25, kmPlus)).toBe('1+254.25');
    expect(chainageOf(chainageInputOf(1254.25, kmPlus))).toBe(1254.25);
    expect(chainageInputOf(1254.5, { style: 'metres', decimals: 2 })).toBe('1254.50');
    expect(chainageInputOf(null, kmPlus)).toBe('');
    // Without a style (older callers and tests) the metres as stored.
    expect(chainageInputOf(1254)).toBe('1254');
    for (const m of [0, 7.125, 999.9, 1000, 12345.678])
      expect(chainageOf(chainageInputOf(m, kmPlus))).toBeCloseTo(m, 9);
  });
});
