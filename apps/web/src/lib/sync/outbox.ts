/**
 * The outbox: requests made on this device that the server has not had yet (a round opened underground),
 * kept in the browser in the order they were made, under the person who made them. Only that person's
 * next sign-in sends them (a different person signing in on the same tablet never does). localStorage,
 * like the drafts; each entry is small (the typing itself stays in the drafts).
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

const PREFIX = 'roundbook.outbox.';

const keyOf = (owner: string) => `${PREFIX}${owner}`;

function readAll(owner: string): OutboxEntry[] {
  try {
    const parsed = JSON.parse(window.localStorage.getItem(keyOf(owner)) ?? '[]') as unknown;
    return Array.isArray(parsed)
      ? (parsed as OutboxEntry[]).filter((e) => typeof e?.id === 'string' && e.owner === owner)
      : [];
  } catch {
    return [];
  }
}

const listeners = new Set<() => void>();
let version = 0;

function writeAll(owner: string, entries: OutboxEntry[]): boolean {
  try {
    if (entries.length === 0) window.localStorage.removeItem(keyOf(owner));
    else window.localStorage.setItem(keyOf(owner), JSON.stringify(entries));
    return true;
  } catch {
    return false;
  } finally {
    version += 1;
    for (const l of listeners) l();
  }
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
    const rest = readAll(entry.owner).filter((e) => e.id !== entry.id);
    return writeAll(entry.owner, [...rest, entry]);
  },
  remove(owner: string, id: string): void {
    writeAll(
      owner,
      readAll(owner).filter((e) => e.id !== id),
    );
  },
  subscribe(listener: () => void): () => void {
    listeners.add(listener);
    return () => listeners.delete(listener);
  },
  /** Changes whenever an entry is added or removed (for useSyncExternalStore). */
  version: () => version,
};
