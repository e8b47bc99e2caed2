import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { UpdatedAt } from '../../common/dto/timestamps.js';
import { Project } from '../projects/project.entity.js';
import { User } from '../users/user.entity.js';

/**
 * One person's choice of review notices in one project. No row means every notice is on (the default);
 * red notices have no column: they are always sent.
 */
@Entity('notice_preferences')
@Index('IDX_notice_preferences_project', ['projectId'])
export class NoticePreference {
  @PrimaryColumn({ name: 'user_id', type: 'uuid' })
  userId: string;

  @PrimaryColumn({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'FK_notice_preferences_user' })
  user?: User;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'project_id', foreignKeyConstraintName: 'FK_notice_preferences_project' })
  project?: Project;

  @Column({ type: 'boolean', default: true })
  submitted: boolean;

  @Column({ name: 'rule_overdue', type: 'boolean', default: true })
  ruleOverdue: boolean;

  @Column({ type: 'boolean', default: true })
  returned: boolean;

  @Column({ name: 'confirmed_other_class', type: 'boolean', default: true })
  confirmedOtherClass: boolean;

  @UpdatedAt()
  updatedAt: Date;
}
