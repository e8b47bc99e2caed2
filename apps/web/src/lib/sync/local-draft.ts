/**
 * Unsaved typing kept in the browser until the server has it (it survives a reload or a dropped
 * connection), one entry per record, with the server version the typing started from. localStorage
 * for now; the same interface can sit on IndexedDB later.
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
}

export interface DraftStore<D> {
  read(key: string): LocalDraft<D> | null;
  /** False when the browser refused (storage full or switched off). */
  write(draft: LocalDraft<D>): boolean;
  clear(key: string): void;
}

export interface LocalStorageDrafts<D> extends DraftStore<D> {
  /** The localStorage key of a record's draft. */
  storageKey(key: string): string;
  /** The records that have a draft here. */
  keys(): string[];
}

/** Drafts in `window.localStorage` under `<prefix><key>`. */
export function localStorageDrafts<D>(prefix: string): LocalStorageDrafts<D> {
  const storageKey = (key: string) => `${prefix}${key}`;
  return {
    storageKey,
    keys() {
      const out: string[] = [];
      try {
        for (let i = 0; i < window.localStorage.length; i++) {
          const k = window.localStorage.key(i);
          if (k !== null && k.startsWith(prefix)) out.push(k.slice(prefix.length));
        }
      } catch {
        // No storage: nothing kept.
      }
      return out;
    },
    read(key) {
      try {
        const raw = window.localStorage.getItem(storageKey(key));
        if (raw === null) return null;
        const parsed = JSON.parse(raw) as Partial<LocalDraft<D>> & { roundId?: unknown };
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
        };
      } catch {
        return null;
      }
    },
    write(draft) {
      try {
        window.localStorage.setItem(storageKey(draft.key), JSON.stringify(draft));
        return true;
      } catch {
        return false;
      }
    },
    clear(key) {
      try {
        window.localStorage.removeItem(storageKey(key));
      } catch {
        // Nothing kept, nothing to clear.
      }
    },
  };
}
