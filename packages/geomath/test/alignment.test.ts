import {
  driveOf,
  formatChainage,
  gradientDegreesToPercent,
  gradientPercentToDegrees,
  OrientationError,
  parseChainage,
} from '../src/index.js';
import { expectClose } from './asserts.js';

describe('gradient and drive', () => {
  it('converts per cent to degrees and back (tan; common practice)', () => {
    expectClose(gradientPercentToDegrees(100), 45, 1e-12);
    expectClose(gradientPercentToDegrees(0.4), 0.2291819, 1e-7); // atan(0.004) [computed here]
    expectClose(gradientDegreesToPercent(gradientPercentToDegrees(-7.3)), -7.3, 1e-12);
    expect(() => gradientDegreesToPercent(90)).toThrow(OrientationError);
  });

  it('gives a rising heading a climbing (negative) plunge, as the contract defines Drive', () => {
    expectClose(
      driveOf({ driveTrend: 312.5, gradientPercent: 0.4 }),
      { trend: 312.5, plunge: -0.2291819 },
      1e-7,
    );
    expect(driveOf({ driveTrend: 10, gradientPercent: 0 }).plunge).toBe(0);
  });
});

describe('chainage', () => {
  it.each([
    [1250.04, 'km+m', 1, '1+250.0'],
    [1250.06, 'km+m', 1, '1+250.1'],
    [2450, 'km+m', 3, '2+450.000'],
    [49.5, 'km+m', 1, '0+049.5'],
    [999.96, 'km+m', 1, '1+000.0'],
    [-12.5, 'km+m', 1, '-0+012.5'],
    [1250.04, 'metres', 2, '1250.04'],
    [7, 'km+m', 0, '0+007'],
  ] as const)('formats %p as %p with %p decimals → %p', (m, style, decimals, text) => {
    expect(formatChainage(m, { style, decimals })).toBe(text);
  });

  it('reads what it writes, and plain metres', () => {
    for (const m of [0, 12.3, 1250.5, 2450.125, -12.5])
      expect(parseChainage(formatChainage(m, { decimals: 3 }))).toBeCloseTo(m, 9);
    expect(parseChainage(' 1 250,5 ')).toBe(1250.5);
    expect(parseChainage('1+050')).toBe(1050);
  });

  it('explains what it expected', () => {
    expect(() => parseChainage('1+50')).toThrow(/three digits/);
    expect(() => parseChainage('km 12')).toThrow(/km\+metres/);
  });
});
