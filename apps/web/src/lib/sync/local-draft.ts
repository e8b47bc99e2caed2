import { deviceStore } from '@/lib/sync/device-store';

/**
 * Unsaved typing kept in the browser until the server has it (it survives a reload or a dropped
 * connection), one entry per record, with the server version the typing started from. Kept in the
 * device store (IndexedDB, `device-store.ts`); the reads and writes stay synchronous for the engine.
 */

export interface LocalDraft<D> {
  /** The record's id (a round id). */
  key: string;
  /** The server version the typing started from. */
  baseVersion: number;
  /** When the typing was last changed (ms since epoch). */
  savedAt: number;
  values: D;
  /** The document as the server had it at `baseVersion` (for a field-by-field merge); absent in old drafts. */
  baseValues?: D;
  /** Where the record lives (e.g. its project), so it can be sent with its editor closed. */
  scope?: Record<string, string>;
}

export interface DraftStore<D> {
  read(key: string): LocalDraft<D> | null;
  /** False when the browser refused (storage full or switched off). */
  write(draft: LocalDraft<D>): boolean;
  clear(key: string): void;
}

export interface LocalStorageDrafts<D> extends DraftStore<D> {
  /** The name of a record's draft in the device store (the localStorage key of earlier versions). */
  storageKey(key: string): string;
  /** The records that have a draft here. */
  keys(): string[];
}

/** Drafts in the device store under `<prefix><key>` (the name keeps the localStorage key it had). */
export function localStorageDrafts<D>(prefix: string): LocalStorageDrafts<D> {
  const storageKey = (key: string) => `${prefix}${key}`;
  return {
    storageKey,
    keys() {
      return deviceStore
        .draftIds()
        .filter((k) => k.startsWith(prefix))
        .map((k) => k.slice(prefix.length));
    },
    read(key) {
      try {
        const stored = deviceStore.getDraft(storageKey(key));
        if (typeof stored !== 'object' || stored === null) return null;
        const parsed = stored as Partial<LocalDraft<D>> & { roundId?: unknown };
        // Drafts written before the engine moved here name their record `roundId`.
        const owner = parsed.key ?? parsed.roundId;
        if (owner !== key || typeof parsed.baseVersion !== 'number' || typeof parsed.values !== 'object') {
          return null;
        }
        return {
          key,
          baseVersion: parsed.baseVersion,
          savedAt: typeof parsed.savedAt === 'number' ? parsed.savedAt : 0,
          values: parsed.values as D,
          ...(typeof parsed.baseValues === 'object' && parsed.baseValues !== null
            ? { baseValues: parsed.baseValues }
            : {}),
          ...(typeof parsed.scope === 'object' && parsed.scope !== null ? { scope: parsed.scope } : {}),
        };
      } catch {
        return null;
      }
    },
    write(draft) {
      try {
        return deviceStore.putDraft(storageKey(draft.key), draft);
      } catch {
        return false; // Not cloneable: not kept.
      }
    },
    clear(key) {
      deviceStore.deleteDraft(storageKey(key));
    },
  };
}

/**
 * Drafts written before they were kept per person sit under `<legacyPrefix><recordId>` and name their
 * record `roundId`. That version restored them to whoever opened the round next, so they go, once, to
 * the person signed in now: moved under `<prefix><recordId>` (a newer draft already there wins) and the
 * old key removed. Returns the records moved.
 */
export function adoptLegacyDrafts<D>(legacyPrefix: string, into: LocalStorageDrafts<D>): string[] {
  const moved: string[] = [];
  // Old names end in the bare record id (a UUID has no dots); per-person names have `<owner>.` first.
  const legacyIds = deviceStore
    .draftIds()
    .filter((k) => k.startsWith(legacyPrefix) && !k.slice(legacyPrefix.length).includes('.'));
  const old = localStorageDrafts<D>(legacyPrefix);
  for (const id of legacyIds) {
    const key = id.slice(legacyPrefix.length);
    const draft = old.read(key);
    if (draft === null) continue; // Not a draft of ours: left alone.
    const current = into.read(key);
    if ((current === null || current.savedAt < draft.savedAt) && !into.write(draft)) {
      continue; // Not kept: the old one stays and is tried again next time.
    }
    old.clear(key);
    moved.push(key);
  }
  return moved;
}
