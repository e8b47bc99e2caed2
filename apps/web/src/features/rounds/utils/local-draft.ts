import type { RoundFormValues } from '@/features/rounds/schemas/round-form';

/**
 * The unsaved typing of a round, kept in the browser until the server has it (survives a reload or a
 * dropped connection). Keyed by round id, with the version the typing was based on.
 */
export interface LocalDraft {
  roundId: string;
  /** The server version the typing started from. */
  baseVersion: number;
  /** When the typing was last changed (ms since epoch). */
  savedAt: number;
  values: RoundFormValues;
}

const PREFIX = 'roundbook.round-draft.';

export function localDraftKey(roundId: string): string {
  return `${PREFIX}${roundId}`;
}

export function readLocalDraft(roundId: string): LocalDraft | null {
  try {
    const raw = window.localStorage.getItem(localDraftKey(roundId));
    if (raw === null) return null;
    const parsed = JSON.parse(raw) as Partial<LocalDraft>;
    if (
      parsed.roundId !== roundId ||
      typeof parsed.baseVersion !== 'number' ||
      typeof parsed.values !== 'object'
    ) {
      return null;
    }
    return parsed as LocalDraft;
  } catch {
    return null;
  }
}

export function writeLocalDraft(draft: LocalDraft): boolean {
  try {
    window.localStorage.setItem(localDraftKey(draft.roundId), JSON.stringify(draft));
    return true;
  } catch {
    return false;
  }
}

export function clearLocalDraft(roundId: string): void {
  try {
    window.localStorage.removeItem(localDraftKey(roundId));
  } catch {
    // Nothing kept, nothing to clear.
  }
}
