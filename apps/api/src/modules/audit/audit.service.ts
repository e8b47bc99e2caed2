import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { coalesceChanges } from './audit-diff.js';
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

/** Autosaves of one person within this time, with nothing else between them, are one audit event. */
export const COALESCE_WINDOW_MS = 10 * 60 * 1000;

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

  /**
   * Records a change that autosave repeats every few seconds: when the entity's latest event is the same
   * action by the same person less than COALESCE_WINDOW_MS ago, that event grows to cover this change too
   * (before: as it was before the run; after: as it is now) instead of a new copy per keystroke pause. The
   * caller holds the entity's row lock, so runs of one entity never interleave.
   */
  async recordCoalesced(
    manager: EntityManager,
    entry: AuditEntry,
    nested: ReadonlyArray<string> = [],
    now: Date = new Date(),
  ): Promise<void> {
    const last = await manager.findOne(AuditEvent, {
      where: { entityType: entry.entityType, entityId: entry.entityId },
      order: { createdAt: 'DESC', id: 'DESC' },
    });
    const recent =
      last !== null &&
      last.action === entry.action &&
      last.actorId === entry.actorId &&
      now.getTime() - (last.lastAt ?? last.createdAt).getTime() < COALESCE_WINDOW_MS;
    if (!recent) return this.record(manager, entry);
    const merged = coalesceChanges(
      { before: last.before ?? {}, after: last.after ?? {} },
      { before: entry.before ?? {}, after: entry.after ?? {} },
      nested,
    );
    Object.assign(last, {
      before: merged.before,
      after: merged.after,
      lastAt: now,
      coalesced: last.coalesced + 1,
    });
    await manager.save(last);
  }
}
