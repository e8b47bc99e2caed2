import { randomUUID } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, In, type EntityManager } from 'typeorm';
import type { FailureOutcome } from './backoff.js';
import { Job, type JobState } from './job.entity.js';

export interface EnqueueJob {
  kind: string;
  payload: Record<string, unknown>;
  /** A second enqueue with the same key is a no-op that returns the first job's id. */
  dedupeKey?: string;
  /** Not before this time (default: now) */
  runAt?: Date;
}

/**
 * The jobs table. Every method is one short statement or one short transaction; no lock is held while a
 * job runs (the row's state and lease say who has it).
 */
@Injectable()
export class JobsService {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  /**
   * Adds a job inside the caller's transaction, so the job exists exactly when the change that asked for it
   * was committed. Returns the job's id (the existing one when the dedupe key was taken).
   */
  async enqueue(manager: EntityManager, spec: EnqueueJob): Promise<string> {
    const id = randomUUID();
    await manager.query(
      `INSERT INTO jobs (id, kind, payload, state, attempts, next_attempt_at, dedupe_key)
       VALUES (?, ?, ?, 'pending', 0, ?, ?)
       ON DUPLICATE KEY UPDATE id = id`,
      [id, spec.kind, JSON.stringify(spec.payload), spec.runAt ?? new Date(), spec.dedupeKey ?? null],
    );
    if (!spec.dedupeKey) return id;
    const rows = await manager.query<Array<{ id: string }>>(`SELECT id FROM jobs WHERE dedupe_key = ?`, [
      spec.dedupeKey,
    ]);
    return rows[0]?.id ?? id;
  }

  /**
   * Claims up to `limit` due jobs for `workerId`: SELECT … FOR UPDATE SKIP LOCKED on the (state,
   * next_attempt_at) index in a READ COMMITTED transaction, so two workers never take the same row and
   * neither waits for the other. Each claim counts as an attempt. `kinds` limits it to some job kinds
   * (a worker that runs only those). The order is the index's own (state, next_attempt_at, then the primary
   * key InnoDB appends), so the scan stops after `limit` rows and locks no others; an order the index does
   * not give (say created_at) would sort — locking every due row — and the other worker would skip them all.
   */
  async claim(workerId: string, limit: number, now: Date, kinds?: string[]): Promise<Job[]> {
    if (limit <= 0 || kinds?.length === 0) return [];
    const byKind = kinds ? `AND kind IN (${kinds.map(() => '?').join(', ')})` : '';
    return this.dataSource.transaction('READ COMMITTED', async (manager) => {
      const due = await manager.query<Array<{ id: string }>>(
        `SELECT id FROM jobs
          WHERE state = 'pending' AND next_attempt_at <= ? ${byKind}
          ORDER BY next_attempt_at, id
          LIMIT ?
          FOR UPDATE SKIP LOCKED`,
        [now, ...(kinds ?? []), limit],
      );
      if (due.length === 0) return [];
      const ids = due.map((r) => r.id);
      await manager.query(
        `UPDATE jobs SET state = 'running', attempts = attempts + 1, locked_by = ?, locked_at = ?
          WHERE id IN (${ids.map(() => '?').join(', ')})`,
        [workerId, now, ...ids],
      );
      return manager.find(Job, { where: { id: In(ids) }, order: { nextAttemptAt: 'ASC' } });
    });
  }

  /** Marks a job done (only while this worker still holds it). */
  async complete(jobId: string, workerId: string, now: Date): Promise<void> {
    await this.dataSource.query(
      `UPDATE jobs SET state = 'done', finished_at = ?, locked_by = NULL, locked_at = NULL, last_error = NULL
        WHERE id = ? AND state = 'running' AND locked_by = ?`,
      [now, jobId, workerId],
    );
  }

  /** Records a failed attempt: back to pending with its next attempt, or dead with the error kept. */
  async fail(jobId: string, workerId: string, outcome: FailureOutcome, now: Date): Promise<void> {
    await this.dataSource.query(
      `UPDATE jobs SET state = ?, last_error = ?, next_attempt_at = COALESCE(?, next_attempt_at),
              finished_at = ?, locked_by = NULL, locked_at = NULL
        WHERE id = ? AND state = 'running' AND locked_by = ?`,
      [
        outcome.state,
        outcome.lastError,
        outcome.state === 'pending' ? outcome.nextAttemptAt : null,
        outcome.state === 'dead' ? now : null,
        jobId,
        workerId,
      ],
    );
  }

  /** Gives a job back unfinished (worker stopping): pending again, the attempt not counted. */
  async release(jobId: string, workerId: string, now: Date): Promise<void> {
    await this.dataSource.query(
      `UPDATE jobs SET state = 'pending', attempts = GREATEST(attempts - 1, 0), next_attempt_at = ?,
              locked_by = NULL, locked_at = NULL
        WHERE id = ? AND state = 'running' AND locked_by = ?`,
      [now, jobId, workerId],
    );
  }

  /** Jobs whose worker went silent past the lease (a crashed process) become pending again. */
  async reclaimExpired(now: Date, leaseMs: number): Promise<number> {
    const result = await this.dataSource.query<{ affectedRows?: number }>(
      `UPDATE jobs SET state = 'pending', next_attempt_at = ?, locked_by = NULL, locked_at = NULL,
              last_error = COALESCE(last_error, 'lease expired: the worker stopped answering')
        WHERE state = 'running' AND locked_at < ?`,
      [now, new Date(now.getTime() - leaseMs)],
    );
    return result.affectedRows ?? 0;
  }

  /** The jobs not done, newest first, and how many are in each state. */
  async overview(limit = 100): Promise<{ jobs: Job[]; counts: Record<JobState, number> }> {
    const jobs = await this.dataSource.getRepository(Job).find({
      where: { state: In(['pending', 'running', 'dead']) },
      order: { updatedAt: 'DESC' },
      take: limit,
    });
    const rows = await this.dataSource.query<Array<{ state: JobState; n: string | number }>>(
      `SELECT state, COUNT(*) AS n FROM jobs GROUP BY state`,
    );
    const counts: Record<JobState, number> = { pending: 0, running: 0, done: 0, dead: 0 };
    for (const r of rows) counts[r.state] = Number(r.n);
    return { jobs, counts };
  }

  /** Retry now: a dead job starts over with its attempts reset; a waiting one runs at once. */
  async retry(jobId: string, now: Date): Promise<Job | null> {
    await this.dataSource.query(
      `UPDATE jobs SET state = 'pending', next_attempt_at = ?, finished_at = NULL,
              attempts = CASE WHEN state = 'dead' THEN 0 ELSE attempts END
        WHERE id = ? AND state IN ('dead', 'pending')`,
      [now, jobId],
    );
    return this.dataSource.getRepository(Job).findOne({ where: { id: jobId } });
  }

  find(jobId: string): Promise<Job | null> {
    return this.dataSource.getRepository(Job).findOne({ where: { id: jobId } });
  }
}
