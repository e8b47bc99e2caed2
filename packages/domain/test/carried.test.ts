import { carriedRatingInputs, rqdFromSets, setsWithoutSpacing } from '../src/carried.js';
import type { RoundSet } from '../src/sets.js';

const set = (label: string, meanSpacingM: number | null): RoundSet => ({
  label,
  mean: { dipDirection: 120, dip: 60 },
  count: 3,
  countHere: 3,
  k: null,
  alpha95: null,
  memberIds: [],
  nearbyMemberIds: [],
  meanSpacingM,
  orientation: null,
  byOverride: false,
});

describe('carriedRatingInputs', () => {
  it('carries Is50 and inflow from Ground with the source named', () => {
    const c = carriedRatingInputs({ pointLoadIs50: 2.4, inflowPer10m: 12.345, sets: [] });
    expect(c.is50).toEqual({ value: 2.4, source: 'Ground: point-load index Is50', caution: null });
    expect(c.inflowPer10m?.value).toBe(12.3);
    expect(c.inflowPer10m?.source).toMatch(/^Ground: water inflow per 10 m/);
    expect(c.spacingM).toBeUndefined();
    expect(c.rmrRqd).toBeUndefined();
  });

  it('takes the closest-spaced set for RMR89 spacing and names the sets without spacing', () => {
    const c = carriedRatingInputs({
      pointLoadIs50: null,
      inflowPer10m: null,
      sets: [set('A', 0.8), set('B', 0.25), set('C', null)],
    });
    expect(c.is50).toBeUndefined();
    expect(c.spacingM?.value).toBe(0.25);
    expect(c.spacingM?.source).toContain('set B');
    expect(c.spacingM?.caution).toContain('Set C had no spacing');
  });

  it('computes RQD from Jv of the spaced sets (Palmström 1982: 115 − 3.3·Jv)', () => {
    // Jv = 1/0.5 + 1/0.25 = 6 → RQD = 115 − 19.8 = 95.2 → 95
    const r = rqdFromSets([set('A', 0.5), set('B', 0.25)]);
    expect(r?.jv).toBeCloseTo(6, 9);
    expect(r?.value).toBe(95);
    expect(r?.caution).toBeNull();
    // Palmström 2005: 110 − 2.5·6 = 95
    expect(rqdFromSets([set('A', 0.5), set('B', 0.25)], 2005)?.value).toBe(95);
    expect(rqdFromSets([set('A', 0.1), set('B', 0.1)], 2005)?.value).toBe(60);
  });

  it('says RQD is optimistic when one set alone has a spacing, naming the others', () => {
    const c = carriedRatingInputs({
      pointLoadIs50: null,
      inflowPer10m: null,
      sets: [set('A', 0.4), set('B', null), set('C', null)],
    });
    // Jv = 2.5 → 115 − 8.25 = 106.75 → clipped to 100
    expect(c.rmrRqd?.value).toBe(100);
    expect(c.qRqd?.value).toBe(100);
    expect(c.rmrRqd?.caution).toContain('Sets B, C had no spacing');
    expect(c.rmrRqd?.caution).toContain('optimistic');
    expect(c.rmrRqd?.caution).toContain("one set's spacing alone");
  });

  it('has nothing to carry from sets without spacing or nonsense values', () => {
    expect(rqdFromSets([set('A', null)])).toBeNull();
    expect(setsWithoutSpacing([set('A', null), set('B', 1)])).toEqual(['A']);
    const c = carriedRatingInputs({ pointLoadIs50: Number.NaN, inflowPer10m: -1, sets: [set('A', null)] });
    expect(c).toEqual({});
  });
});
