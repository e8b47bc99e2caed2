import { formatAzimuth, formatChainage, formatGradient, formatProjectTime, handoverState } from './format';

describe('formatChainage', () => {
  it.each([
    [1250, '1+250.0'],
    [0, '0+000.0'],
    [12.34, '0+012.3'],
    [999.96, '1+000.0'],
    [23456.7, '23+456.7'],
    [-12.5, '-0+012.5'],
  ])('writes %p m as %s', (metres, text) => {
    expect(formatChainage(metres)).toBe(text);
  });
});

describe('formatAzimuth and formatGradient', () => {
  it('pads azimuths to three digits and wraps at 360°', () => {
    expect(formatAzimuth(47.4)).toBe('047°');
    expect(formatAzimuth(359.6)).toBe('000°');
  });

  it('says whether the drive rises or falls', () => {
    expect(formatGradient(0.5)).toBe('rising +0.50 %');
    expect(formatGradient(-2)).toBe('falling −2.0 %');
    expect(formatGradient(0)).toBe('level (0 %)');
  });
});

describe('formatProjectTime', () => {
  it('uses the project time zone', () => {
    expect(formatProjectTime('2026-11-30T23:30:00Z', 'UTC')).toBe('30 Nov 2026, 23:30');
    expect(formatProjectTime('2026-11-30T23:30:00Z', 'Europe/Vienna')).toBe('1 Dec 2026, 00:30');
  });
});

describe('handoverState', () => {
  it('tells apart none, waiting and acknowledged', () => {
    expect(handoverState(null)).toBe('none');
    const due = { ackDueAt: '2026-12-01T07:00:00Z', overdue: false };
    expect(handoverState({ sentAt: '2026-12-01T06:00:00Z', acknowledgedAt: null, ...due })).toBe('waiting');
    expect(
      handoverState({ sentAt: '2026-12-01T06:00:00Z', acknowledgedAt: null, ...due, overdue: true }),
    ).toBe('overdue');
    expect(
      handoverState({ sentAt: '2026-12-01T06:00:00Z', acknowledgedAt: '2026-12-01T06:20:00Z', ...due }),
    ).toBe('acknowledged');
  });
});
