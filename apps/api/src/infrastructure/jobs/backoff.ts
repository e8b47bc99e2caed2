/** Retry policy of the jobs worker: pure functions, unit-tested without a database. */
export interface RetryPolicy {
  maxAttempts: number;
  baseMs: number;
  maxMs: number;
}

/**
 * Delay before the next attempt after `attempts` failed ones: base·2^(attempts−1), capped at maxMs, with
 * "equal jitter" (half fixed, half random) so that many jobs failing together do not retry together.
 * Exponential back-off with jitter is common practice (M. Brooker, 2015, "Exponential Backoff And Jitter",
 * AWS Architecture Blog — from memory).
 */
export function retryDelayMs(
  attempts: number,
  policy: RetryPolicy,
  random: () => number = Math.random,
): number {
  const n = Math.max(1, Math.floor(attempts));
  // 2^(n−1) overflows to Infinity for large n; the cap keeps the result finite.
  const exp = Math.min(policy.maxMs, policy.baseMs * 2 ** Math.min(n - 1, 60));
  const half = exp / 2;
  return Math.round(half + half * Math.min(1, Math.max(0, random())));
}

export type FailureOutcome =
  { state: 'pending'; nextAttemptAt: Date; lastError: string } | { state: 'dead'; lastError: string };

/** What becomes of a job whose attempt number `attempts` (1-based, already counted) failed. */
export function afterFailure(
  attempts: number,
  error: unknown,
  now: Date,
  policy: RetryPolicy,
  options: { permanent?: boolean; random?: () => number } = {},
): FailureOutcome {
  const lastError = describeError(error);
  if (options.permanent || attempts >= policy.maxAttempts) return { state: 'dead', lastError };
  return {
    state: 'pending',
    nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts, policy, options.random)),
    lastError,
  };
}

/** The error as kept on the job row: its message (and code), at most 2,000 characters. */
export function describeError(error: unknown): string {
  let text: string;
  if (error instanceof Error) {
    const code = (error as Error & { code?: unknown }).code;
    text =
      typeof code === 'string' && !error.message.includes(code) ? `${code}: ${error.message}` : error.message;
  } else {
    text = String(error);
  }
  return text.length > 2000 ? `${text.slice(0, 1999)}…` : text || 'unknown error';
}
