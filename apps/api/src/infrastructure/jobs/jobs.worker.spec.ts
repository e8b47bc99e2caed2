import { Logger } from '@nestjs/common';
import type { FailureOutcome } from './backoff';
import { JobHandlers, PermanentJobError } from './job-handlers';
import type { Job } from './job.entity';
import type { JobsService } from './jobs.service';
import { JobsWorker, type WorkerOptions } from './jobs.worker';

/**
 * An in-memory stand-in for the jobs table with the same contract as JobsService: a claim takes due
 * pending rows not held by anyone, marks them running for the claimer and counts the attempt.
 */
class FakeJobs {
  rows = new Map<string, Job>();
  claims: Array<{ workerId: string; limit: number }> = [];

  add(id: string, kind = 'test', payload: Record<string, unknown> = {}): Job {
    const job = {
      id,
      kind,
      payload,
      state: 'pending',
      attempts: 0,
      nextAttemptAt: new Date(0),
      lastError: null,
      dedupeKey: null,
      lockedBy: null,
      lockedAt: null,
      finishedAt: null,
      createdAt: new Date(0),
      updatedAt: new Date(0),
    } as Job;
    this.rows.set(id, job);
    return job;
  }

  claim = jest.fn((workerId: string, limit: number, now: Date): Promise<Job[]> => {
    this.claims.push({ workerId, limit });
    const due = [...this.rows.values()]
      .filter((j) => j.state === 'pending' && j.nextAttemptAt <= now)
      .slice(0, limit);
    for (const j of due) Object.assign(j, { state: 'running', attempts: j.attempts + 1, lockedBy: workerId });
    return Promise.resolve(due.map((j) => ({ ...j })));
  });

  complete = jest.fn((id: string, workerId: string): Promise<void> => {
    const j = this.rows.get(id)!;
    if (j.state === 'running' && j.lockedBy === workerId) Object.assign(j, { state: 'done', lockedBy: null });
    return Promise.resolve();
  });

  fail = jest.fn((id: string, workerId: string, outcome: FailureOutcome): Promise<void> => {
    const j = this.rows.get(id)!;
    if (j.state === 'running' && j.lockedBy === workerId) Object.assign(j, { ...outcome, lockedBy: null });
    return Promise.resolve();
  });

  release = jest.fn((id: string, workerId: string): Promise<void> => {
    const j = this.rows.get(id)!;
    if (j.state === 'running' && j.lockedBy === workerId)
      Object.assign(j, { state: 'pending', attempts: j.attempts - 1, lockedBy: null });
    return Promise.resolve();
  });

  reclaimExpired = jest.fn(() => Promise.resolve(0));
}

const options = (over: Partial<WorkerOptions> = {}): WorkerOptions => ({
  enabled: true,
  pollIntervalMs: 5,
  concurrency: 2,
  leaseMs: 60_000,
  retry: { maxAttempts: 3, baseMs: 1000, maxMs: 60_000 },
  shutdownGraceMs: 50,
  random: () => 1,
  ...over,
});

/** Waits for a condition, bounded (no fixed sleeps). */
async function until(check: () => boolean, ms = 2000): Promise<void> {
  const end = Date.now() + ms;
  while (!check()) {
    if (Date.now() > end) throw new Error('condition not reached in time');
    await new Promise((r) => setTimeout(r, 2));
  }
}

describe('JobsWorker', () => {
  beforeAll(() => Logger.overrideLogger(false));
  afterAll(() => Logger.overrideLogger(['error', 'warn', 'log']));

  let store: FakeJobs;
  let handlers: JobHandlers;
  let now: Date;
  const make = (over: Partial<WorkerOptions> = {}): JobsWorker =>
    new JobsWorker(store as unknown as JobsService, handlers, options({ now: () => now, ...over }));

  beforeEach(() => {
    store = new FakeJobs();
    handlers = new JobHandlers();
    now = new Date('2026-12-02T06:00:00.000Z');
  });

  it('runs a claimed job with the handler of its kind and marks it done', async () => {
    const seen: unknown[] = [];
    handlers.register('test', (payload, ctx) => {
      seen.push([payload, ctx.attempt]);
      return Promise.resolve();
    });
    store.add('a', 'test', { n: 1 });
    const sut = make();
    expect(await sut.tick()).toBe(1);
    await sut.idle();
    expect(seen).toEqual([[{ n: 1 }, 1]]);
    expect(store.rows.get('a')!.state).toBe('done');
  });

  it('claims no more than its free slots', async () => {
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    handlers.register('test', () => gate);
    for (const id of ['a', 'b', 'c']) store.add(id);
    const sut = make({ concurrency: 2 });
    expect(await sut.tick()).toBe(2);
    expect(await sut.tick()).toBe(0); // both slots busy: it does not even ask
    expect(store.claims).toEqual([{ workerId: sut.id, limit: 2 }]);
    release();
    await sut.idle();
    expect(await sut.tick()).toBe(1);
    await sut.idle();
    expect([...store.rows.values()].map((j) => j.state)).toEqual(['done', 'done', 'done']);
  });

  it('schedules a failed job after the back-off, then gives up after the last attempt with the error kept', async () => {
    handlers.register('test', () => Promise.reject(new Error('SMTP away')));
    store.add('a');
    const sut = make();
    await sut.tick();
    await sut.idle();
    expect(store.rows.get('a')).toMatchObject({
      state: 'pending',
      attempts: 1,
      lastError: 'SMTP away',
      nextAttemptAt: new Date(now.getTime() + 1000), // base·2^0 with random() = 1
    });
    expect(await sut.tick()).toBe(0); // not due yet
    now = new Date(now.getTime() + 1000);
    await sut.tick();
    await sut.idle();
    expect(store.rows.get('a')).toMatchObject({
      state: 'pending',
      attempts: 2,
      nextAttemptAt: new Date(now.getTime() + 2000),
    });
    now = new Date(now.getTime() + 2000);
    await sut.tick();
    await sut.idle();
    expect(store.rows.get('a')).toMatchObject({ state: 'dead', attempts: 3, lastError: 'SMTP away' });
  });

  it('lets a permanent error kill the job at once, and retries a kind it has no handler for', async () => {
    handlers.register('broken', () => Promise.reject(new PermanentJobError('the notice is gone')));
    store.add('a', 'broken');
    store.add('b', 'unknown-kind');
    const sut = make();
    await sut.tick();
    await sut.idle();
    expect(store.rows.get('a')).toMatchObject({
      state: 'dead',
      attempts: 1,
      lastError: 'the notice is gone',
    });
    expect(store.rows.get('b')).toMatchObject({ state: 'pending', attempts: 1 });
    expect(store.rows.get('b')!.lastError).toMatch(/No handler for job kind "unknown-kind"/);
  });

  it('records a finished job once the database answers again, instead of leaving it running for the lease', async () => {
    // Found by `npm run faults`: MariaDB killed while a notice was being sent left its job running (and the
    // notice unsent) for the whole 5-minute lease; a finished job was even recorded as a failure.
    handlers.register('test', () => Promise.resolve());
    store.add('a');
    const away = new Error('connect ECONNREFUSED 127.0.0.1:3306');
    store.complete.mockRejectedValueOnce(away).mockRejectedValueOnce(away);
    const sut = make({ recordRetryBaseMs: 1 });
    await sut.tick();
    await sut.idle();
    expect(store.complete).toHaveBeenCalledTimes(3);
    expect(store.fail).not.toHaveBeenCalled();
    expect(store.rows.get('a')).toMatchObject({ state: 'done', attempts: 1 });
  });

  it('records a failed attempt once the database answers again, so the retry comes after its back-off', async () => {
    handlers.register('test', () => Promise.reject(new Error('SMTP away')));
    store.add('a');
    store.fail.mockRejectedValueOnce(new Error('read ECONNRESET'));
    const sut = make({ recordRetryBaseMs: 1 });
    await sut.tick();
    await sut.idle();
    expect(store.fail).toHaveBeenCalledTimes(2);
    expect(store.rows.get('a')).toMatchObject({ state: 'pending', attempts: 1, lastError: 'SMTP away' });
  });

  it('leaves the row to the lease when the database stays away for half of it', async () => {
    handlers.register('test', () => Promise.resolve());
    store.add('a');
    store.complete.mockRejectedValue(new Error('connect ECONNREFUSED'));
    let clock = now.getTime();
    const sut = make({ recordRetryBaseMs: 1, leaseMs: 20, now: () => new Date((clock += 4)) });
    await sut.tick();
    await sut.idle();
    expect(store.complete.mock.calls.length).toBeGreaterThan(1);
    expect(store.complete.mock.calls.length).toBeLessThan(5);
    expect(store.rows.get('a')!.state).toBe('running');
  });

  it('refuses to register two handlers for one kind', () => {
    handlers.register('test', () => Promise.resolve());
    expect(() => handlers.register('test', () => Promise.resolve())).toThrow(/already registered/);
  });

  it('two workers over one table run each job once', async () => {
    const runs = new Map<string, number>();
    handlers.register('test', async (payload) => {
      const id = String(payload.id);
      runs.set(id, (runs.get(id) ?? 0) + 1);
      await new Promise((r) => setImmediate(r));
    });
    for (let i = 0; i < 50; i++) store.add(`j${i}`, 'test', { id: `j${i}` });
    const a = make({ concurrency: 3 });
    const b = make({ concurrency: 3 });
    a.start();
    b.start();
    await until(() => [...store.rows.values()].every((j) => j.state === 'done'));
    await Promise.all([a.stop(), b.stop()]);
    expect(runs.size).toBe(50);
    expect([...runs.values()].every((n) => n === 1)).toBe(true);
    const claimers = new Set(store.claims.map((c) => c.workerId));
    expect(claimers).toEqual(new Set([a.id, b.id]));
  });

  it('on stop, finishes the job being run within the grace period', async () => {
    let release!: () => void;
    handlers.register('test', () => new Promise<void>((r) => (release = r)));
    store.add('a');
    const sut = make({ shutdownGraceMs: 2000 });
    sut.start();
    await until(() => store.rows.get('a')!.state === 'running');
    const stopping = sut.stop();
    release();
    await stopping;
    expect(store.rows.get('a')!.state).toBe('done');
    expect(store.release).not.toHaveBeenCalled();
    expect(sut.isRunning).toBe(false);
  });

  it('on stop, gives back a job that outlasts the grace period (pending again, attempt not counted)', async () => {
    let signal: AbortSignal | undefined;
    handlers.register('test', (_p, ctx) => {
      signal = ctx.signal;
      return new Promise<void>(() => undefined);
    });
    store.add('a');
    const sut = make({ shutdownGraceMs: 20 });
    sut.start();
    await until(() => store.rows.get('a')!.state === 'running');
    await sut.stop();
    expect(store.rows.get('a')).toMatchObject({ state: 'pending', attempts: 0, lockedBy: null });
    expect(signal?.aborted).toBe(true);
  });

  it('keeps polling when the database is away, and picks the jobs up when it is back', async () => {
    handlers.register('test', () => Promise.resolve());
    store.add('a');
    store.claim.mockImplementationOnce(() => Promise.reject(new Error('ECONNREFUSED 127.0.0.1:3307')));
    const sut = make();
    sut.start();
    await until(() => store.rows.get('a')!.state === 'done');
    await sut.stop();
    expect(store.claim.mock.calls.length).toBeGreaterThanOrEqual(2);
  });
});
