import { deviceStore } from '@/lib/sync/device-store';

/**
 * The outbox: requests made on this device that the server has not had yet (a round opened underground),
 * kept in the browser in the order they were made, under the person who made them. Only that person's
 * next sign-in sends them (a different person signing in on the same tablet never does). Kept in the
 * device store (IndexedDB) like the drafts; each entry is small (the typing itself stays in the drafts).
 */

export interface OutboxEntry<P = unknown> {
  /** The id of the record the request creates (a client-made UUID: a retried create finds it). */
  id: string;
  kind: string;
  /** Who made it (user id); only their session sends it. */
  owner: string;
  createdAt: number;
  payload: P;
}

function readAll(owner: string): OutboxEntry[] {
  return deviceStore.outboxOf(owner).map(({ seq: _seq, ...entry }) => entry as unknown as OutboxEntry);
}

const listeners = new Set<() => void>();
let version = 0;

function changed(kept: boolean): boolean {
  version += 1;
  for (const l of listeners) l();
  return kept;
}

export const outbox = {
  /** The person's entries, oldest first. */
  list<P>(owner: string, kind?: string): OutboxEntry<P>[] {
    return readAll(owner).filter((e) => kind === undefined || e.kind === kind) as OutboxEntry<P>[];
  },
  find<P>(owner: string, id: string): OutboxEntry<P> | null {
    return (readAll(owner).find((e) => e.id === id) as OutboxEntry<P> | undefined) ?? null;
  },
  /** Adds (or replaces, same id) an entry; false when the browser refused to keep it. */
  put<P>(entry: OutboxEntry<P>): boolean {
    let kept: boolean;
    try {
      kept = deviceStore.putEntry({ ...entry });
    } catch {
      kept = false; // Not cloneable: not kept.
    }
    return changed(kept);
  },
  remove(owner: string, id: string): void {
    if (deviceStore.outboxOf(owner).some((e) => e.id === id)) deviceStore.deleteEntry(id);
    changed(true);
  },
  subscribe(listener: () => void): () => void {
    listeners.add(listener);
    return () => listeners.delete(listener);
  },
  /** Changes whenever an entry is added or removed (for useSyncExternalStore). */
  version: () => version,
};
