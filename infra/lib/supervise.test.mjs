// node --test infra/lib/supervise.test.mjs (run by `npm test`'s unit tier): the supervisor's back-off and
// restarts, with an injected clock and timers (nothing sleeps).
import assert from 'node:assert/strict';
import { EventEmitter } from 'node:events';
import { test } from 'node:test';
import { backoffMs, supervise } from './supervise.mjs';

let nextPid = 100;
const child = () => Object.assign(new EventEmitter(), { pid: nextPid++ });

/** Timers that run only when told; a clock that moves only when told. */
function fakeClock() {
  const pending = [];
  let t = 0;
  return {
    timers: { setTimeout: (fn, ms) => pending.push({ fn, ms }) },
    now: () => t,
    advance: (ms) => (t += ms),
    pending,
    /** Runs the one timer due and lets the restart it makes settle. */
    async fire() {
      assert.equal(pending.length, 1, 'exactly one restart is scheduled');
      const { fn, ms } = pending.shift();
      t += ms;
      await fn();
      return ms;
    },
  };
}

test('back-off doubles from 1 s and stops at 30 s', () => {
  assert.deepEqual(
    [0, 1, 2, 3, 4, 5, 6, 10].map((n) => backoffMs(n)),
    [1000, 2000, 4000, 8000, 16000, 30000, 30000, 30000],
  );
});

test('a process that keeps stopping is restarted after 1 s, 2 s, 4 s …; one that stayed up starts afresh', async () => {
  const clock = fakeClock();
  const started = [];
  const start = async () => {
    const c = child();
    started.push(c);
    return c;
  };
  const first = child();
  supervise('worker', first, start, { timers: clock.timers, now: clock.now, stableMs: 60_000 });
  first.emit('exit', 1, null);
  assert.equal(await clock.fire(), 1000);
  started.at(-1).emit('exit', null, 'SIGKILL');
  assert.equal(await clock.fire(), 2000);
  started.at(-1).emit('exit', 1, null);
  assert.equal(await clock.fire(), 4000);
  assert.equal(started.length, 3);
  clock.advance(61_000); // the third restart stayed up longer than stableMs
  started.at(-1).emit('exit', 1, null);
  assert.equal(await clock.fire(), 1000);
  assert.equal(started.length, 4);
});

test('a failed restart is tried again with a longer back-off, even after a long good run', async () => {
  const clock = fakeClock();
  let fails = 2;
  const start = async () => {
    if (fails-- > 0) throw new Error('port in use');
    return child();
  };
  const first = child();
  supervise('worker', first, start, { timers: clock.timers, now: clock.now, stableMs: 60_000 });
  clock.advance(3_600_000); // up for an hour, then it stops
  first.emit('exit', 1, null);
  assert.deepEqual([await clock.fire(), await clock.fire(), await clock.fire()], [1000, 2000, 4000]);
  assert.equal(clock.pending.length, 0);
});

test('no restart while stopping, nor after the watch is ended', async () => {
  const clock = fakeClock();
  let stopping = false;
  const a = child();
  supervise('a', a, async () => child(), {
    timers: clock.timers,
    now: clock.now,
    isStopping: () => stopping,
  });
  stopping = true;
  a.emit('exit', 0, null);
  assert.equal(clock.pending.length, 0);

  const b = child();
  const unwatch = supervise('b', b, async () => child(), { timers: clock.timers, now: clock.now });
  unwatch();
  b.emit('exit', 1, null);
  assert.equal(clock.pending.length, 0);
});
