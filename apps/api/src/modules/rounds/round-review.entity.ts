import type { ConditionSnapshot } from '@roundbook/domain';
import { Column, CreateDateColumn, Entity, Index, PrimaryColumn } from 'typeorm';
import { decimal } from '../../common/dto/numeric.transformer.js';

export const REVIEW_DECISIONS = ['confirm', 'return', 'correct'] as const;
export type ReviewDecision = (typeof REVIEW_DECISIONS)[number];

/** The sections of a round a return comment may concern (the round screen's sections). */
export const REVIEW_SECTIONS = [
  'position',
  'ground',
  'joints',
  'ratings',
  'support',
  'triggers',
  'general',
] as const;
export type ReviewSection = (typeof REVIEW_SECTIONS)[number];

/** One review decision on a round (confirm, return or correct), signed by the person who took it. */
@Entity('round_decisions')
@Index('IDX_round_decisions_round', ['roundId', 'signedAt'])
export class RoundDecision {
  @PrimaryColumn('uuid')
  id: string;

  @Column({ name: 'round_id', type: 'uuid' })
  roundId: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  /** The revision the decision was taken on. */
  @Column({ type: 'int' })
  revision: number;

  @Column({ type: 'enum', enum: REVIEW_DECISIONS })
  decision: ReviewDecision;

  /** Confirm: the class to build, and the next round length, m. */
  @Column({ name: 'class_id', type: 'uuid', nullable: true })
  classId: string | null;

  @Column({
    name: 'round_length',
    type: 'decimal',
    precision: 5,
    scale: 2,
    nullable: true,
    transformer: decimal,
  })
  roundLength: number | null;

  /** The class the geologist recommended at the time (so a change of class reads from the decision alone). */
  @Column({ name: 'recommended_class_id', type: 'uuid', nullable: true })
  recommendedClassId: string | null;

  /** Why a class other than the recommendation, a longer round, or a correction. */
  @Column({ type: 'text' })
  reason: string;

  @Column({ type: 'text' })
  comments: string;

  @Column({ name: 'signed_by', type: 'uuid' })
  signedBy: string;

  @Column({ name: 'signed_name', type: 'varchar', length: 120 })
  signedName: string;

  @Column({ name: 'signed_role', type: 'varchar', length: 20 })
  signedRole: string;

  @Column({ name: 'signed_at', type: 'datetime', precision: 3 })
  signedAt: Date;
}

/** A comment of a return on one section of the round; it stays with the round until resolved. */
@Entity('round_comments')
@Index('IDX_round_comments_round', ['roundId', 'resolvedAt'])
export class RoundComment {
  @PrimaryColumn('uuid')
  id: string;

  @Column({ name: 'round_id', type: 'uuid' })
  roundId: string;

  /** The revision that was returned. */
  @Column({ type: 'int' })
  revision: number;

  @Column({ type: 'varchar', length: 20 })
  section: ReviewSection;

  @Column({ type: 'text' })
  text: string;

  @Column({ name: 'author_id', type: 'uuid' })
  authorId: string;

  @Column({ name: 'author_name', type: 'varchar', length: 120 })
  authorName: string;

  @CreateDateColumn({
    name: 'created_at',
    type: 'datetime',
    precision: 3,
    default: () => 'CURRENT_TIMESTAMP(3)',
  })
  createdAt: Date;

  @Column({ name: 'resolved_at', type: 'datetime', precision: 3, nullable: true })
  resolvedAt: Date | null;

  @Column({ name: 'resolved_by', type: 'uuid', nullable: true })
  resolvedBy: string | null;
}

/** A fired trigger rule of a round, acknowledged by the role that owns it: what was done, and a note. */
@Entity('trigger_acknowledgements')
@Index('UQ_trigger_ack_round_rule_revision', ['roundId', 'ruleId', 'revision'], { unique: true })
export class TriggerAcknowledgement {
  @PrimaryColumn('uuid')
  id: string;

  @Column({ name: 'round_id', type: 'uuid' })
  roundId: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @Column({ name: 'rule_id', type: 'uuid' })
  ruleId: string;

  /** The revision whose firing was acknowledged (a new revision fires afresh). */
  @Column({ type: 'int' })
  revision: number;

  @Column({ type: 'enum', enum: ['green', 'amber', 'red'] })
  level: 'green' | 'amber' | 'red';

  @Column({ name: 'action_taken', type: 'text' })
  actionTaken: string;

  @Column({ type: 'text' })
  note: string;

  @Column({ name: 'acknowledged_by', type: 'uuid' })
  acknowledgedBy: string;

  @Column({ name: 'acknowledged_name', type: 'varchar', length: 120 })
  acknowledgedName: string;

  @Column({ name: 'acknowledged_role', type: 'varchar', length: 20 })
  acknowledgedRole: string;

  @Column({ name: 'acknowledged_at', type: 'datetime', precision: 3 })
  acknowledgedAt: Date;
}

/**
 * An engineer's acceptance of a fired rule's standing condition on a heading, for a chainage range or until
 * a date, with the reason and a snapshot of what fired; while it holds the rule does not raise the level of
 * the heading's rounds (packages/domain applyAcceptances). Withdrawn ones are kept.
 */
@Entity('trigger_acceptances')
@Index('IDX_trigger_acceptances_heading', ['headingId', 'withdrawnAt'])
@Index('IDX_trigger_acceptances_round', ['roundId'])
export class TriggerAcceptance {
  @PrimaryColumn('uuid')
  id: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @Column({ name: 'heading_id', type: 'uuid' })
  headingId: string;

  @Column({ name: 'rule_id', type: 'uuid' })
  ruleId: string;

  /** The round (and revision) the condition was assessed and accepted on. */
  @Column({ name: 'round_id', type: 'uuid' })
  roundId: string;

  @Column({ type: 'int' })
  revision: number;

  @Column({ type: 'enum', enum: ['green', 'amber', 'red'] })
  level: 'green' | 'amber' | 'red';

  @Column({
    name: 'from_chainage',
    type: 'decimal',
    precision: 12,
    scale: 3,
    nullable: true,
    transformer: decimal,
  })
  fromChainage: number | null;

  @Column({
    name: 'to_chainage',
    type: 'decimal',
    precision: 12,
    scale: 3,
    nullable: true,
    transformer: decimal,
  })
  toChainage: number | null;

  @Column({ type: 'datetime', precision: 3, nullable: true })
  until: Date | null;

  @Column({ type: 'text' })
  reason: string;

  @Column({ type: 'json' })
  snapshot: ConditionSnapshot;

  @Column({ name: 'accepted_by', type: 'uuid' })
  acceptedBy: string;

  @Column({ name: 'accepted_name', type: 'varchar', length: 120 })
  acceptedName: string;

  @Column({ name: 'accepted_at', type: 'datetime', precision: 3 })
  acceptedAt: Date;

  @Column({ name: 'withdrawn_at', type: 'datetime', precision: 3, nullable: true })
  withdrawnAt: Date | null;

  @Column({ name: 'withdrawn_by', type: 'uuid', nullable: true })
  withdrawnBy: string | null;
}
