import type { TriggerFiring } from '@roundbook/domain';
import { byQueueOrder, classOfRound, confirmationErrors, reasonNeeded, ruleClocks } from './review-rules.js';

const c2 = { code: 'C2', maxRoundLength: 3, retired: false };

describe('confirmation needs (issue 11: another class or a longer round needs a reason)', () => {
  it('asks nothing when the recommended class is confirmed within its length', () => {
    expect(confirmationErrors({ classId: 'c2', roundLength: 3, reason: '' }, 'c2', c2)).toEqual({});
  });
  it('asks a reason for another class than the recommended one', () => {
    const fields = confirmationErrors({ classId: 'c2', roundLength: 2, reason: ' ' }, 'c1', c2);
    expect(fields.reason).toMatch(/C2 is not the recommended class/);
  });
  it('asks a reason for a round longer than the class allows, and accepts one', () => {
    expect(confirmationErrors({ classId: 'c2', roundLength: 3.5, reason: '' }, 'c2', c2).reason).toMatch(
      /up to 3 m/,
    );
    expect(
      confirmationErrors({ classId: 'c2', roundLength: 3.5, reason: 'Trial round agreed on site' }, 'c2', c2),
    ).toEqual({});
  });
  it('refuses a retired class whatever the reason', () => {
    const fields = confirmationErrors({ classId: 'c2', roundLength: 2, reason: 'Long enough reason' }, 'c2', {
      ...c2,
      retired: true,
    });
    expect(fields.classId).toMatch(/retired/);
  });
  it('tells the screen when to show the reason', () => {
    expect(reasonNeeded('c2', 3, 'c2', 3)).toBe(false);
    expect(reasonNeeded('c2', 3.1, 'c2', 3)).toBe(true);
    expect(reasonNeeded('c3', 1, 'c2', 3)).toBe(true);
  });
});

describe('rule clocks against their timeframes', () => {
  const firing = (hours: number, level: TriggerFiring['level'] = 'amber'): TriggerFiring => ({
    ruleId: `r${hours}`,
    level,
    summary: 'Q below 1',
    detail: '',
    action: 'Tell the engineer.',
    ownerRole: 'engineer',
    timeAllowedHours: hours,
  });
  const submitted = new Date('2026-03-01T08:00:00Z');
  it('counts from the submit and marks overdue once the time is up', () => {
    const now = new Date('2026-03-01T10:30:00Z');
    const [four, two] = ruleClocks([firing(4), firing(2)], submitted, now);
    expect(four).toMatchObject({ dueAt: '2026-03-01T12:00:00.000Z', minutesLeft: 90, overdue: false });
    expect(two).toMatchObject({ dueAt: '2026-03-01T10:00:00.000Z', minutesLeft: -30, overdue: true });
  });
  it('is never overdue once its owner acknowledged it', () => {
    const acked = new Map([['r2', new Date('2026-03-01T09:30:00Z')]]);
    const [two] = ruleClocks([firing(2)], submitted, new Date('2026-03-01T11:00:00Z'), acked);
    expect(two).toMatchObject({
      overdue: false,
      minutesLeft: -60,
      acknowledgedAt: '2026-03-01T09:30:00.000Z',
    });
  });
  it('is overdue exactly at the due time', () => {
    expect(ruleClocks([firing(1)], submitted, new Date('2026-03-01T09:00:00Z'))[0].overdue).toBe(true);
  });
});

describe('queue order', () => {
  it('puts red first, then amber, green and unassessed; within a level the oldest first', () => {
    const rows = [
      { id: 'a', triggerLevel: 'green' as const, submittedAt: '2026-03-01T06:00:00Z' },
      { id: 'b', triggerLevel: 'red' as const, submittedAt: '2026-03-01T09:00:00Z' },
      { id: 'c', triggerLevel: null, submittedAt: '2026-03-01T01:00:00Z' },
      { id: 'd', triggerLevel: 'red' as const, submittedAt: '2026-03-01T07:00:00Z' },
      { id: 'e', triggerLevel: 'amber' as const, submittedAt: '2026-03-01T08:00:00Z' },
    ];
    expect(rows.sort(byQueueOrder).map((r) => r.id)).toEqual(['d', 'b', 'e', 'a', 'c']);
  });
});

describe('the class a next round compares with', () => {
  it('is the confirmed class once confirmed, otherwise the recommended one', () => {
    expect(classOfRound({ confirmedClassId: 'c3', recommendedClassId: 'c2' })).toBe('c3');
    expect(classOfRound({ confirmedClassId: null, recommendedClassId: 'c2' })).toBe('c2');
    expect(classOfRound({ confirmedClassId: null, recommendedClassId: null })).toBeNull();
  });
});
