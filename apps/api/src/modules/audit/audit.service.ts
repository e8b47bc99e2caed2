import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { AuditEvent } from './audit-event.entity.js';

export interface AuditEntry {
  projectId: string | null;
  actorId: string | null;
  entityType: string;
  entityId: string;
  action: string;
  before?: Record<string, unknown> | null;
  after?: Record<string, unknown> | null;
}

/** Writes audit events inside the caller's transaction, so a change and its record land together. */
@Injectable()
export class AuditService {
  async record(manager: EntityManager, entry: AuditEntry): Promise<void> {
    const event = manager.create(AuditEvent, {
      projectId: entry.projectId,
      actorId: entry.actorId,
      entityType: entry.entityType,
      entityId: entry.entityId,
      action: entry.action,
      before: entry.before ?? null,
      after: entry.after ?? null,
    });
    await manager.save(event);
  }
}
