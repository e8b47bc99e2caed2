import {
  JOINT_KINDS,
  JOINT_WATER,
  JRC_METHODS,
  type JointKind,
  type JointWater,
  type JrcMethod,
} from '@roundbook/domain';
import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { decimal } from '../../common/dto/numeric.transformer.js';
import { Round } from './round.entity.js';

export { JOINT_KINDS, JOINT_WATER, JRC_METHODS, type JointKind, type JointWater, type JrcMethod };

/** One discontinuity recorded on a round (a set member or a significant single feature). */
@Entity('joints')
@Index('IDX_joints_heading_chainage', ['headingId', 'faceChainage'])
export class Joint {
  /** Stable id (client-generated UUID or made by the API); joints are upserted by it, never re-inserted. */
  @PrimaryColumn('uuid')
  id: string;

  @Column({ name: 'round_id', type: 'uuid' })
  roundId: string;

  @ManyToOne(() => Round, (r) => r.joints, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'round_id' })
  round?: Round;

  /** Kept with the joint so a heading's joints over a chainage window come from one index. */
  @Column({ name: 'heading_id', type: 'uuid' })
  headingId: string;

  @Column({ name: 'face_chainage', type: 'decimal', precision: 12, scale: 3, transformer: decimal })
  faceChainage: number;

  @Column({ type: 'int' })
  seq: number;

  @Column({ type: 'enum', enum: JOINT_KINDS })
  kind: JointKind;

  /** The orientation exactly as typed, and the notation it was read in. */
  @Column({ name: 'orientation_text', type: 'varchar', length: 60 })
  orientationText: string;

  @Column({ type: 'varchar', length: 24 })
  notation: string;

  /** Canonical dip direction / dip; null while the typed text cannot be read (the reason is kept). */
  @Column({
    name: 'dip_direction',
    type: 'decimal',
    precision: 6,
    scale: 2,
    nullable: true,
    transformer: decimal,
  })
  dipDirection: number | null;

  @Column({ type: 'decimal', precision: 5, scale: 2, nullable: true, transformer: decimal })
  dip: number | null;

  @Column({ name: 'orientation_error', type: 'varchar', length: 300, nullable: true })
  orientationError: string | null;

  @Column({ name: 'set_label', type: 'varchar', length: 20, nullable: true })
  setLabel: string | null;

  /** True when the geologist fixed the set by hand (kept over the computed one). */
  @Column({ name: 'set_override', type: 'boolean', default: false })
  setOverride: boolean;

  @Column({
    name: 'spacing_m',
    type: 'decimal',
    precision: 7,
    scale: 3,
    nullable: true,
    transformer: decimal,
  })
  spacingM: number | null;

  @Column({
    name: 'persistence_m',
    type: 'decimal',
    precision: 7,
    scale: 2,
    nullable: true,
    transformer: decimal,
  })
  persistenceM: number | null;

  @Column({
    name: 'aperture_mm',
    type: 'decimal',
    precision: 7,
    scale: 2,
    nullable: true,
    transformer: decimal,
  })
  apertureMm: number | null;

  @Column({ type: 'decimal', precision: 3, scale: 1, nullable: true, transformer: decimal })
  jr: number | null;

  @Column({ type: 'decimal', precision: 4, scale: 1, nullable: true, transformer: decimal })
  jrc: number | null;

  @Column({ name: 'jrc_method', type: 'enum', enum: JRC_METHODS, nullable: true })
  jrcMethod: JrcMethod | null;

  @Column({ type: 'varchar', length: 120 })
  infill: string;

  @Column({ type: 'decimal', precision: 4, scale: 2, nullable: true, transformer: decimal })
  ja: number | null;

  @Column({ type: 'enum', enum: JOINT_WATER, nullable: true })
  water: JointWater | null;

  /** Thickness of a fault or shear zone, m */
  @Column({
    name: 'thickness_m',
    type: 'decimal',
    precision: 6,
    scale: 3,
    nullable: true,
    transformer: decimal,
  })
  thicknessM: number | null;

  @Column({ type: 'varchar', length: 500 })
  notes: string;

  /** Where the trace crosses the face, metres right of and above the axis (null: not recorded). */
  @Column({ name: 'face_offset', type: 'json', nullable: true })
  faceOffset: { right: number; up: number } | null;

  /**
   * "Same feature as": the first observation of this persistent feature (a fault, a shear zone, a named
   * joint) on an earlier round of the heading; the API stores the first even when a later one was picked,
   * so the id names the feature across rounds (packages/domain features.ts). No foreign key: the key stays
   * the feature's name even if that first joint is later removed from its draft.
   */
  @Index('IDX_joints_same_as')
  @Column({ name: 'same_as_joint_id', type: 'uuid', nullable: true })
  sameAsJointId: string | null;
}
