import type { SupportElement, SupportItemStatus } from '@roundbook/domain';
import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { CreatedAt, UpdatedAt, Version } from '../../common/dto/timestamps.js';
import { Round } from '../rounds/round.entity.js';

/** One element of the checklist as recorded: what was installed, by whom and when. */
export interface StoredSupportItem {
  element: SupportElement;
  status: SupportItemStatus;
  quantity: number | null;
  length: number | null;
  reason: string;
  /** The member who recorded this item's last change (the person who had it installed). */
  installedBy: string | null;
  installedAt: string | null;
}

/**
 * Support as built for one confirmed round (product.md "Support record"): one row per round, the items as
 * JSON. The plan is not stored: it is read from the round's confirmed class each time.
 */
@Entity('support_records')
@Index('UQ_support_records_round', ['roundId'], { unique: true })
@Index('IDX_support_records_heading', ['headingId'])
export class SupportRecord {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @Column({ name: 'heading_id', type: 'uuid' })
  headingId: string;

  @Column({ name: 'round_id', type: 'uuid' })
  roundId: string;

  @ManyToOne(() => Round, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'round_id', foreignKeyConstraintName: 'FK_support_records_round' })
  round?: Round;

  /** The class the round was confirmed with when this was last saved. */
  @Column({ name: 'class_id', type: 'uuid' })
  classId: string;

  @Column({ type: 'json' })
  items: StoredSupportItem[];

  /** How many items are outstanding (kept with the items, for the Board). */
  @Column({ name: 'outstanding_count', type: 'int' })
  outstandingCount: number;

  @Column({ name: 'updated_by', type: 'uuid' })
  updatedBy: string;

  @CreatedAt()
  createdAt: Date;

  @UpdatedAt()
  updatedAt: Date;

  @Version()
  version: number;
}
