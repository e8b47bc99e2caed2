import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { PROJECT_ROLES, type ProjectRole } from '../../common/auth/auth-user.js';
import { CreatedAt, UpdatedAt } from '../../common/dto/timestamps.js';
import { User } from '../users/user.entity.js';
import { Project } from './project.entity.js';

/** A person's role in one project (roles are per project). */
@Entity('project_members')
@Index('UQ_project_members_project_user', ['projectId', 'userId'], { unique: true })
export class ProjectMember {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @ManyToOne(() => Project, (p) => p.members, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'project_id' })
  project: Project;

  @Column({ name: 'user_id', type: 'uuid' })
  userId: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user: User;

  @Column({ type: 'enum', enum: PROJECT_ROLES })
  role: ProjectRole;

  @CreatedAt()
  createdAt: Date;

  @UpdatedAt()
  updatedAt: Date;
}
