import { formatProjectTime } from '@roundbook/domain';
import type { VersionDifference } from '@roundbook/ui';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useMemo, useState, useSyncExternalStore } from 'react';
import { getAuditEvents } from '@/api/resources/audit';
import { getRound, roundQueryOptions, roundSaved, saveRound } from '@/api/resources/rounds';
import type { Round, SaveRoundRequest } from '@/features/rounds/api/types';
import type { ChainageInputStyle, RoundFormValues } from '@/features/rounds/schemas/round-form';
import { formValuesOf, saveRequestOf } from '@/features/rounds/schemas/round-form';
import { auditFieldLabel } from '@/features/rounds/utils/conflict-labels';
import { roundDifferences } from '@/features/rounds/utils/differences';
import { sendPendingRound } from '@/features/rounds/utils/offline-round';
import { readSession } from '@/lib/session';
import type { SyncStatus } from '@/lib/sync/autosave';
import { AutosaveEngine } from '@/lib/sync/autosave';
import { adoptLegacyDrafts, localStorageDrafts } from '@/lib/sync/local-draft';
import { syncState } from '@/lib/sync/sync-state';

/**
 * Unsaved typing of rounds, kept on this device until the server has it, under the person who typed it:
 * only their own next sign-in restores and sends it (a different person on the same tablet never does,
 * even after the first one's session ran out underground). `null`: typed while signed out (tests).
 */
export function roundDraftsFor(owner: string | null) {
  const drafts = localStorageDrafts<RoundFormValues>(`${ROUND_DRAFT_PREFIX}${owner ?? 'signed-out'}.`);
  // Drafts of the version before drafts were kept per person go to the first person signed in here.
  if (owner !== null && !legacyAdopted) {
    legacyAdopted = true;
    adoptLegacyDrafts(ROUND_DRAFT_PREFIX, drafts);
  }
  return drafts;
}

const ROUND_DRAFT_PREFIX = 'roundbook.round-draft.';
let legacyAdopted = false;

export type SaveState = SyncStatus;

export interface StaleRound {
  message: string;
  theirs: Round;
  differences: VersionDifference[];
  state: 'choose' | 'loaded' | 'kept';
}

/** How often an open round asks whether another device saved it. */
export const ROUND_POLL_MS = 10_000;

export interface RoundRefresh {
  document: RoundFormValues;
  by: string | null;
  /** The fields the other device changed, in words. */
  fields: string[];
  version: number;
}

/** The round's last change in the audit trail: who, and which fields (by their audit names). */
async function whoChanged(
  projectId: string,
  roundId: string,
): Promise<{ name: string | null; fields: string[] }> {
  try {
    const [last] = await getAuditEvents(projectId, { entityType: 'round', entityId: roundId, limit: 1 });
    if (last === undefined) return { name: null, fields: [] };
    return { name: last.actorName, fields: Object.keys(last.after ?? {}).map(auditFieldLabel) };
  } catch {
    return { name: null, fields: [] };
  }
}

export interface AutosaveOptions {
  projectId: string;
  initial: Round;
  /** The person may edit rounds (geologist); the round's status decides the rest. */
  canEdit: boolean;
  classCode?: (id: string) => string;
  pollMs?: number;
  /** The heading's chainage style: chainage fields open in it (1+254.0), never rounding the stored value. */
  chainage?: ChainageInputStyle;
}

type Payload = Omit<SaveRoundRequest, 'version'>;

const payloadOf = (values: RoundFormValues, fallback: number): Payload => {
  const { version: _version, ...rest } = saveRequestOf(values, 0, fallback);
  return rest;
};

/** A moment in the style of every screen (packages/domain), in this device's zone (no project here). */
const when = (ms: number) =>
  formatProjectTime(new Date(ms), Intl.DateTimeFormat().resolvedOptions().timeZone);

/**
 * The Round editor's side of the autosave engine (`lib/sync`): one engine per open round, the server's
 * record read from the query cache (the engine writes each answer there), and the engine's snapshot
 * turned into what the editor shows. Feed it the form's values with `edit`.
 */
export function useRoundAutosave({
  projectId,
  initial,
  canEdit,
  classCode,
  pollMs = ROUND_POLL_MS,
  chainage: chainageOption,
}: AutosaveOptions) {
  // Fixed when the round opens, like the engine below (the heading's style does not change under a round).
  const [chainage] = useState(chainageOption);
  const queryClient = useQueryClient();
  const roundId = initial.id;
  const fallback = initial.faceChainage;
  const [engine] = useState(
    () =>
      new AutosaveEngine<RoundFormValues, Round>({
        key: roundId,
        server: initial,
        document: formValuesOf(initial, chainage),
        editable: (round) => canEdit && (round.status === 'draft' || round.status === 'returned'),
        toDocument: (round) => formValuesOf(round, chainage),
        payload: (values) => payloadOf(values, fallback),
        save: async (values, version) => {
          // A round opened offline is created first (once; utils/offline-round), then saved on top.
          const owner = readSession()?.user.id;
          const created = owner === undefined ? null : await sendPendingRound(owner, roundId, queryClient);
          return saveRound(projectId, roundId, {
            ...payloadOf(values, fallback),
            version: created?.version ?? version,
          });
        },
        reload: () => getRound(projectId, roundId),
        // Fixed when the round opens: typing after the session ran out still belongs to its person.
        drafts: roundDraftsFor(readSession()?.user.id ?? null),
        scope: { projectId },
        onServerRecord: (round) => {
          syncState.synced();
          void roundSaved(queryClient, projectId, round);
        },
      }),
  );
  const sync = useSyncExternalStore(engine.subscribe, engine.getSnapshot);
  // The record as the server has it: the one cache entry of this round (seeded when opened alone).
  const { data: server } = useQuery({ ...roundQueryOptions(projectId, roundId), initialData: initial });

  useEffect(() => {
    engine.start();
    const online = () => engine.retryNow();
    window.addEventListener('online', online);
    const offRetry = syncState.onRetry(() => void engine.flush());
    return () => {
      offRetry();
      window.removeEventListener('online', online);
      engine.stop();
    };
  }, [engine]);

  // Other devices: while the round is on screen, visible and online, ask the server for it every 10 s; when
  // its version has moved on, take it (nothing unsaved here) or show the conflict (typing kept), and say who.
  const [refreshed, setRefreshed] = useState<RoundRefresh | null>(null);
  const [changedBy, setChangedBy] = useState<string | null>(null);
  useEffect(() => {
    let busy = false;
    const tick = async () => {
      if (busy || document.visibilityState !== 'visible' || !navigator.onLine) return;
      busy = true;
      try {
        const theirs = await getRound(projectId, roundId);
        const outcome = engine.serverMoved(theirs);
        if (outcome === 'ignored') return;
        const who = await whoChanged(projectId, roundId);
        setChangedBy(who.name);
        if (outcome === 'refreshed')
          setRefreshed({
            document: engine.document(),
            by: who.name,
            fields: who.fields,
            version: theirs.version,
          });
      } catch {
        // Not reachable or refused: the next tick asks again (the sync bar shows the connection).
      } finally {
        busy = false;
      }
    };
    const id = setInterval(() => void tick(), pollMs);
    return () => clearInterval(id);
  }, [engine, projectId, roundId, pollMs]);

  // The always-visible sync bar (app shell) shows this round's state wherever the person has scrolled.
  const label = `Round ${initial.roundNumber}`;
  useEffect(() => {
    syncState.report(roundId, { status: sync.status, message: sync.error?.message ?? null, label });
  }, [roundId, sync.status, sync.error, label]);
  useEffect(() => () => syncState.report(roundId, null), [roundId]);

  const stale = useMemo<StaleRound | null>(() => {
    const conflict = sync.conflict;
    if (conflict === null) return null;
    return {
      message: conflict.message ?? 'Someone saved this round after your typing began. Compare and choose.',
      theirs: conflict.theirs,
      differences: roundDifferences(
        payloadOf(conflict.mine, fallback),
        payloadOf(formValuesOf(conflict.theirs, chainage), fallback),
        classCode,
      ),
      state: conflict.state,
    };
  }, [sync.conflict, fallback, classCode, chainage]);

  /** The conflict as form values, for the field-by-field merge (features/rounds/components/conflict-view). */
  const conflict = useMemo(() => {
    const c = sync.conflict;
    if (c === null) return null;
    return {
      message: c.message ?? 'Someone saved this round after your typing began.',
      base: c.base,
      mine: c.mine,
      theirs: formValuesOf(c.theirs, chainage),
      theirRound: c.theirs,
      state: c.state,
    };
  }, [sync.conflict, chainage]);

  const restored =
    sync.restored === null
      ? null
      : sync.restored.kind === 'restore'
        ? `Your typing from ${when(sync.restored.savedAt)} was not on the server yet. It has been restored from this device and is being saved now.`
        : `Your typing from ${when(sync.restored.savedAt)} was restored from this device, but the round was saved again since then.`;

  return {
    server,
    /** The round was refreshed from another device's save: put `document` into the form. */
    refreshed,
    dismissRefreshed: () => setRefreshed(null),
    /** Who saved the version that moved on (from the audit trail), when known. */
    changedBy,
    state: sync.status,
    /** Why the last save was refused (with state 'error'). */
    message: sync.error?.message ?? null,
    invalid: sync.error?.invalid ?? false,
    fieldErrors: sync.error?.fields ?? {},
    stale,
    conflict,
    restored,
    /** The form's values when the editor opens (a draft restored from this device, or the server's). */
    initialValues: engine.document(),
    edit: engine.edit,
    dismissRestored: engine.dismissRestored,
    version: () => engine.getSnapshot().version,
    /** Send now (section change, before submit); resolves when the server has answered. */
    flush: engine.flush,
    /** Keep my typing and save it on top of their version. */
    keepMine: engine.keepMine,
    /** Their version for the form; my typing is dropped. Null when there is nothing to load. */
    takeTheirs: engine.takeTheirs,
    /** Save a merge of both versions on top of theirs; returns the document for the form. */
    resolve: engine.resolve,
    dismissStale: engine.dismissConflict,
    /** After submit, the server's answer becomes the base. */
    accept: engine.accept,
  };
}

export type RoundAutosave = ReturnType<typeof useRoundAutosave>;
