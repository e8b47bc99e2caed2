import { ROUND_STATUSES, SHIFTS, type RoundStatus, type Shift } from '@roundbook/domain';
import type { RoundAssessment, SetParameters } from '@roundbook/domain';
import type { QRecord, RmrRecord } from '@roundbook/domain';
import type { SketchDocument, TriggerFiring } from '@roundbook/domain';
import { Column, Entity, Index, JoinColumn, ManyToOne, OneToMany, PrimaryColumn } from 'typeorm';
import { decimal } from '../../common/dto/numeric.transformer.js';
import { CreatedAt, UpdatedAt, Version } from '../../common/dto/timestamps.js';
import { Heading, STAGES, type Stage } from '../headings/heading.entity.js';
import { SupportClass } from '../support-classes/support-class.entity.js';
import type { Joint } from './joint.entity.js';

export { ROUND_STATUSES, SHIFTS, type RoundStatus, type Shift };
export type { QRecord, RmrRecord };

/** One rock unit seen at the face, with its share of the face and its field grades. */
export interface RockUnit {
  name: string;
  sharePercent: number;
  weatheringGrade: string | null;
  strengthGrade: string | null;
}

/** What the geologist records about the ground of the face (besides the joints). */
export interface GroundRecord {
  units: RockUnit[];
  /** Point-load index Is50, MPa, and the factor used to estimate UCS from it */
  pointLoadIs50: number | null;
  pointLoadFactor: number | null;
  /** Water inflow at the face, l/min, and the tunnel length it comes from, m */
  inflowLpm: number | null;
  inflowLengthM: number | null;
  waterDescription: string;
  overbreakM3: number | null;
  notes: string;
}

/** One mapped face: position, ground, joints, ratings, recommendation and status. */
@Entity('rounds')
@Index('UQ_rounds_heading_stage_number', ['headingId', 'stage', 'roundNumber'], { unique: true })
@Index('IDX_rounds_heading_chainage', ['headingId', 'faceChainage'])
// The Board's furthest face per status and latest confirmed round, read by seeks (board.service).
@Index('IDX_rounds_heading_status_face', ['headingId', 'status', 'faceChainage'])
@Index('IDX_rounds_heading_status_confirmed', ['headingId', 'status', 'confirmedAt'])
@Index('IDX_rounds_heading_date', ['headingId', 'shiftDate'])
@Index('IDX_rounds_heading_q', ['headingId', 'q'])
@Index('IDX_rounds_heading_rmr', ['headingId', 'rmr'])
@Index('IDX_rounds_heading_mapped', ['headingId', 'mappedAt'])
// Covers the Board's per-heading aggregates (board.service, support-records outstandingHeadings).
@Index('IDX_rounds_heading_progress', [
  'headingId',
  'status',
  'stage',
  'roundNumber',
  'faceChainage',
  'mappedAt',
  'triggerLevel',
])
export class Round {
  /** Client-generated UUID (accepted on create) or made by the API. */
  @PrimaryColumn('uuid')
  id: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @Column({ name: 'heading_id', type: 'uuid' })
  headingId: string;

  @ManyToOne(() => Heading, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'heading_id' })
  heading?: Heading;

  @Column({ type: 'enum', enum: STAGES })
  stage: Stage;

  @Column({ name: 'round_number', type: 'int' })
  roundNumber: number;

  @Column({ name: 'face_chainage', type: 'decimal', precision: 12, scale: 3, transformer: decimal })
  faceChainage: number;

  @Column({
    name: 'previous_chainage',
    type: 'decimal',
    precision: 12,
    scale: 3,
    nullable: true,
    transformer: decimal,
  })
  previousChainage: number | null;

  @Column({
    name: 'round_length',
    type: 'decimal',
    precision: 7,
    scale: 3,
    nullable: true,
    transformer: decimal,
  })
  roundLength: number | null;

  /** The date the shift started, in the project's time zone (a night shift spans midnight). */
  @Column({ name: 'shift_date', type: 'date' })
  shiftDate: string;

  @Column({ type: 'enum', enum: SHIFTS })
  shift: Shift;

  @Column({ name: 'mapped_by', type: 'uuid' })
  mappedBy: string;

  @Column({ name: 'mapped_at', type: 'datetime', precision: 3 })
  mappedAt: Date;

  /** Parts of the face seen only from a distance (not mapped at arm's length). */
  @Column({ name: 'distant_parts', type: 'text' })
  distantParts: string;

  @Column({ type: 'json' })
  ground: GroundRecord;

  /** The face sketch (packages/domain SketchDocument, checked by restoreSketch on the way in); null: none yet. */
  @Column({ type: 'json', nullable: true })
  sketch: SketchDocument | null;

  @Column({ name: 'q_input', type: 'json', nullable: true })
  qInput: QRecord | null;

  @Column({ name: 'rmr_input', type: 'json', nullable: true })
  rmrInput: RmrRecord | null;

  /** GSI read from the chart by the geologist, if any; otherwise GSI comes from RMR89. */
  @Column({
    name: 'gsi_observed',
    type: 'decimal',
    precision: 5,
    scale: 1,
    nullable: true,
    transformer: decimal,
  })
  gsiObserved: number | null;

  // Computed by packages/geomath on every save (kept for listing and sorting).
  @Column({ type: 'double', nullable: true })
  q: number | null;

  @Column({ type: 'int', nullable: true })
  rmr: number | null;

  @Column({ type: 'decimal', precision: 5, scale: 1, nullable: true, transformer: decimal })
  gsi: number | null;

  @Column({ name: 'recommended_class_id', type: 'uuid', nullable: true })
  recommendedClassId: string | null;

  @ManyToOne(() => SupportClass, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'recommended_class_id' })
  recommendedClass?: SupportClass | null;

  @Column({
    name: 'next_round_length',
    type: 'decimal',
    precision: 5,
    scale: 2,
    nullable: true,
    transformer: decimal,
  })
  nextRoundLength: number | null;

  /** The class the engineer confirmed (kept apart from the geologist's recommendation); null until confirmed. */
  @Column({ name: 'confirmed_class_id', type: 'uuid', nullable: true })
  confirmedClassId: string | null;

  /** The next round length the engineer confirmed, m. */
  @Column({
    name: 'confirmed_round_length',
    type: 'decimal',
    precision: 5,
    scale: 2,
    nullable: true,
    transformer: decimal,
  })
  confirmedRoundLength: number | null;

  @Column({ name: 'confirmed_at', type: 'datetime', precision: 3, nullable: true })
  confirmedAt: Date | null;

  @Column({ name: 'recommendation_reason', type: 'text' })
  recommendationReason: string;

  /** Highest level among the project's trigger rules that fire on this round (null: no rules). */
  @Column({ name: 'trigger_level', type: 'enum', enum: ['green', 'amber', 'red'], nullable: true })
  triggerLevel: 'green' | 'amber' | 'red' | null;

  /** The rules that fire, with the reason in words, as worked out at the last save. */
  @Column({ name: 'trigger_firings', type: 'json', nullable: true })
  triggerFirings: TriggerFiring[] | null;

  @Column({ type: 'enum', enum: ROUND_STATUSES, default: 'draft' })
  status: RoundStatus;

  @Column({ type: 'int', default: 1 })
  revision: number;

  /** The round's assessment (packages/domain): saved on every save of a draft, frozen at submit. */
  @Column({ type: 'json', nullable: true })
  assessment: RoundAssessment | null;

  /** The domain rules version that produced the assessment. */
  @Column({ name: 'assessment_version', type: 'varchar', length: 40, nullable: true })
  assessmentVersion: string | null;

  /** How the sets were found (window along the heading, count or automatic). */
  @Column({ name: 'set_parameters', type: 'json', nullable: true })
  setParameters: SetParameters | null;

  /** Enabled trigger rules that could not be evaluated on this round for want of data. */
  @Column({ name: 'triggers_not_evaluated', type: 'int', default: 0 })
  triggersNotEvaluated: number;

  @Column({ name: 'submitted_at', type: 'datetime', precision: 3, nullable: true })
  submittedAt: Date | null;

  @OneToMany('Joint', (j: Joint) => j.round)
  joints?: Joint[];

  @CreatedAt()
  createdAt: Date;

  @UpdatedAt()
  updatedAt: Date;

  @Version()
  version: number;
}
