import {
  gsiFromRmr89,
  jvFromSpacings,
  rmrFromQBarton1995,
  rmrFromQBieniawski1976,
  rqdEstimateFromJv,
  rqdFromJv,
} from '../src/rock-mass.js';
import { RatingError } from '../src/types.js';
import { expectClose } from './asserts.js';

describe('RQD from Jv (a correlation)', () => {
  it('spacings 0.2, 0.4 and 1.0 m give Jv 8.5 and RQD 86.95 (1982) / 88.75 (2005)', () => {
    // Palmström 1982 (seen in secondary sources) and Palmström 2005, TUST 20:362–377 [from memory];
    // check values methods.md §4.3 [computed here].
    const jv = jvFromSpacings([0.2, 0.4, 1.0]);
    expectClose(jv, 8.5, 1e-12);
    expectClose(rqdFromJv(jv, 1982), 86.95, 1e-9);
    expectClose(rqdFromJv(jv, 2005), 88.75, 1e-9);
  });

  it('Jv 3 gives 100 in both editions, clipped and flagged', () => {
    // methods.md §4.3 [computed here].
    expect(rqdFromJv(3, 1982)).toBe(100);
    expect(rqdFromJv(3, 2005)).toBe(100);
    const e = rqdEstimateFromJv(3, 1982);
    expect(e.clipped).toBe(true);
    expectClose(e.unclipped, 105.1, 1e-9);
    expect(e.isCorrelation).toBe(true);
    expect(e.caution).toMatch(/correlation/);
    expect(e.source).toMatch(/Palmström 1982/);
  });

  it('clips at 0 for very high Jv (1982 reaches 0 near 34.85, 2005 at 44)', () => {
    expect(rqdFromJv(35, 1982)).toBe(0);
    expect(rqdFromJv(44, 2005)).toBe(0);
    expectClose(rqdFromJv(43, 2005), 2.5, 1e-9);
    expect(rqdEstimateFromJv(50, 2005).clipped).toBe(true);
    expect(rqdEstimateFromJv(10, 2005).clipped).toBe(false);
  });

  it('counts random joints as Nr/5 and rejects bad input', () => {
    expectClose(jvFromSpacings([0.5], 5), 3, 1e-12);
    expect(jvFromSpacings([])).toBe(0);
    expect(() => jvFromSpacings([0.5, 0])).toThrow(/spacing of set 2 must be greater than 0 m/);
    expect(() => rqdFromJv(-1, 1982)).toThrow(RatingError);
  });
});

describe('GSI from RMR89′', () => {
  it('is RMR89′ − 5 from 23 upward (Singh & Goel 2011, eq. 26.1 [source, seen])', () => {
    expect(gsiFromRmr89(23)).toBe(18);
    expect(gsiFromRmr89(64)).toBe(59);
    expect(gsiFromRmr89(100)).toBe(95);
  });

  it('refuses RMR89′ below 23, where GSI must be read from its chart', () => {
    expect(() => gsiFromRmr89(22.9)).toThrow(/expected 23 to 100/);
    expect(() => gsiFromRmr89(101)).toThrow(RatingError);
  });
});

describe('RMR–Q correlations', () => {
  // RMR = 9 ln Q + 44: Bieniawski 1976, seen as a common correlation in Palmström 2008, Comparing the RMR,
  // Q and RMi classification systems, Fig. 1. RMR ≈ 15 log Q + 50: Barton 1995 [from memory].
  // Check values methods.md §4.3 [computed here].
  const table: [number, number, number][] = [
    [0.1, 23.28, 35.0],
    [1, 44.0, 50.0],
    [4.5, 57.54, 59.8],
    [10, 64.72, 65.0],
    [100, 85.45, 80.0],
  ];
  it.each(table)('Q = %p gives %p (Bieniawski 1976) and %p (Barton 1995)', (q, bieniawski, barton) => {
    expectClose(rmrFromQBieniawski1976(q), bieniawski, 0.005);
    expectClose(rmrFromQBarton1995(q), barton, 0.005);
  });

  it('rejects Q of 0 or less', () => {
    expect(() => rmrFromQBieniawski1976(0)).toThrow(RatingError);
    expect(() => rmrFromQBarton1995(-1)).toThrow(RatingError);
  });
});
