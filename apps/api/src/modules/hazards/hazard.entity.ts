import {
  HAZARD_KINDS,
  HAZARD_ORIGINS,
  HAZARD_STATUSES,
  TRIGGER_LEVELS,
  type HazardKind,
  type HazardOrigin,
  type HazardStatus,
  type TriggerLevel,
} from '@roundbook/domain';
import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { decimal } from '../../common/dto/numeric.transformer.js';
import { CreatedAt, UpdatedAt, Version } from '../../common/dto/timestamps.js';
import { Heading } from '../headings/heading.entity.js';

/** The words of the register come from packages/domain (product.md "Hazard"). */
export { HAZARD_KINDS, HAZARD_ORIGINS, HAZARD_STATUSES, TRIGGER_LEVELS as HAZARD_LEVELS };

/**
 * One hazard in a heading's register: what, where (a chainage range, start-side end first), how serious
 * (the trigger levels), where it was raised, and whether it is still open. It stays open, and is carried on
 * every handover, until an engineer, a supervisor or an admin closes it with a reason.
 */
@Entity('hazards')
@Index('IDX_hazards_heading_status', ['headingId', 'status'])
export class Hazard {
  /** Client-generated (anything can point at a hazard before it is saved), or made by the API. */
  @PrimaryColumn('uuid')
  id: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @Column({ name: 'heading_id', type: 'uuid' })
  headingId: string;

  @ManyToOne(() => Heading, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'heading_id', foreignKeyConstraintName: 'FK_hazards_heading' })
  heading?: Heading;

  @Column({ type: 'enum', enum: HAZARD_KINDS })
  kind: HazardKind;

  /** The range's end nearer the heading's start, m. */
  @Column({ name: 'from_chainage', type: 'decimal', precision: 12, scale: 3, transformer: decimal })
  fromChainage: number;

  /** The range's far end along the drive, m (equal to from for a hazard at one place). */
  @Column({ name: 'to_chainage', type: 'decimal', precision: 12, scale: 3, transformer: decimal })
  toChainage: number;

  @Column({ type: 'enum', enum: TRIGGER_LEVELS })
  level: TriggerLevel;

  @Column({ type: 'text' })
  description: string;

  @Column({ type: 'enum', enum: HAZARD_ORIGINS })
  origin: HazardOrigin;

  /** The round it was raised on (origin round); the round may later be corrected, the hazard stays. */
  @Column({ name: 'round_id', type: 'uuid', nullable: true })
  roundId: string | null;

  /** The handover it was raised on (origin handover). A plain id until handovers are stored. */
  @Column({ name: 'handover_id', type: 'uuid', nullable: true })
  handoverId: string | null;

  /** Photos of the heading's rounds that show it (ids in the photos module). */
  @Column({ name: 'photo_ids', type: 'json' })
  photoIds: string[];

  @Column({ type: 'enum', enum: HAZARD_STATUSES, default: 'open' })
  status: HazardStatus;

  @Column({ name: 'raised_by', type: 'uuid' })
  raisedBy: string;

  @Column({ name: 'closed_by', type: 'uuid', nullable: true })
  closedBy: string | null;

  @Column({ name: 'closed_at', type: 'datetime', precision: 3, nullable: true })
  closedAt: Date | null;

  @Column({ name: 'close_reason', type: 'text', nullable: true })
  closeReason: string | null;

  @CreatedAt()
  createdAt: Date;

  @UpdatedAt()
  updatedAt: Date;

  @Version()
  version: number;
}
