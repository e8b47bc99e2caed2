import type { VersionDifference } from '@roundbook/ui';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState } from 'react';
import { getRound } from '@/features/rounds/api/get-round';
import { roundKeys } from '@/features/rounds/api/keys';
import { saveRound } from '@/features/rounds/api/save-round';
import type { Round, SaveRoundRequest } from '@/features/rounds/api/types';
import type { RoundFormValues } from '@/features/rounds/schemas/round-form';
import { formValuesOf, saveRequestOf } from '@/features/rounds/schemas/round-form';
import { roundDifferences } from '@/features/rounds/utils/differences';
import { clearLocalDraft, readLocalDraft, writeLocalDraft } from '@/features/rounds/utils/local-draft';
import { isApiError } from '@/lib/api-client';

/** How long after the last change a draft is sent. */
export const AUTOSAVE_DELAY_MS = 1500;
/** Waits between retries after a dropped connection (the last one repeats). */
export const RETRY_DELAYS_MS = [3000, 6000, 12000, 30000];

export type SaveState = 'saved' | 'pending' | 'saving' | 'offline' | 'invalid' | 'stale' | 'refused';

export interface StaleRound {
  message: string;
  theirs: Round;
  differences: VersionDifference[];
  state: 'choose' | 'loaded' | 'kept';
}

export interface AutosaveOptions {
  projectId: string;
  initial: Round;
  values: RoundFormValues;
  editable: boolean;
  /** Puts values into the form (their version, or a restored draft). */
  reset: (values: RoundFormValues) => void;
  classCode?: (id: string) => string;
}

type Canonical = Omit<SaveRoundRequest, 'version'>;

const canonicalOf = (values: RoundFormValues, fallback: number): Canonical => {
  const { version: _version, ...rest } = saveRequestOf(values, 0, fallback);
  return rest;
};
const same = (a: Canonical, b: Canonical) => JSON.stringify(a) === JSON.stringify(b);

/**
 * Saves a round as it is typed: 1.5 s after the last change (and on demand, e.g. on a section change),
 * with the typing kept in the browser until the server has it. A dropped connection is retried; a
 * 409 STALE_VERSION stops saving until the person chooses their version or their own typing.
 */
interface Boot {
  kind: 'none' | 'restore' | 'conflict';
  values: RoundFormValues | null;
  baseVersion: number;
  message: string | null;
}

/** What a local draft from an earlier visit means for this round (read once, when the editor opens). */
function bootFrom(initial: Round, editable: boolean, fallback: number): Boot {
  const none: Boot = { kind: 'none', values: null, baseVersion: initial.version, message: null };
  const draft = readLocalDraft(initial.id);
  if (draft === null) return none;
  if (!editable || same(canonicalOf(draft.values, fallback), canonicalOf(formValuesOf(initial), fallback))) {
    clearLocalDraft(initial.id);
    return none;
  }
  const when = new Date(draft.savedAt).toLocaleString('en-GB');
  if (draft.baseVersion === initial.version) {
    return {
      kind: 'restore',
      values: draft.values,
      baseVersion: draft.baseVersion,
      message: `Your typing from ${when} was not on the server yet. It has been restored from this device and is being saved now.`,
    };
  }
  return {
    kind: 'conflict',
    values: draft.values,
    baseVersion: draft.baseVersion,
    message: `Your typing from ${when} was restored from this device, but the round was saved again since then.`,
  };
}

/**
 * Saves a round as it is typed: 1.5 s after the last change (and on demand, e.g. on a section change),
 * with the typing kept in the browser until the server has it. A dropped connection is retried; a
 * 409 STALE_VERSION stops saving until the person chooses their version or their own typing.
 */
export function useRoundAutosave({
  projectId,
  initial,
  values,
  editable,
  reset,
  classCode,
}: AutosaveOptions) {
  const queryClient = useQueryClient();
  const roundId = initial.id;
  const fallback = initial.faceChainage;
  const [boot] = useState(() => bootFrom(initial, editable, fallback));
  const [server, setServer] = useState<Round>(initial);
  const [state, setState] = useState<SaveState>(
    boot.kind === 'conflict' ? 'stale' : boot.kind === 'restore' ? 'pending' : 'saved',
  );
  const [message, setMessage] = useState<string | null>(null);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [stale, setStale] = useState<StaleRound | null>(() =>
    boot.kind === 'conflict' && boot.values !== null
      ? {
          message: 'Someone saved this round after your typing began. Compare and choose.',
          theirs: initial,
          differences: roundDifferences(
            canonicalOf(boot.values, fallback),
            canonicalOf(formValuesOf(initial), fallback),
            classCode,
          ),
          state: 'choose',
        }
      : null,
  );
  const [restored, setRestored] = useState<string | null>(boot.message);

  const versionRef = useRef(boot.baseVersion);
  const savedRef = useRef<Canonical>(canonicalOf(formValuesOf(initial), fallback));
  const valuesRef = useRef(boot.values ?? values);
  const timerRef = useRef<ReturnType<typeof setTimeout> | null>(null);
  const inFlightRef = useRef(false);
  const staleRef = useRef(boot.kind === 'conflict');
  const attemptRef = useRef(0);
  const mountedRef = useRef(true);
  const saveRef = useRef<() => Promise<void>>(() => Promise.resolve());
  const json = JSON.stringify(values);
  const lastJsonRef = useRef(json);

  const clearTimer = () => {
    if (timerRef.current !== null) clearTimeout(timerRef.current);
    timerRef.current = null;
  };
  const later = (ms: number) => {
    clearTimer();
    timerRef.current = setTimeout(() => void saveRef.current(), ms);
  };

  const openStale = useCallback(
    (msg: string, theirs: Round) => {
      staleRef.current = true;
      clearTimer();
      setStale({
        message: msg,
        theirs,
        differences: roundDifferences(
          canonicalOf(valuesRef.current, fallback),
          canonicalOf(formValuesOf(theirs), fallback),
          classCode,
        ),
        state: 'choose',
      });
      setState('stale');
    },
    [classCode, fallback],
  );

  const save = useCallback(async (): Promise<void> => {
    clearTimer();
    if (!editable || staleRef.current) return;
    if (inFlightRef.current) {
      later(300);
      return;
    }
    const sent = canonicalOf(valuesRef.current, fallback);
    if (same(sent, savedRef.current)) {
      clearLocalDraft(roundId);
      setState('saved');
      return;
    }
    inFlightRef.current = true;
    setState('saving');
    try {
      const saved = await saveRound(projectId, roundId, { ...sent, version: versionRef.current });
      if (!mountedRef.current) return;
      versionRef.current = saved.version;
      savedRef.current = sent;
      attemptRef.current = 0;
      setServer(saved);
      setFieldErrors({});
      setMessage(null);
      queryClient.setQueryData(roundKeys.detail(projectId, roundId), saved);
      void queryClient.invalidateQueries({ queryKey: roundKeys.heading(projectId, saved.headingId) });
      if (same(canonicalOf(valuesRef.current, fallback), sent)) {
        clearLocalDraft(roundId);
        setState('saved');
      } else {
        setState('pending');
        later(AUTOSAVE_DELAY_MS);
      }
    } catch (error) {
      if (!mountedRef.current) return;
      if (isApiError(error) && error.code === 'STALE_VERSION') {
        const current = error.details?.current;
        const theirs =
          typeof current === 'object' && current !== null
            ? (current as Round)
            : await getRound(projectId, roundId).catch(() => null);
        if (theirs !== null) openStale(error.message, theirs);
        else {
          setState('offline');
          later(RETRY_DELAYS_MS[0]);
        }
      } else if (isApiError(error) && (error.status === 0 || error.status >= 500)) {
        const wait = RETRY_DELAYS_MS[Math.min(attemptRef.current, RETRY_DELAYS_MS.length - 1)];
        attemptRef.current += 1;
        setState('offline');
        setMessage(null);
        later(wait);
      } else if (isApiError(error) && error.status === 400) {
        setState('invalid');
        setFieldErrors(error.fields ?? {});
        setMessage(error.message);
      } else {
        setState('refused');
        setMessage(isApiError(error) ? error.message : 'Something unexpected went wrong while saving.');
      }
    } finally {
      inFlightRef.current = false;
    }
    // `later` only touches refs.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [editable, fallback, openStale, projectId, queryClient, roundId]);

  useEffect(() => {
    saveRef.current = save;
  }, [save]);

  // A draft restored from this device goes into the form once; a plain restore is sent at once.
  useEffect(() => {
    if (boot.values === null) return;
    reset(boot.values);
    if (boot.kind === 'restore') later(50);
    // Once, when the editor opens.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  // Every change: keep it in the browser at once, send it 1.5 s after the last keystroke.
  useEffect(() => {
    valuesRef.current = values;
    if (!editable || json === lastJsonRef.current) return;
    lastJsonRef.current = json;
    writeLocalDraft({ roundId, baseVersion: versionRef.current, savedAt: Date.now(), values });
    if (staleRef.current) return;
    if (same(canonicalOf(values, fallback), savedRef.current)) {
      if (!inFlightRef.current) {
        clearTimer();
        setState('saved');
      }
      return;
    }
    setState((s) => (s === 'offline' || s === 'saving' ? s : 'pending'));
    later(AUTOSAVE_DELAY_MS);
    // `values` is represented by `json`.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [editable, fallback, json, roundId]);

  // Back online: try at once.
  useEffect(() => {
    const online = () => {
      if (state === 'offline') void saveRef.current();
    };
    window.addEventListener('online', online);
    return () => window.removeEventListener('online', online);
  }, [state]);

  useEffect(() => {
    mountedRef.current = true;
    return () => {
      mountedRef.current = false;
      clearTimer();
    };
  }, []);

  return {
    server,
    state,
    message,
    fieldErrors,
    stale,
    restored,
    dismissRestored: () => setRestored(null),
    version: () => versionRef.current,
    /** Send now (section change, before submit); resolves when the server has answered. */
    flush: () => saveRef.current(),
    /** Keep my typing and save it on top of their version. */
    keepMine: () => {
      if (stale === null) return;
      versionRef.current = stale.theirs.version;
      savedRef.current = canonicalOf(formValuesOf(stale.theirs), fallback);
      staleRef.current = false;
      setServer(stale.theirs);
      setStale({ ...stale, state: 'kept' });
      void saveRef.current();
    },
    /** Put their version in the form; my typing is dropped. */
    takeTheirs: () => {
      if (stale === null) return;
      const theirValues = formValuesOf(stale.theirs);
      versionRef.current = stale.theirs.version;
      savedRef.current = canonicalOf(theirValues, fallback);
      staleRef.current = false;
      clearTimer();
      clearLocalDraft(roundId);
      valuesRef.current = theirValues;
      lastJsonRef.current = JSON.stringify(theirValues);
      reset(theirValues);
      setServer(stale.theirs);
      setStale({ ...stale, state: 'loaded' });
      setState('saved');
      queryClient.setQueryData(roundKeys.detail(projectId, roundId), stale.theirs);
    },
    dismissStale: () => setStale(null),
    /** After submit, the server's answer becomes the base. */
    accept: (round: Round) => {
      versionRef.current = round.version;
      savedRef.current = canonicalOf(formValuesOf(round), fallback);
      setServer(round);
      clearLocalDraft(roundId);
      setState('saved');
      queryClient.setQueryData(roundKeys.detail(projectId, roundId), round);
    },
  };
}
