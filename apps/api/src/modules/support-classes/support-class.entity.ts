import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { decimal } from '../../common/dto/numeric.transformer.js';
import { CreatedAt, UpdatedAt, Version } from '../../common/dto/timestamps.js';
import { Project } from '../projects/project.entity.js';

/** One design support class of the project's library. Order matters: best ground first. */
@Entity('support_classes')
@Index('UQ_support_classes_project_code', ['projectId', 'code'], { unique: true })
export class SupportClass {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'project_id' })
  project?: Project;

  @Column({ type: 'varchar', length: 20 })
  code: string;

  @Column({ type: 'varchar', length: 120 })
  name: string;

  /** Position in the library, 1 = best ground. */
  @Column({ name: 'sort_order', type: 'int' })
  sortOrder: number;

  /** Applicable Q range, lower bound inclusive, upper bound exclusive; null = open. */
  @Column({ name: 'q_min', type: 'double', nullable: true })
  qMin: number | null;

  @Column({ name: 'q_max', type: 'double', nullable: true })
  qMax: number | null;

  /** Applicable RMR89 range, both bounds inclusive; null = open. */
  @Column({ name: 'rmr_min', type: 'int', nullable: true })
  rmrMin: number | null;

  @Column({ name: 'rmr_max', type: 'int', nullable: true })
  rmrMax: number | null;

  @Column({ name: 'max_round_length', type: 'decimal', precision: 4, scale: 2, transformer: decimal })
  maxRoundLength: number;

  @Column({ name: 'bolt_type', type: 'varchar', length: 120, default: '' })
  boltType: string;

  @Column({
    name: 'bolt_length',
    type: 'decimal',
    precision: 4,
    scale: 2,
    nullable: true,
    transformer: decimal,
  })
  boltLength: number | null;

  @Column({ name: 'bolt_pattern', type: 'varchar', length: 120, default: '' })
  boltPattern: string;

  /** Sprayed concrete thickness, mm (0 = none). */
  @Column({ name: 'shotcrete_mm', type: 'int', default: 0 })
  shotcreteMm: number;

  /** Steel sets or lattice girders, in words (empty = none). */
  @Column({ name: 'steel_support', type: 'varchar', length: 160, default: '' })
  steelSupport: string;

  @Column({ name: 'probing_required', type: 'boolean', default: false })
  probingRequired: boolean;

  @Column({ type: 'text' })
  notes: string;

  /** A class in use cannot be deleted, only retired: it stays on old rounds, not offered for new ones. */
  @Column({ type: 'boolean', default: false })
  retired: boolean;

  @CreatedAt()
  createdAt: Date;

  @UpdatedAt()
  updatedAt: Date;

  @Version()
  version: number;
}
