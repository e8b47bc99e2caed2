import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import { CreatedAt } from '../../common/dto/timestamps.js';

/** Who changed what, when, before → after. Never updated, never deleted. */
@Entity('audit_events')
@Index('IDX_audit_events_project_at', ['projectId', 'createdAt'])
export class AuditEvent {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'project_id', type: 'uuid', nullable: true })
  projectId: string | null;

  @Column({ name: 'actor_id', type: 'uuid', nullable: true })
  actorId: string | null;

  @Column({ name: 'entity_type', type: 'varchar', length: 40 })
  entityType: string;

  @Column({ name: 'entity_id', type: 'uuid' })
  entityId: string;

  @Column({ type: 'varchar', length: 40 })
  action: string;

  @Column({ type: 'json', nullable: true })
  before: Record<string, unknown> | null;

  @Column({ type: 'json', nullable: true })
  after: Record<string, unknown> | null;

  @CreatedAt()
  createdAt: Date;
}
