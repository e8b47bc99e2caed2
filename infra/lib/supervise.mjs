// Keeps a started process running: when it stops unexpectedly, says so and starts it again with back-off.
import { fail, info } from './log.mjs';

/** Delay before restart number `n` (0-based): 1 s, 2 s, 4 s … up to `maxMs`. */
export const backoffMs = (n, baseMs = 1000, maxMs = 30_000) => Math.min(maxMs, baseMs * 2 ** n);

/**
 * Watches `child` (from `start()`); on an exit while `isStopping()` is false it reports the exit, waits
 * with back-off and calls `start()` again. A process that stayed up `stableMs` starts the count afresh.
 * `start` resolves with the new ChildProcess. Returns a function that stops watching. `timers` and `now`
 * stand in for the clock in tests (infra/lib/supervise.test.mjs).
 */
export function supervise(
  name,
  child,
  start,
  { isStopping, logHint = '', stableMs = 60_000, timers = globalThis, now = Date.now } = {},
) {
  let restarts = 0;
  let startedAt = now();
  let stopped = false;
  const watch = (c) =>
    c.once('exit', (code, signal) => {
      if (stopped || isStopping?.()) return;
      if (now() - startedAt > stableMs) restarts = 0;
      const wait = backoffMs(restarts++);
      fail(
        `${name} stopped unexpectedly (${signal ?? `exit code ${code}`}); restarting in ${wait / 1000} s. ${logHint}`,
      );
      timers.setTimeout(async () => {
        if (stopped || isStopping?.()) return;
        try {
          const next = await start();
          startedAt = now();
          info(`${name} is running again (PID ${next.pid})`);
          watch(next);
        } catch (err) {
          fail(`${name} could not be restarted: ${err?.message ?? err}`);
          // Try again after the next back-off: the failed start counts as a start that did not stay up
          // (otherwise a process that once ran for long would be retried every second, without back-off).
          startedAt = now();
          watch({ once: (_e, fn) => fn(1, null) });
        }
      }, wait);
    });
  watch(child);
  return () => {
    stopped = true;
  };
}
