import {
  formatHazardRange,
  compareHazards,
  HAZARD_AHEAD_LIMIT_M,
  hazardPlaceFromFace,
  hazardRangeErrors,
  orderedRange,
} from '../src/index.js';

const up = { code: 'HR-1', startChainage: 1000, chainageSense: 'increasing' as const };
const down = { code: 'HR-2', startChainage: 2000, chainageSense: 'decreasing' as const };

describe('hazard ranges against the heading', () => {
  it('puts a range in the drive order, whichever way the heading’s chainage runs', () => {
    expect(orderedRange(1050, 1040, 'increasing')).toEqual({ fromChainage: 1040, toChainage: 1050 });
    expect(orderedRange(1940, 1950, 'decreasing')).toEqual({ fromChainage: 1950, toChainage: 1940 });
  });

  it('accepts a range in the driven heading or up to the limit ahead of the furthest face', () => {
    expect(hazardRangeErrors({ fromChainage: 1000, toChainage: 1060 }, up, 1060)).toEqual({});
    expect(
      hazardRangeErrors({ fromChainage: 1060, toChainage: 1060 + HAZARD_AHEAD_LIMIT_M }, up, 1060),
    ).toEqual({});
    expect(hazardRangeErrors({ fromChainage: 1950, toChainage: 1900 }, down, 1900)).toEqual({});
  });

  it('refuses an end behind the start or too far ahead of the face, naming the heading', () => {
    const behind = hazardRangeErrors({ fromChainage: 990, toChainage: 1010 }, up, 1060);
    expect(behind.fromChainage).toMatch(/behind the start of heading HR-1/);
    expect(behind.toChainage).toBeUndefined();
    const typo = hazardRangeErrors({ fromChainage: 1050, toChainage: 10500 }, up, 1060);
    expect(typo.toChainage).toMatch(/more than 100 m ahead of the face of heading HR-1/);
    // Driven against the chainage: 2010 is behind the start, 1700 is 200 m ahead of a face at 1900.
    const d = hazardRangeErrors({ fromChainage: 2010, toChainage: 1700 }, down, 1900);
    expect(Object.keys(d).sort()).toEqual(['fromChainage', 'toChainage']);
    // No round yet: the face is the start.
    expect(hazardRangeErrors({ fromChainage: 1000, toChainage: 1150 }, up, null).toChainage).toBeDefined();
  });

  it('writes chainages in the heading’s style when it is given', () => {
    const e = hazardRangeErrors(
      { fromChainage: 900, toChainage: 1000 },
      { ...up, chainageStyle: 'km+m', chainageDecimals: 1 },
      1000,
    );
    expect(e.fromChainage).toContain('Chainage 0+900.0 is behind the start of heading HR-1 (1+000.0)');
  });

  it('refuses a chainage that is not a number', () => {
    expect(hazardRangeErrors({ fromChainage: Number.NaN, toChainage: 1000 }, up, 1000).fromChainage).toBe(
      'Give the chainage in metres.',
    );
  });
});

describe('hazards from the face and in order', () => {
  it('tells whether a range reaches the face, lies behind it or ahead of it', () => {
    expect(hazardPlaceFromFace({ fromChainage: 1040, toChainage: 1060 }, 1050)).toEqual({
      where: 'at-face',
      distance: 0,
    });
    expect(hazardPlaceFromFace({ fromChainage: 1030, toChainage: 1042 }, 1050)).toEqual({
      where: 'behind',
      distance: 8,
    });
    expect(hazardPlaceFromFace({ fromChainage: 1060, toChainage: 1070 }, 1050)).toEqual({
      where: 'ahead',
      distance: 10,
    });
    // Decreasing chainage: 1890 is 10 m ahead of a face at 1900.
    expect(hazardPlaceFromFace({ fromChainage: 1890, toChainage: 1880 }, 1900, 'decreasing')).toEqual({
      where: 'ahead',
      distance: 10,
    });
  });

  it('lists red first, then amber, then green, and along each level by chainage in the drive order', () => {
    const list = [
      { id: 'g', level: 'green' as const, fromChainage: 1001, toChainage: 1002 },
      { id: 'r2', level: 'red' as const, fromChainage: 1040, toChainage: 1045 },
      { id: 'a', level: 'amber' as const, fromChainage: 1000, toChainage: 1010 },
      { id: 'r1', level: 'red' as const, fromChainage: 1020, toChainage: 1030 },
    ];
    expect([...list].sort((a, b) => compareHazards(a, b)).map((h) => h.id)).toEqual(['r1', 'r2', 'a', 'g']);
    expect([...list].sort((a, b) => compareHazards(a, b, 'decreasing')).map((h) => h.id)).toEqual([
      'r2',
      'r1',
      'a',
      'g',
    ]);
  });
});

describe('formatHazardRange', () => {
  it('gives a range in the heading’s style, or one chainage for a place', () => {
    const km = { chainageStyle: 'km+m' as const, chainageDecimals: 1 };
    expect(formatHazardRange({ fromChainage: 1004, toChainage: 1006 }, km)).toBe('1+004.0 – 1+006.0');
    expect(formatHazardRange({ fromChainage: 1004, toChainage: 1004 }, km)).toBe('1+004.0');
    expect(
      formatHazardRange(
        { fromChainage: 12.5, toChainage: 20 },
        { chainageStyle: 'metres', chainageDecimals: 1 },
      ),
    ).toMatch(/^12\.5.* – 20\.0/);
  });
});
