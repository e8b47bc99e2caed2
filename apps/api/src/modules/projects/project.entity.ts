import { PLANE_NOTATIONS } from '@roundbook/domain';
import { Column, Entity, OneToMany, PrimaryGeneratedColumn } from 'typeorm';
import { CreatedAt, UpdatedAt, Version } from '../../common/dto/timestamps.js';
import type { Heading } from '../headings/heading.entity.js';
import type { ProjectMember } from './project-member.entity.js';

export { PLANE_NOTATIONS };
export type PlaneNotationSetting = (typeof PLANE_NOTATIONS)[number];

/** Q parameter tables the project follows; one edition is encoded so far. */
export const Q_TABLE_EDITIONS = ['2015'] as const;
export type QTableEdition = (typeof Q_TABLE_EDITIONS)[number];

@Entity('projects')
export class Project {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'varchar', length: 20, unique: true })
  code: string;

  @Column({ type: 'varchar', length: 160 })
  name: string;

  @Column({ type: 'varchar', length: 160, default: '' })
  client: string;

  /** IANA time zone; shift dates follow it. */
  @Column({ name: 'time_zone', type: 'varchar', length: 64, default: 'UTC' })
  timeZone: string;

  @Column({ name: 'q_table_edition', type: 'varchar', length: 40, default: '2015' })
  qTableEdition: QTableEdition;

  @Column({ name: 'default_notation', type: 'varchar', length: 24, default: 'dip-direction/dip' })
  defaultNotation: PlaneNotationSetting;

  /** The scale for weathering and strength grades: ISRM or ISO 14689 (one per project, no mixing). */
  @Column({ name: 'ground_scale', type: 'varchar', length: 12, default: 'isrm' })
  groundScale: 'isrm' | 'iso-14689';

  /** E-mail addresses that receive every handover of the project. */
  @Column({ name: 'distribution_list', type: 'json' })
  distributionList: string[];

  /**
   * Minutes the incoming supervisor has to acknowledge a handover before it is flagged overdue and the
   * outgoing supervisor and the engineers are told (60 by default: our choice, not a published figure).
   */
  @Column({ name: 'handover_ack_minutes', type: 'int', default: 60 })
  handoverAckMinutes: number;

  /** Name of the project's coordinate grid, for heading start coordinates. */
  @Column({ name: 'coordinate_grid', type: 'varchar', length: 120, default: '' })
  coordinateGrid: string;

  /** Separation of duties: whoever mapped a round may not confirm it, even as an engineer (on by default). */
  @Column({ name: 'separation_of_duties', type: 'boolean', default: true })
  separationOfDuties: boolean;

  @OneToMany('Heading', (h: Heading) => h.project)
  headings: Heading[];

  @OneToMany('ProjectMember', (m: ProjectMember) => m.project)
  members: ProjectMember[];

  @CreatedAt()
  createdAt: Date;

  @UpdatedAt()
  updatedAt: Date;

  @Version()
  version: number;
}
