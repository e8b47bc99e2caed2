import type { SyncStatus } from '@/lib/sync/autosave';

/**
 * What the always-visible sync bar shows, gathered from every open editor (each reports its engine's
 * state under its record's key) and from the outbox: plain TypeScript, read with useSyncExternalStore.
 */
export interface RecordSyncState {
  status: SyncStatus;
  /** Why the server refused (status 'error'), or null. */
  message: string | null;
  /** The record in words, e.g. "Round 12 · HR-U". */
  label: string;
}

export interface SyncStateSnapshot {
  records: ReadonlyMap<string, RecordSyncState>;
  /** When the server last took a change from this device (ms since epoch), or null. */
  lastSyncedAt: number | null;
  /** The outbox (rounds opened offline) is being sent. */
  sendingOutbox: boolean;
}

const LAST_SYNCED_KEY = 'roundbook.last-synced';

function readLastSynced(): number | null {
  try {
    const n = Number(window.localStorage.getItem(LAST_SYNCED_KEY));
    return Number.isFinite(n) && n > 0 ? n : null;
  } catch {
    return null;
  }
}

export class SyncState {
  private snapshot: SyncStateSnapshot;
  private readonly listeners = new Set<() => void>();
  private readonly retryListeners = new Set<() => void>();

  constructor() {
    this.snapshot = { records: new Map(), lastSyncedAt: readLastSynced(), sendingOutbox: false };
  }

  getSnapshot = (): SyncStateSnapshot => this.snapshot;

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  /** An editor's state (null when it closes). */
  report(key: string, state: RecordSyncState | null): void {
    const current = this.snapshot.records.get(key);
    if (state === null ? current === undefined : JSON.stringify(current) === JSON.stringify(state)) return;
    const records = new Map(this.snapshot.records);
    if (state === null) records.delete(key);
    else records.set(key, state);
    this.set({ ...this.snapshot, records });
  }

  /** Editors that can send at once (the bar's Send now); returns the way to stop listening. */
  onRetry(listener: () => void): () => void {
    this.retryListeners.add(listener);
    return () => this.retryListeners.delete(listener);
  }

  retryAll(): void {
    for (const listener of this.retryListeners) listener();
  }

  sendingOutbox(sending: boolean): void {
    if (this.snapshot.sendingOutbox !== sending) this.set({ ...this.snapshot, sendingOutbox: sending });
  }

  /** The server took a change. */
  synced(at: number = Date.now()): void {
    try {
      window.localStorage.setItem(LAST_SYNCED_KEY, String(at));
    } catch {
      // Shown for this visit only.
    }
    this.set({ ...this.snapshot, lastSyncedAt: at });
  }

  private set(next: SyncStateSnapshot): void {
    this.snapshot = next;
    for (const listener of this.listeners) listener();
  }
}

/** The one sync state of this browser tab. */
export const syncState = new SyncState();
