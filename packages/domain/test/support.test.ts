import {
  classBandsText,
  explainSuggestion,
  qBandText,
  rmrBandText,
  suggestClasses,
  type SupportClassInput,
} from '../src/support.js';

// An invented library, best ground first. Q bands are half-open [qMin, qMax), RMR89 bands whole numbers with
// both ends included (the library's own rule, coverage.ts) [common practice for class tables].
const cls = (
  code: string,
  sortOrder: number,
  q: [number | null, number | null],
  rmr: [number | null, number | null],
): SupportClassInput => ({
  id: `id-${code}`,
  code,
  qMin: q[0],
  qMax: q[1],
  rmrMin: rmr[0],
  rmrMax: rmr[1],
  maxRoundLength: 4 - sortOrder * 0.5,
  retired: false,
  sortOrder,
});
const library = [
  cls('A', 0, [10, null], [65, null]),
  cls('B', 1, [1, 10], [44, 64]),
  cls('C', 2, [0.1, 1], [23, 43]),
  cls('D', 3, [null, 0.1], [null, 22]),
];

describe('support bands, printed as applied', () => {
  it('prints half-open Q bands and inclusive RMR89 bands', () => {
    expect(qBandText(library[1])).toBe('1 ≤ Q < 10');
    expect(qBandText(library[0])).toBe('Q ≥ 10');
    expect(qBandText(library[3])).toBe('Q < 0.1');
    expect(rmrBandText(library[1])).toBe('RMR89 44–64');
    expect(rmrBandText(library[3])).toBe('RMR89 ≤ 22');
    expect(classBandsText(library[1])).toBe('1 ≤ Q < 10 · RMR89 44–64');
    expect(qBandText({ qMin: null, qMax: null })).toBeNull();
  });
});

describe('explainSuggestion (issue 19, item 1)', () => {
  it('at the boundary Q 10.0 and RMR89 50: Q points to A, RMR89 to B, neither fits both, the more cautious B is suggested', () => {
    expect(suggestClasses(library, 10, 50)).toEqual([]);
    const s = explainSuggestion(library, 10, 50);
    expect(s).toMatchObject({ fitting: [], byQ: 'id-A', byRmr: 'id-B', suggested: 'id-B' });
    expect(s.reason).toBe(
      'Q 10 points to A and RMR89 50 points to B, and no class holds both: the more cautious B is suggested.',
    );
  });

  it('names the class that fits both and the bands it was read against', () => {
    const s = explainSuggestion(library, 4.2, 55);
    expect(s).toMatchObject({ fitting: ['id-B'], suggested: 'id-B' });
    expect(s.reason).toBe('B fits Q 4.2 and RMR89 55 (1 ≤ Q < 10 · RMR89 44–64).');
  });

  it('follows the one rating there is', () => {
    expect(explainSuggestion(library, 0.05, null)).toMatchObject({ suggested: 'id-D', byRmr: null });
    expect(explainSuggestion(library, null, 30).reason).toBe('C fits RMR89 30 (0.1 ≤ Q < 1 · RMR89 23–43).');
  });

  it('never answers none without the reason', () => {
    const gap = [cls('A', 0, [10, null], [null, null]), cls('B', 1, [1, 5], [null, null])];
    const s = explainSuggestion(gap, 7, null);
    expect(s.suggested).toBeNull();
    expect(s.reason).toBe(
      "No class fits: no class has a Q band holding Q 7. Check the library's bands in Setup.",
    );
    expect(explainSuggestion([], 7, 50).reason).toBe('The project has no active support classes.');
    expect(explainSuggestion(library, null, null).reason).toMatch(/No rating yet/);
  });

  it('leaves retired classes out', () => {
    const retired = library.map((c) => (c.code === 'B' ? { ...c, retired: true } : c));
    const s = explainSuggestion(retired, 4.2, 55);
    expect(s.suggested).toBeNull();
    expect(s.reason).toMatch(
      /no class has a Q band holding Q 4.2 and no class has an RMR89 band holding RMR89 55/,
    );
  });
});
