import { randomUUID } from 'node:crypto';
import { hostname } from 'node:os';
import {
  Inject,
  Injectable,
  Logger,
  type BeforeApplicationShutdown,
  type OnApplicationBootstrap,
} from '@nestjs/common';
import { afterFailure, type FailureOutcome, type RetryPolicy } from './backoff.js';
import { JobHandlers, PermanentJobError } from './job-handlers.js';
import type { Job } from './job.entity.js';
import { JobsService } from './jobs.service.js';

export interface WorkerOptions {
  enabled: boolean;
  pollIntervalMs: number;
  concurrency: number;
  leaseMs: number;
  retry: RetryPolicy;
  /** How long stop() waits for running jobs before giving them back */
  shutdownGraceMs: number;
  /** First pause before recording a job's outcome again while the database is away (default 500 ms) */
  recordRetryBaseMs?: number;
  now?: () => Date;
  random?: () => number;
}

export const WORKER_OPTIONS = Symbol('WORKER_OPTIONS');

/** Longest pause between tries to record a job's outcome while the database is away. */
const RECORD_RETRY_MAX_MS = 10_000;

/**
 * Runs due jobs: claims up to `concurrency` at a time, runs each with its kind's handler, marks it done or
 * schedules its retry. Any number of workers (in one process or many) may share one jobs table.
 */
@Injectable()
export class JobsWorker implements OnApplicationBootstrap, BeforeApplicationShutdown {
  readonly id = `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;
  private readonly logger = new Logger('Jobs');
  private readonly inFlight = new Map<string, Promise<void>>();
  private readonly abort = new AbortController();
  private loop: Promise<void> | null = null;
  private running = false;
  private stopping = false;
  private wake: (() => void) | null = null;
  private lastReclaim = 0;
  private readonly now: () => Date;

  constructor(
    @Inject(JobsService) private readonly jobs: JobsService,
    @Inject(JobHandlers) private readonly handlers: JobHandlers,
    @Inject(WORKER_OPTIONS) private readonly options: WorkerOptions,
  ) {
    this.now = options.now ?? (() => new Date());
  }

  onApplicationBootstrap(): void {
    if (this.options.enabled) this.start();
  }

  /** Stops before the database connection closes (Nest runs this hook before onApplicationShutdown). */
  async beforeApplicationShutdown(): Promise<void> {
    await this.stop();
  }

  get isRunning(): boolean {
    return this.running;
  }

  start(): void {
    if (this.running) return;
    this.running = true;
    this.stopping = false;
    this.loop = this.run();
  }

  /**
   * Stops claiming, waits up to the grace period for the jobs being run, then gives back any still running
   * (pending again, the attempt not counted) so another worker takes them.
   */
  async stop(): Promise<void> {
    if (!this.running && !this.loop) return;
    this.running = false;
    this.stopping = true;
    this.wake?.();
    await this.loop;
    this.loop = null;
    if (this.inFlight.size > 0) {
      let timer: NodeJS.Timeout | undefined;
      const grace = new Promise<'timeout'>((resolve) => {
        timer = setTimeout(() => resolve('timeout'), this.options.shutdownGraceMs);
      });
      const finished = await Promise.race([Promise.allSettled([...this.inFlight.values()]), grace]);
      clearTimeout(timer);
      if (finished === 'timeout') {
        this.abort.abort();
        const left = [...this.inFlight.keys()];
        this.logger.warn(`Stopping: giving back ${left.length} unfinished job(s)`);
        await Promise.allSettled(left.map((id) => this.jobs.release(id, this.id, this.now())));
      }
    }
  }

  /** One round: claim what fits and start it. Returns how many jobs were claimed. */
  async tick(): Promise<number> {
    const nowMs = this.now().getTime();
    if (nowMs - this.lastReclaim >= Math.min(this.options.leaseMs, 60_000)) {
      this.lastReclaim = nowMs;
      const reclaimed = await this.jobs.reclaimExpired(this.now(), this.options.leaseMs);
      if (reclaimed > 0) this.logger.warn(`Reclaimed ${reclaimed} job(s) whose worker stopped answering`);
    }
    const free = this.options.concurrency - this.inFlight.size;
    if (free <= 0) return 0;
    const claimed = await this.jobs.claim(this.id, free, this.now());
    for (const job of claimed) this.launch(job);
    return claimed.length;
  }

  /** Resolves when the jobs started so far have finished (tests). */
  async idle(): Promise<void> {
    while (this.inFlight.size > 0) await Promise.allSettled([...this.inFlight.values()]);
  }

  private async run(): Promise<void> {
    while (this.running) {
      try {
        await this.tick();
      } catch (e) {
        // The database is away: keep polling; the jobs wait in their table.
        this.logger.warn(`Could not claim jobs: ${e instanceof Error ? e.message : String(e)}`);
      }
      // A finishing job ends the pause, so a busy worker takes the next job at once.
      if (this.running) await this.pause();
    }
  }

  /** Waits for the poll interval, or less when a job finishes or stop() is called. */
  private pause(): Promise<void> {
    return new Promise((resolve) => {
      let timer: NodeJS.Timeout | undefined = undefined;
      const done = (): void => {
        clearTimeout(timer);
        this.wake = null;
        resolve();
      };
      timer = setTimeout(done, this.options.pollIntervalMs);
      this.wake = done;
    });
  }

  private launch(job: Job): void {
    const p = this.execute(job).finally(() => {
      this.inFlight.delete(job.id);
      this.wake?.();
    });
    this.inFlight.set(job.id, p);
  }

  private async execute(job: Job): Promise<void> {
    const handler = this.handlers.get(job.kind);
    let outcome: FailureOutcome | 'done';
    try {
      if (!handler) throw new Error(`No handler for job kind "${job.kind}" on worker ${this.id}`);
      await handler(job.payload, { job, attempt: job.attempts, signal: this.abort.signal });
      outcome = 'done';
    } catch (error) {
      outcome = afterFailure(job.attempts, error, this.now(), this.options.retry, {
        permanent: error instanceof PermanentJobError,
        random: this.options.random,
      });
      if (outcome.state === 'dead')
        this.logger.error(
          `Job ${job.kind} ${job.id} gave up after ${job.attempts} attempt(s): ${outcome.lastError}`,
        );
    }
    await this.record(job, outcome);
  }

  /**
   * Writes how the attempt ended. When the database is away, it tries again (0.5 s, 1 s, 2 s … up to 10 s)
   * until it is back, for at most half the lease: a job left `running` would wait the whole lease before
   * anyone took it again (found by `npm run faults`: a notice being sent when MariaDB was killed stayed
   * unsent for the 5-minute lease), and a finished one would run twice. A worker told to stop gives up at
   * once; the lease brings the row back.
   */
  private async record(job: Job, outcome: FailureOutcome | 'done'): Promise<void> {
    const started = this.now().getTime();
    for (let attempt = 0; ; attempt++) {
      try {
        if (outcome === 'done') await this.jobs.complete(job.id, this.id, this.now());
        else await this.jobs.fail(job.id, this.id, outcome, this.now());
        if (attempt > 0) this.logger.log(`Recorded job ${job.id} after ${attempt + 1} tries`);
        return;
      } catch (e) {
        const message = e instanceof Error ? e.message : String(e);
        const waitMs = Math.min(RECORD_RETRY_MAX_MS, (this.options.recordRetryBaseMs ?? 500) * 2 ** attempt);
        const late = this.now().getTime() - started + waitMs > this.options.leaseMs / 2;
        if (this.stopping || late) {
          // The row stays running; the lease brings it back.
          this.logger.warn(`Could not record how job ${job.id} ended: ${message}`);
          return;
        }
        if (attempt === 0) this.logger.warn(`Could not record how job ${job.id} ended yet: ${message}`);
        await this.delay(waitMs);
      }
    }
  }

  /** A pause that stop() cuts short. */
  private delay(ms: number): Promise<void> {
    return new Promise((resolve) => {
      const done = (): void => {
        clearTimeout(timer);
        this.abort.signal.removeEventListener('abort', done);
        resolve();
      };
      const timer = setTimeout(done, ms);
      this.abort.signal.addEventListener('abort', done, { once: true });
    });
  }
}
