import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { PROJECT_ROLES, type ProjectRole } from '../../common/auth/auth-user.js';
import { CreatedAt } from '../../common/dto/timestamps.js';
import { Project } from '../projects/project.entity.js';

/** An invitation to join a project; the link carries a random token, only its SHA-256 is stored. */
@Entity('invitations')
@Index('IDX_invitations_token_hash', ['tokenHash'], { unique: true })
export class Invitation {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'project_id', type: 'uuid' })
  projectId: string;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'project_id' })
  project?: Project;

  @Column({ type: 'varchar', length: 254 })
  email: string;

  @Column({ type: 'varchar', length: 120, default: '' })
  name: string;

  @Column({ type: 'enum', enum: PROJECT_ROLES })
  role: ProjectRole;

  @Column({ name: 'token_hash', type: 'char', length: 64 })
  tokenHash: string;

  @Column({ name: 'expires_at', type: 'datetime', precision: 3 })
  expiresAt: Date;

  @Column({ name: 'invited_by', type: 'uuid' })
  invitedBy: string;

  @Column({ name: 'accepted_at', type: 'datetime', precision: 3, nullable: true })
  acceptedAt: Date | null;

  /** The queued e-mail that carries the current link (notices table); its sent_at says whether it went. */
  @Column({ name: 'notice_id', type: 'uuid', nullable: true })
  noticeId: string | null;

  @CreatedAt()
  createdAt: Date;
}
