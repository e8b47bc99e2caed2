import {
  CHAINAGE_SENSE_CODES,
  CHAINAGE_STYLES,
  PROFILE_SHAPES,
  STAGES,
  type AlignmentSegmentRecord,
  type ChainageSenseCode,
} from '@roundbook/domain';
import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { decimal } from '../../common/dto/numeric.transformer.js';
import { CreatedAt, UpdatedAt, Version } from '../../common/dto/timestamps.js';
import { Project } from '../projects/project.entity.js';

export { CHAINAGE_SENSE_CODES, CHAINAGE_STYLES, PROFILE_SHAPES };
export type ProfileShape = (typeof PROFILE_SHAPES)[number];
export type ChainageStyle = (typeof CHAINAGE_STYLES)[number];

export { STAGES };
export type Stage = (typeof STAGES)[number];

/** One heading (a face advancing along an alignment) with its drive and excavation profile. */
@Entity('headings')
@Index('UQ_headings_project_code', ['projectId', 'code'], { unique: true })
export class Heading {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @ManyToOne(() => Project, (p) => p.headings, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'project_id' })
  project: Project;

  @Column({ type: 'varchar', length: 20 })
  code: string;

  @Column({ type: 'varchar', length: 160 })
  name: string;

  /** Chainage of the heading's start, metres. */
  @Column({ name: 'start_chainage', type: 'decimal', precision: 12, scale: 3, transformer: decimal })
  startChainage: number;

  /** How chainages of this heading are written: 'km+m' (1+250.0) or plain metres (1250.0). */
  @Column({ name: 'chainage_style', type: 'enum', enum: CHAINAGE_STYLES, default: 'km+m' })
  chainageStyle: ChainageStyle;

  /** Decimals shown in chainages (0–3). */
  @Column({ name: 'chainage_decimals', type: 'tinyint', default: 1 })
  chainageDecimals: number;

  /** Drive direction (trend of the axis in the direction of advance), degrees from north. */
  @Column({ name: 'drive_trend', type: 'decimal', precision: 6, scale: 2, transformer: decimal })
  driveTrend: number;

  /** Gradient in per cent, positive rising in the direction of advance. */
  @Column({ name: 'gradient_percent', type: 'decimal', precision: 7, scale: 3, transformer: decimal })
  gradientPercent: number;

  @Column({ name: 'profile_shape', type: 'enum', enum: PROFILE_SHAPES })
  profileShape: ProfileShape;

  @Column({ name: 'profile_width', type: 'decimal', precision: 6, scale: 2, transformer: decimal })
  profileWidth: number;

  @Column({ name: 'profile_height', type: 'decimal', precision: 6, scale: 2, transformer: decimal })
  profileHeight: number;

  /** Height of the tunnel axis above the invert, metres. */
  @Column({ name: 'axis_height', type: 'decimal', precision: 6, scale: 2, transformer: decimal })
  axisHeight: number;

  @Column({ type: 'simple-array' })
  stages: Stage[];

  @Column({ name: 'planned_round_length', type: 'decimal', precision: 5, scale: 2, transformer: decimal })
  plannedRoundLength: number;

  /** Optional start coordinates in the project's grid (metres). */
  @Column({
    name: 'start_easting',
    type: 'decimal',
    precision: 12,
    scale: 3,
    nullable: true,
    transformer: decimal,
  })
  startEasting: number | null;

  @Column({
    name: 'start_northing',
    type: 'decimal',
    precision: 12,
    scale: 3,
    nullable: true,
    transformer: decimal,
  })
  startNorthing: number | null;

  @Column({
    name: 'start_elevation',
    type: 'decimal',
    precision: 9,
    scale: 3,
    nullable: true,
    transformer: decimal,
  })
  startElevation: number | null;

  /** Whether chainage increases or decreases in the drive direction (a heading driven against the chainage). */
  @Column({ name: 'chainage_sense', type: 'enum', enum: CHAINAGE_SENSE_CODES, default: 'increasing' })
  chainageSense: ChainageSenseCode;

  /** Drive bearing at the start when it differs from the drive trend (null: the drive trend). */
  @Column({
    name: 'initial_bearing',
    type: 'decimal',
    precision: 6,
    scale: 2,
    nullable: true,
    transformer: decimal,
  })
  initialBearing: number | null;

  /** The alignment from the start: straights and circular arcs, then straight on (empty: one straight). */
  @Column({ name: 'alignment_segments', type: 'json', nullable: true })
  alignmentSegments: AlignmentSegmentRecord[] | null;

  /** Top of the bench (floor of the top heading), metres above the invert; null: at the axis. */
  @Column({
    name: 'bench_height',
    type: 'decimal',
    precision: 6,
    scale: 2,
    nullable: true,
    transformer: decimal,
  })
  benchHeight: number | null;

  @CreatedAt()
  createdAt: Date;

  @UpdatedAt()
  updatedAt: Date;

  @Version()
  version: number;
}
