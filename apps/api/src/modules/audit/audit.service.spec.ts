import type { EntityManager } from 'typeorm';
import { coalesceChanges, objectDiff } from './audit-diff';
import type { AuditEvent } from './audit-event.entity';
import { AuditService, COALESCE_WINDOW_MS } from './audit.service';

/** A stand-in for the transaction's manager: keeps events in a list (the real one is tested in e2e). */
function fakeManager() {
  const rows: AuditEvent[] = [];
  let n = 0;
  const manager = {
    create: (_: unknown, v: Partial<AuditEvent>) => ({ ...v }) as AuditEvent,
    save: (e: AuditEvent) => {
      if (!e.id) {
        Object.assign(e, { id: `e${++n}`, createdAt: clock.now, lastAt: null, coalesced: 0 });
        rows.push(e);
      }
      return Promise.resolve(e);
    },
    findOne: () => Promise.resolve(rows.at(-1) ?? null),
  } as unknown as EntityManager;
  const clock = { now: new Date('2026-12-02T08:00:00Z') };
  return { manager, rows, clock };
}

const entry = (actorId: string, before: Record<string, unknown>, after: Record<string, unknown>) => ({
  projectId: 'p',
  actorId,
  entityType: 'round',
  entityId: 'r',
  action: 'save',
  before,
  after,
});

describe('audit: changes, not copies; autosave runs as one event', () => {
  it('objectDiff keeps only the keys that differ', () => {
    expect(objectDiff({ a: 1, b: 2, c: [1] }, { a: 1, b: 3, c: [1], d: 'x' })).toEqual({
      before: { b: 2, d: null },
      after: { b: 3, d: 'x' },
    });
  });

  it('coalesceChanges: before of the first, after of the second, one level down for nested keys', () => {
    const merged = coalesceChanges(
      { before: { shift: 'day', ground: { notes: '' } }, after: { shift: 'night', ground: { notes: 'a' } } },
      { before: { ground: { notes: 'a', inflowLpm: 2 } }, after: { ground: { notes: 'b', inflowLpm: 5 } } },
      ['ground'],
    );
    expect(merged).toEqual({
      before: { shift: 'day', ground: { notes: '', inflowLpm: 2 } },
      after: { shift: 'night', ground: { notes: 'b', inflowLpm: 5 } },
    });
  });

  it('coalesceChanges: a value typed and then put back drops out', () => {
    const merged = coalesceChanges(
      { before: { shift: 'day', ground: { notes: '' } }, after: { shift: 'night', ground: { notes: 'x' } } },
      { before: { shift: 'night', ground: { notes: 'x' } }, after: { shift: 'day', ground: { notes: '' } } },
      ['ground'],
    );
    expect(merged).toEqual({ before: {}, after: {} });
  });

  it('same person within the window → one event; after the window, or another person → a new one', async () => {
    const { manager, rows, clock } = fakeManager();
    const audit = new AuditService();
    await audit.recordCoalesced(manager, entry('geo', { notes: '' }, { notes: 'a' }), [], clock.now);
    clock.now = new Date(clock.now.getTime() + 60_000);
    await audit.recordCoalesced(manager, entry('geo', { notes: 'a' }, { notes: 'ab' }), [], clock.now);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ before: { notes: '' }, after: { notes: 'ab' }, coalesced: 1 });
    // the window runs from the run's last save, so a steady autosave stays one event
    clock.now = new Date(clock.now.getTime() + COALESCE_WINDOW_MS - 1);
    await audit.recordCoalesced(manager, entry('geo', { notes: 'ab' }, { notes: 'abc' }), [], clock.now);
    expect(rows).toHaveLength(1);
    clock.now = new Date(clock.now.getTime() + COALESCE_WINDOW_MS);
    await audit.recordCoalesced(manager, entry('geo', { notes: 'abc' }, { notes: 'abcd' }), [], clock.now);
    expect(rows).toHaveLength(2);
    await audit.recordCoalesced(manager, entry('other', { notes: 'abcd' }, { notes: 'e' }), [], clock.now);
    expect(rows).toHaveLength(3);
    expect(rows[2]).toMatchObject({ actorId: 'other', coalesced: 0 });
  });
});
