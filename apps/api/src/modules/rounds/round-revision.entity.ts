import type { RoundAssessment } from '@roundbook/domain';
import { Column, CreateDateColumn, Entity, Index, PrimaryColumn } from 'typeorm';
import { ROUND_EVENTS, type RoundEvent } from './round-status.js';

/** The frozen record and assessment of a round at a submit (and, with the review, at confirm or return). */
@Entity('round_revisions')
@Index('IDX_round_revisions_round', ['roundId', 'revision'])
export class RoundRevision {
  @PrimaryColumn('uuid')
  id: string;

  @Column({ name: 'round_id', type: 'uuid' })
  roundId: string;

  @Column({ type: 'int' })
  revision: number;

  @Column({ type: 'enum', enum: ROUND_EVENTS })
  event: RoundEvent;

  /** The status the round took at this event. */
  @Column({ type: 'varchar', length: 20 })
  status: string;

  /** The whole record as it was (position, ground, joints, ratings inputs, recommendation). */
  @Column({ type: 'json' })
  record: Record<string, unknown>;

  @Column({ type: 'json' })
  assessment: RoundAssessment;

  @Column({ name: 'assessment_version', type: 'varchar', length: 40 })
  assessmentVersion: string;

  @Column({ name: 'created_by', type: 'uuid' })
  createdBy: string;

  @CreateDateColumn({
    name: 'created_at',
    type: 'datetime',
    precision: 3,
    default: () => 'CURRENT_TIMESTAMP(3)',
  })
  createdAt: Date;
}
