import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import { CreatedAt, UpdatedAt } from '../../common/dto/timestamps.js';

export const JOB_STATES = ['pending', 'running', 'done', 'dead'] as const;
export type JobState = (typeof JOB_STATES)[number];

/**
 * One unit of background work (an e-mail, later thumbnails, renders, PDFs). Any API process claims due rows
 * with SELECT … FOR UPDATE SKIP LOCKED, so each job runs on one worker at a time.
 */
@Entity('jobs')
@Index('IDX_jobs_due', ['state', 'nextAttemptAt'])
@Index('UQ_jobs_dedupe_key', ['dedupeKey'], { unique: true })
export class Job {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** Which handler runs it, e.g. `mail.send` */
  @Column({ type: 'varchar', length: 64 })
  kind: string;

  @Column({ type: 'json' })
  payload: Record<string, unknown>;

  @Column({ type: 'enum', enum: JOB_STATES, default: 'pending' })
  state: JobState;

  /** Attempts started so far (a claim counts as one) */
  @Column({ type: 'int', default: 0 })
  attempts: number;

  @Column({ name: 'next_attempt_at', type: 'datetime', precision: 3 })
  nextAttemptAt: Date;

  @Column({ name: 'last_error', type: 'text', nullable: true })
  lastError: string | null;

  /** Enqueuing the same key twice makes one job (NULL: no de-duplication) */
  @Column({ name: 'dedupe_key', type: 'varchar', length: 191, nullable: true })
  dedupeKey: string | null;

  /** The worker that holds it while running, and since when (a lease: reclaimed when it runs out) */
  @Column({ name: 'locked_by', type: 'varchar', length: 64, nullable: true })
  lockedBy: string | null;

  @Column({ name: 'locked_at', type: 'datetime', precision: 3, nullable: true })
  lockedAt: Date | null;

  @Column({ name: 'finished_at', type: 'datetime', precision: 3, nullable: true })
  finishedAt: Date | null;

  @CreatedAt()
  createdAt: Date;

  @UpdatedAt()
  updatedAt: Date;
}
