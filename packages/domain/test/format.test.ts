import {
  formatAzimuth,
  formatChainageFor,
  formatProjectTimeNear,
  formatQ,
  roundedAsPrinted,
  shiftOf,
} from '../src/index.js';

describe('formatters', () => {
  it('writes azimuths with three digits [common practice]', () => {
    expect(formatAzimuth(47.4)).toBe('047°');
    expect(formatAzimuth(359.6)).toBe('000°');
    expect(formatAzimuth(132.5, 1)).toBe('132.5°');
    expect(formatAzimuth(133, 1)).toBe('133°');
  });

  it('writes chainage in the heading’s own style', () => {
    expect(formatChainageFor(2483, { chainageStyle: 'km+m', chainageDecimals: 1 })).toBe('2+483.0');
    expect(formatChainageFor(2483, { chainageStyle: 'metres', chainageDecimals: 0 })).toBe('2483');
  });

  it('writes Q with the figures it is read to, and compares at those figures [common practice]', () => {
    expect(formatQ(0.0412)).toBe('0.041');
    expect(formatQ(4.17)).toBe('4.2');
    expect(formatQ(33.3)).toBe('33');
    expect(roundedAsPrinted(0.1004, 'q')).toBe(0.1);
  });

  it('puts 02:00 in the night shift of the day before, in the project time zone', () => {
    expect(shiftOf(new Date('2026-12-02T01:00:00Z'), 'Europe/Zurich')).toEqual({
      shiftDate: '2026-12-01',
      shift: 'night',
    });
  });

  it('gives the clock time alone on the same day in the project zone, else the date too', () => {
    const now = new Date('2026-12-03T15:00:00Z');
    // 14:30 UTC is 14:30 in London in December (GMT) and 15:30 in Zurich (CET).
    expect(formatProjectTimeNear('2026-12-03T14:30:00Z', 'Europe/London', now)).toBe('14:30');
    expect(formatProjectTimeNear('2026-12-03T14:30:00Z', 'Europe/Zurich', now)).toBe('15:30');
    expect(formatProjectTimeNear('2026-12-02T23:30:00Z', 'Europe/London', now)).toBe('2 Dec 2026, 23:30');
    // 23:30 UTC on the 2nd is 00:30 on the 3rd in Zurich: the same day as now there.
    expect(formatProjectTimeNear('2026-12-02T23:30:00Z', 'Europe/Zurich', now)).toBe('00:30');
  });
});
