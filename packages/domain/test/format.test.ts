import {
  addCalendarDays,
  assessTriggers,
  formatCalendarDate,
  formatAzimuth,
  formatChainageFor,
  formatProjectTimeNear,
  formatQ,
  roundedAsPrinted,
  shiftOf,
  triggerLevelText,
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

  it('says "not evaluated (n rules)" for a round whose rules lack their data, never "no rules" (issue 10 item 8) [common practice]', () => {
    // A Q rule and an inflow rule on a round with neither recorded: no level, two rules not evaluated.
    const rule = (id: string, watch: 'q' | 'inflow-per-10m') => ({
      id,
      watch,
      comparison: '<' as const,
      threshold: 1,
      level: 'amber' as const,
      action: '',
      ownerRole: 'engineer',
      timeAllowedHours: 4,
      enabled: true,
    });
    const facts = {
      q: null,
      rmr: null,
      inflowPer10m: null,
      overbreakM3: null,
      faceChainage: 1000,
      recommendedClassId: null,
      previousClassId: undefined,
      joints: [],
    };
    const heading = { driveTrend: 60, gradientPercent: 0, profileHeight: 6, profileWidth: 6, axisHeight: 3 };
    const t = assessTriggers([rule('a', 'q'), rule('b', 'inflow-per-10m')], facts, heading);
    expect(t.level).toBeNull();
    expect(triggerLevelText(t.level, t.notEvaluated.length)).toBe('not evaluated (2 rules)');
    expect(triggerLevelText(null, 1)).toBe('not evaluated (1 rule)');
    expect(triggerLevelText(null, 0)).toBe('no rules');
    expect(triggerLevelText('amber', 3)).toBe('Amber');
  });

  it('writes a calendar date one way whatever the language, and steps it by days across months and years', () => {
    expect(formatCalendarDate('2026-12-02')).toBe('2 Dec 2026');
    // 2 December 2026 is a Wednesday (ISO 8601 calendar; from memory, checked against Date.UTC's getUTCDay below).
    expect(new Date(Date.UTC(2026, 11, 2)).getUTCDay()).toBe(3);
    expect(formatCalendarDate('2026-12-02', { weekday: true })).toBe('Wed 2 Dec 2026');
    expect(formatCalendarDate('not a date')).toBe('not a date');
    expect(addCalendarDays('2026-12-01', -1)).toBe('2026-11-30');
    expect(addCalendarDays('2026-12-31', 1)).toBe('2027-01-01');
    expect(addCalendarDays('2028-02-28', 1)).toBe('2028-02-29'); // 2028 is a leap year (Gregorian rule)
    expect(addCalendarDays('', 1)).toBe('');
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
