import Dexie from 'dexie';
import type { Table } from 'dexie';

/**
 * Where this device keeps work the server has not had yet: the drafts (unsaved typing, one row per
 * record) and the outbox (requests made offline), in IndexedDB through Dexie. The sync engine reads and
 * writes synchronously, so the rows are held in memory too: `openDeviceStore` reads them all before the
 * app renders, and every change is written to memory at once and to IndexedDB in the order made.
 *
 * Before IndexedDB the same rows lived in localStorage; the first open moves them here in one
 * transaction, and removes them from localStorage only once that transaction has committed. An
 * interrupted move leaves localStorage as it was (and its rows are still shown); the next open moves
 * again, where a row already here wins when it is newer, so nothing is lost or doubled.
 */

/** A draft row: `id` is the draft's name (`<prefix><record id>`), `value` the draft as written. */
export interface DraftRow {
  id: string;
  value: unknown;
}

/** An outbox row: the entry as the outbox module made it, and its place in the order of requests. */
export interface OutboxRow {
  id: string;
  owner: string;
  seq: number;
  [field: string]: unknown;
}

export const DRAFT_PREFIX_IN_LOCAL_STORAGE = 'roundbook.round-draft.';
export const OUTBOX_PREFIX_IN_LOCAL_STORAGE = 'roundbook.outbox.';

/** Another IndexedDB than the browser's (fake-indexeddb in unit tests). */
export interface IndexedDbEngine {
  indexedDB: IDBFactory;
  IDBKeyRange: typeof IDBKeyRange;
}

class RoundbookDb extends Dexie {
  drafts!: Table<DraftRow, string>;
  outbox!: Table<OutboxRow, string>;

  constructor(name: string, engine?: IndexedDbEngine) {
    super(name, engine);
    // Schema versions: add a new `version(n)` with its upgrade; never change an old one.
    this.version(1).stores({ drafts: 'id', outbox: 'id, owner, seq' });
  }
}

/**
 * memory: not opened (unit tests of the screens), rows kept for this page only; persistent: IndexedDB;
 * unavailable: IndexedDB could not be opened, what localStorage held is shown but nothing new is kept.
 */
export type StoreMode = 'memory' | 'persistent' | 'unavailable';

interface LocalStorageRows {
  drafts: DraftRow[];
  outbox: OutboxRow[];
  /** The localStorage keys these rows came from. */
  keys: string[];
}

function parse(raw: string | null): unknown {
  if (raw === null) return null;
  try {
    return JSON.parse(raw) as unknown;
  } catch {
    return null;
  }
}

const savedAtOf = (value: unknown): number => {
  const at = (value as { savedAt?: unknown } | null)?.savedAt;
  return typeof at === 'number' ? at : 0;
};

/** What the localStorage version kept: drafts under their keys, one array of entries per person. */
export function readLocalStorageRows(storage: Storage): LocalStorageRows {
  const out: LocalStorageRows = { drafts: [], outbox: [], keys: [] };
  let keys: string[];
  try {
    keys = Array.from({ length: storage.length }, (_, i) => storage.key(i)).filter(
      (k): k is string => k !== null,
    );
  } catch {
    return out;
  }
  let seq = 0;
  for (const key of keys) {
    if (key.startsWith(DRAFT_PREFIX_IN_LOCAL_STORAGE)) {
      const value = parse(storage.getItem(key));
      if (typeof value !== 'object' || value === null) continue; // Not a draft: left alone.
      out.drafts.push({ id: key, value });
      out.keys.push(key);
    } else if (key.startsWith(OUTBOX_PREFIX_IN_LOCAL_STORAGE)) {
      const owner = key.slice(OUTBOX_PREFIX_IN_LOCAL_STORAGE.length);
      const entries = parse(storage.getItem(key));
      if (!Array.isArray(entries)) continue;
      for (const entry of entries as Array<Record<string, unknown> | null>) {
        if (typeof entry?.id === 'string' && entry.owner === owner) {
          out.outbox.push({ ...entry, id: entry.id, owner, seq: seq++ });
        }
      }
      out.keys.push(key);
    }
  }
  return out;
}

export class DeviceStore {
  private readonly drafts = new Map<string, unknown>();
  private readonly outbox = new Map<string, OutboxRow>();
  private db: RoundbookDb | null = null;
  private mode: StoreMode = 'memory';
  /** The writes to IndexedDB, one after the other in the order made. */
  private writing: Promise<void> = Promise.resolve();
  private writeFailed = false;
  private nextSeq = 0;
  private storage: Storage | null = null;

  /**
   * Opens IndexedDB, moves what localStorage holds (once), and reads every row. Never rejects: when
   * IndexedDB cannot be used the rows of localStorage are shown and the mode says so.
   */
  async open(
    options: {
      name?: string;
      engine?: IndexedDbEngine;
      storage?: Storage;
      /** Called inside the move's transaction once every row is written (tests interrupt it here). */
      duringMove?: () => void;
    } = {},
  ): Promise<StoreMode> {
    this.close();
    const storage = options.storage ?? window.localStorage;
    this.storage = storage;
    const old = readLocalStorageRows(storage);
    let db: RoundbookDb;
    try {
      db = new RoundbookDb(options.name ?? 'roundbook', options.engine);
      await db.open();
    } catch {
      this.load([], [], old);
      this.mode = 'unavailable';
      return this.mode;
    }
    let moved = false;
    if (old.keys.length > 0) {
      try {
        await db.transaction('rw', db.drafts, db.outbox, async () => {
          const last = await db.outbox.orderBy('seq').last();
          let seq = (last?.seq ?? -1) + 1;
          for (const row of old.drafts) {
            const here = await db.drafts.get(row.id);
            if (here === undefined || savedAtOf(here.value) < savedAtOf(row.value)) await db.drafts.put(row);
          }
          for (const row of old.outbox) {
            if ((await db.outbox.get(row.id)) === undefined) await db.outbox.put({ ...row, seq: seq++ });
          }
          options.duringMove?.();
        });
        moved = true;
      } catch {
        // Interrupted: localStorage keeps everything; its rows are shown below and moved next time.
      }
    }
    if (moved) {
      for (const key of old.keys) {
        try {
          storage.removeItem(key);
        } catch {
          // Left behind: the next open finds the same rows here and keeps the newer.
        }
      }
    }
    const [drafts, outbox] = await Promise.all([db.drafts.toArray(), db.outbox.orderBy('seq').toArray()]);
    this.db = db;
    this.mode = 'persistent';
    this.load(drafts, outbox, moved ? null : old);
    return this.mode;
  }

  /** Closes IndexedDB; the store is empty and in memory until opened again. */
  close(): void {
    this.db?.close();
    this.db = null;
    this.mode = 'memory';
    this.drafts.clear();
    this.outbox.clear();
    this.writing = Promise.resolve();
    this.writeFailed = false;
    this.nextSeq = 0;
  }

  getMode(): StoreMode {
    return this.mode;
  }

  /** Resolves when every change made so far is in IndexedDB (or has failed). */
  written(): Promise<void> {
    return this.writing;
  }

  // --- drafts --------------------------------------------------------------------------------------

  draftIds(): string[] {
    return [...this.drafts.keys()];
  }

  getDraft(id: string): unknown {
    return this.drafts.get(id) ?? null;
  }

  /** False when this device cannot keep it. */
  putDraft(id: string, value: unknown): boolean {
    if (!this.keeps()) return false;
    const copy = structuredClone(value);
    this.drafts.set(id, copy);
    this.persist((db) => db.drafts.put({ id, value: copy }));
    return true;
  }

  deleteDraft(id: string): void {
    if (!this.drafts.delete(id)) return;
    this.persist((db) => db.drafts.delete(id));
    this.forgetInLocalStorage(id);
  }

  // --- outbox --------------------------------------------------------------------------------------

  /** A person's entries in the order they were made. */
  outboxOf(owner: string): OutboxRow[] {
    return [...this.outbox.values()].filter((r) => r.owner === owner).sort((a, b) => a.seq - b.seq);
  }

  /** Adds an entry at the end, or replaces one of the same id in its place; false when not kept. */
  putEntry(entry: { id: string; owner: string; [field: string]: unknown }): boolean {
    if (!this.keeps()) return false;
    const seq = this.outbox.get(entry.id)?.seq ?? this.nextSeq++;
    const row = structuredClone({ ...entry, seq }) as OutboxRow;
    this.outbox.set(row.id, row);
    this.persist((db) => db.outbox.put(row));
    return true;
  }

  deleteEntry(id: string): void {
    const row = this.outbox.get(id);
    if (row === undefined) return;
    this.outbox.delete(id);
    this.persist((db) => db.outbox.delete(id));
    this.forgetInLocalStorage(OUTBOX_PREFIX_IN_LOCAL_STORAGE + row.owner, id);
  }

  // --- inside --------------------------------------------------------------------------------------

  private keeps(): boolean {
    return this.mode === 'memory' || (this.mode === 'persistent' && !this.writeFailed);
  }

  private load(drafts: DraftRow[], outbox: OutboxRow[], leftInLocalStorage: LocalStorageRows | null): void {
    for (const row of drafts) this.drafts.set(row.id, row.value);
    for (const row of outbox) this.outbox.set(row.id, row);
    let seq = outbox.reduce((max, r) => Math.max(max, r.seq + 1), 0);
    // Rows of an interrupted move: shown and sent like the others (a newer row of IndexedDB wins).
    for (const row of leftInLocalStorage?.drafts ?? []) {
      const here = this.drafts.get(row.id);
      if (here === undefined || savedAtOf(here) < savedAtOf(row.value)) this.drafts.set(row.id, row.value);
    }
    for (const row of leftInLocalStorage?.outbox ?? []) {
      if (!this.outbox.has(row.id)) this.outbox.set(row.id, { ...row, seq: seq++ });
    }
    this.nextSeq = seq;
  }

  private persist(write: (db: RoundbookDb) => Promise<unknown>): void {
    const db = this.db;
    if (db === null) return;
    this.writing = this.writing
      .then(() => write(db))
      .then(
        () => undefined,
        () => {
          // Storage full or taken away: said through the next put's answer.
          this.writeFailed = true;
        },
      );
  }

  /** A row sent or cleared is also gone from where an interrupted move left it. */
  private forgetInLocalStorage(key: string, entryId?: string): void {
    const storage = this.storage;
    if (storage === null) return;
    try {
      if (entryId === undefined) {
        storage.removeItem(key);
        return;
      }
      const entries = parse(storage.getItem(key));
      if (!Array.isArray(entries)) return;
      const rest = (entries as Array<{ id?: unknown } | null>).filter((e) => e?.id !== entryId);
      if (rest.length === 0) storage.removeItem(key);
      else storage.setItem(key, JSON.stringify(rest));
    } catch {
      // Nothing there to forget.
    }
  }
}

/** The one store of this page (opened in main.tsx before the app renders). */
export const deviceStore = new DeviceStore();
