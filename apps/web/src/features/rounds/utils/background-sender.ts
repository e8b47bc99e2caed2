import type { QueryClient } from '@tanstack/react-query';
import { roundSaved, saveRound } from '@/api/resources/rounds';
import type { Round, SaveRoundRequest } from '@/features/rounds/api/types';
import { roundDraftsFor } from '@/features/rounds/hooks/use-round-autosave';
import { chainageOf, formValuesOf, saveRequestOf } from '@/features/rounds/schemas/round-form';
import { sendPendingRound, sendPendingRounds } from '@/features/rounds/utils/offline-round';
import { isApiError } from '@/lib/api-client';
import { STALE_VERSION_CODE } from '@/lib/form-errors';
import { readSession } from '@/lib/session';

/**
 * The app shell's one sender (field mode, issue 17): when the connection is back it sends what waits on
 * this device for the signed-in person, also for rounds no longer on screen. Per round, in order: the
 * round opened offline is created (its own id: a retry finds the same round), then its typing is saved
 * on the version it started from. Rounds open in an editor are left to that editor's engine. It stops as
 * soon as someone else is signed in (their session never sends the first person's work), and at the first
 * request that cannot reach the server (the rest waits for the next try, in order).
 */
export interface SendResult {
  /** Requests the server took. */
  sent: number;
  /** Rounds whose typing the server refused or that someone saved meanwhile: left for their editor. */
  leftForEditor: string[];
}

const sameContent = (a: SaveRoundRequest, b: SaveRoundRequest) =>
  JSON.stringify({ ...a, version: 0 }) === JSON.stringify({ ...b, version: 0 });

export async function sendWaitingRounds(
  owner: string,
  options: { queryClient?: QueryClient; isOpen?: (roundId: string) => boolean } = {},
): Promise<SendResult> {
  const { queryClient, isOpen = () => false } = options;
  const stillSignedIn = () => readSession()?.user.id === owner;
  const result: SendResult = { sent: 0, leftForEditor: [] };
  if (!stillSignedIn()) return result;

  // Rounds opened offline first, oldest first (a save of such a round needs it created).
  result.sent += await sendPendingRounds(owner, queryClient);

  const drafts = roundDraftsFor(owner);
  for (const roundId of drafts.keys()) {
    if (!stillSignedIn()) break;
    if (isOpen(roundId)) continue;
    const draft = drafts.read(roundId);
    const projectId = draft?.scope?.projectId;
    // Drafts written before they named their project wait for their editor.
    if (draft === null || projectId === undefined) continue;
    const fallback =
      chainageOf(draft.baseValues?.faceChainage ?? '') ?? chainageOf(draft.values.faceChainage);
    if (fallback === null) {
      result.leftForEditor.push(roundId);
      continue;
    }
    const created = await sendPendingRound(owner, roundId, queryClient);
    const body = saveRequestOf(draft.values, created?.version ?? draft.baseVersion, fallback);
    try {
      const saved = await saveRound(projectId, roundId, body);
      // Typing may have gone on meanwhile (the round opened again): only the draft that was sent goes.
      if (drafts.read(roundId)?.savedAt === draft.savedAt) drafts.clear(roundId);
      result.sent += 1;
      if (queryClient !== undefined) await roundSaved(queryClient, projectId, saved, { waitForLists: false });
    } catch (error) {
      if (!isApiError(error) || error.status === 0 || error.status >= 500) throw error;
      // A retry whose first try had landed (its answer lost): the server holds exactly this typing.
      const current =
        error.code === STALE_VERSION_CODE ? (error.details?.current as Round | undefined) : undefined;
      if (current !== undefined && sameContent(saveRequestOf(formValuesOf(current), 0, fallback), body)) {
        if (drafts.read(roundId)?.savedAt === draft.savedAt) drafts.clear(roundId);
        if (queryClient !== undefined)
          await roundSaved(queryClient, projectId, current, { waitForLists: false });
        continue;
      }
      // 409 (saved elsewhere since), 400 (refused), 403 (submitted meanwhile): the editor shows both sides
      // or the reason when the round is opened; the typing stays on this device.
      result.leftForEditor.push(roundId);
    }
  }
  return result;
}
