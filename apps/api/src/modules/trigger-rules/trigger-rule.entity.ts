import {
  COMPARISONS,
  FIRES,
  TRIGGER_LEVELS as LEVELS,
  WATCHED,
  type Comparison,
  type Fires,
  type TriggerLevel as Level,
  type Watched,
} from '@roundbook/domain';
import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { PROJECT_ROLES, type ProjectRole } from '../../common/auth/auth-user.js';
import { decimal } from '../../common/dto/numeric.transformer.js';
import { CreatedAt, UpdatedAt, Version } from '../../common/dto/timestamps.js';
import { Project } from '../projects/project.entity.js';

/** What a trigger rule watches, how it compares and its levels come from packages/domain (product.md "Trigger rule"). */
export { COMPARISONS, FIRES, LEVELS, WATCHED, type Comparison, type Fires, type Level, type Watched };

@Entity('trigger_rules')
export class TriggerRule {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'project_id' })
  project?: Project;

  @Column({ type: 'enum', enum: WATCHED })
  watch: Watched;

  /** For numeric quantities; flag-type quantities (adverse orientation, class change, red hazard) have none. */
  @Column({ type: 'enum', enum: COMPARISONS, nullable: true })
  comparison: Comparison | null;

  @Column({ type: 'decimal', precision: 12, scale: 4, nullable: true, transformer: decimal })
  threshold: number | null;

  /** How it fires: on the round's value, or on the change from the previous round of the heading and stage. */
  @Column({ type: 'enum', enum: FIRES, default: 'value' })
  fires: Fires;

  @Column({ type: 'enum', enum: LEVELS })
  level: Level;

  /** What to do when it fires, in the project's words. */
  @Column({ type: 'text' })
  action: string;

  @Column({ name: 'owner_role', type: 'enum', enum: PROJECT_ROLES })
  ownerRole: ProjectRole;

  /** Time allowed to act, hours. */
  @Column({ name: 'time_allowed_hours', type: 'decimal', precision: 6, scale: 2, transformer: decimal })
  timeAllowedHours: number;

  @Column({ type: 'boolean', default: true })
  enabled: boolean;

  @CreatedAt()
  createdAt: Date;

  @UpdatedAt()
  updatedAt: Date;

  @Version()
  version: number;
}
