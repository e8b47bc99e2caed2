import { formatMinutes, formatTimeLeft, needsReason } from '@/features/review/utils/format';

describe('review time words', () => {
  it('says minutes, hours and days the way a shift says them', () => {
    expect(formatMinutes(45)).toBe('45 min');
    expect(formatMinutes(200)).toBe('3 h 20 min');
    expect(formatMinutes(120)).toBe('2 h');
    expect(formatMinutes(60 * 52)).toBe('2 d 4 h');
    expect(formatMinutes(-5)).toBe('0 min');
  });
  it('names time left, or how long a rule is overdue', () => {
    expect(formatTimeLeft(90, false)).toBe('1 h 30 min left');
    expect(formatTimeLeft(-30, true)).toBe('Overdue by 30 min');
  });
});

describe('when the confirmation asks for a reason', () => {
  it('asks for another class or a round over the class maximum, not otherwise', () => {
    expect(needsReason('c1', 3, 'c1', 3)).toBe(false);
    expect(needsReason('c2', 3, 'c1', 3)).toBe(true);
    expect(needsReason('c1', 3.5, 'c1', 3)).toBe(true);
    expect(needsReason('c1', null, 'c1', 3)).toBe(false);
  });
});
