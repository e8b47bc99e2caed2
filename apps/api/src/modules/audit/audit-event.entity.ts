import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import { CreatedAt } from '../../common/dto/timestamps.js';

/**
 * Who changed what, when, before → after. Never deleted; the one update is an autosave run growing its own
 * event (AuditService.recordCoalesced): `lastAt` is its latest change and `coalesced` how many saves it holds.
 */
@Entity('audit_events')
@Index('IDX_audit_events_project_at', ['projectId', 'createdAt'])
@Index('IDX_audit_events_entity_at', ['entityType', 'entityId', 'createdAt'])
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

  /** The latest change folded into this event (autosave runs); null for a single change */
  @Column({ name: 'last_at', type: 'datetime', precision: 3, nullable: true })
  lastAt: Date | null;

  /** How many further saves were folded into this event */
  @Column({ type: 'int', default: 0 })
  coalesced: number;
}
