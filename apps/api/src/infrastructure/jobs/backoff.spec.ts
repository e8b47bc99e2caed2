import { afterFailure, describeError, retryDelayMs, type RetryPolicy } from './backoff';

const policy: RetryPolicy = { maxAttempts: 5, baseMs: 1000, maxMs: 10_000 };

describe('retryDelayMs (exponential back-off with equal jitter; common practice)', () => {
  it('doubles from the base delay with each failed attempt, the random half at its top', () => {
    // random() = 1 gives the full exponential step: base·2^(n−1).
    expect([1, 2, 3, 4].map((n) => retryDelayMs(n, policy, () => 1))).toEqual([1000, 2000, 4000, 8000]);
  });

  it('keeps at least half of the step when the random part is zero', () => {
    expect([1, 2, 3].map((n) => retryDelayMs(n, policy, () => 0))).toEqual([500, 1000, 2000]);
  });

  it('never exceeds the cap, even after very many attempts', () => {
    expect(retryDelayMs(5, policy, () => 1)).toBe(10_000);
    expect(retryDelayMs(10_000, policy, () => 1)).toBe(10_000);
    expect(Number.isFinite(retryDelayMs(10_000, policy, () => 0.5))).toBe(true);
  });

  it('treats attempt 0 or fractions as the first attempt and clamps odd random values', () => {
    expect(retryDelayMs(0, policy, () => 1)).toBe(1000);
    expect(retryDelayMs(1.7, policy, () => 1)).toBe(1000);
    expect(retryDelayMs(1, policy, () => 7)).toBe(1000);
    expect(retryDelayMs(1, policy, () => -3)).toBe(500);
  });
});

describe('afterFailure', () => {
  const now = new Date('2026-12-02T06:00:00.000Z');

  it('schedules the next attempt after the back-off and keeps the error', () => {
    const outcome = afterFailure(2, new Error('connect ECONNREFUSED 127.0.0.1:2525'), now, policy, {
      random: () => 1,
    });
    expect(outcome).toEqual({
      state: 'pending',
      nextAttemptAt: new Date('2026-12-02T06:00:02.000Z'),
      lastError: 'connect ECONNREFUSED 127.0.0.1:2525',
    });
  });

  it('gives up after the last allowed attempt, keeping the error', () => {
    expect(afterFailure(5, new Error('mailbox unavailable'), now, policy)).toEqual({
      state: 'dead',
      lastError: 'mailbox unavailable',
    });
    expect(afterFailure(4, new Error('x'), now, policy).state).toBe('pending');
  });

  it('gives up at once on a permanent error', () => {
    expect(afterFailure(1, new Error('gone'), now, policy, { permanent: true })).toEqual({
      state: 'dead',
      lastError: 'gone',
    });
  });
});

describe('describeError', () => {
  it('adds an error code the message lacks, and keeps non-errors readable', () => {
    const e = Object.assign(new Error('Greeting never received'), { code: 'ETIMEDOUT' });
    expect(describeError(e)).toBe('ETIMEDOUT: Greeting never received');
    const f = Object.assign(new Error('connect ECONNREFUSED'), { code: 'ECONNREFUSED' });
    expect(describeError(f)).toBe('connect ECONNREFUSED');
    expect(describeError('plain')).toBe('plain');
    expect(describeError(new Error(''))).toBe('unknown error');
  });

  it('cuts very long errors to 2,000 characters', () => {
    const text = describeError(new Error('x'.repeat(5000)));
    expect(text).toHaveLength(2000);
    expect(text.endsWith('…')).toBe(true);
  });
});
