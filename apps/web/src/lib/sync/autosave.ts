import { isApiError } from '@/lib/api-client';
import { STALE_VERSION_CODE } from '@/lib/form-errors';
import type { DraftStore } from '@/lib/sync/local-draft';

/**
 * The autosave engine: plain TypeScript, no React. It takes every change of a document (`edit`), keeps
 * it in a local draft at once, sends it after a pause in the typing, keeps one save in flight at a
 * time (the latest document waits behind it, earlier ones are never sent), retries with back-off when
 * the server cannot be reached, and on a 409 stale version stops and keeps both versions until the
 * person chooses. The UI reads `getSnapshot()` and listens with `subscribe()`.
 */

/** How long after the last change a document is sent. */
export const AUTOSAVE_DELAY_MS = 1500;
/** Waits between retries after a dropped connection or a 5xx (the last one repeats). */
export const RETRY_DELAYS_MS = [3000, 6000, 12000, 30000] as const;
/** How soon a draft restored from this device is sent. */
export const RESTORE_DELAY_MS = 50;

/**
 * saved: the server has the document; waiting: a change is kept locally and will be sent; saving: a
 * save is on its way; offline: the server could not be reached, a retry is planned; error: the server
 * refused the document (see `error`); conflict: someone saved first (see `conflict`).
 */
export type SyncStatus = 'saved' | 'waiting' | 'saving' | 'offline' | 'error' | 'conflict';

export interface Versioned {
  version: number;
}

/** What a failed save means for the engine. */
export type SaveFailure<S> =
  | { kind: 'stale'; message: string; current: S | null }
  | { kind: 'retry'; retryAfterMs: number | null }
  | { kind: 'invalid'; message: string; fields: Record<string, string> }
  | { kind: 'refused'; message: string };

export interface SyncConflict<D, S> {
  /** 'saved-first': a save was refused with 409; 'draft-behind': a local draft older than the server's. */
  reason: 'saved-first' | 'draft-behind';
  /** The server's sentence (with 'saved-first'). */
  message: string | null;
  /** The typing, as it was when the conflict was found (it stays in the local draft too). */
  mine: D;
  /** Their version, as the server has it. */
  theirs: S;
  /** The document both started from (null when this device no longer knows it). */
  base: D | null;
  /** choose: saving stops until `keepMine` or `takeTheirs`; kept / loaded: what was chosen. */
  state: 'choose' | 'kept' | 'loaded';
}

export interface SyncSnapshot<D, S> {
  status: SyncStatus;
  /** The server version the next save is made against. */
  version: number;
  error: { invalid: boolean; message: string; fields: Record<string, string> } | null;
  conflict: SyncConflict<D, S> | null;
  /** A draft of an earlier visit was put back ('conflict' when the server had moved past it). */
  restored: { kind: 'restore' | 'conflict'; savedAt: number } | null;
}

export interface AutosaveOptions<D, S extends Versioned> {
  /** The record's id; also the key of its local draft. */
  key: string;
  /** The record as the server had it when the editor opened. */
  server: S;
  /** The document the editor shows for `server` (form values). */
  document: D;
  /** May this record be saved from here (role, status)? Asked again whenever the record changes. */
  editable: (server: S) => boolean;
  toDocument: (server: S) => D;
  /** The part of a document that is sent and compared (row keys and the like left out). */
  payload: (document: D) => unknown;
  save: (document: D, version: number) => Promise<S>;
  /** Reads the record when a 409 does not carry the saved version. */
  reload: () => Promise<S>;
  drafts: DraftStore<D>;
  /** Kept with each draft (where the record lives), for a sender that works with the editor closed. */
  scope?: Record<string, string>;
  /** The server's record changed (saved, their version kept or loaded, submitted). */
  onServerRecord?: (server: S) => void;
  classify?: (error: unknown) => SaveFailure<S>;
  delayMs?: number;
  retryDelaysMs?: readonly number[];
  now?: () => number;
}

/** The Roundbook API's answers: 409 STALE_VERSION, unreachable or 5xx, 400 with fields, anything else. */
export function classifySaveError<S>(error: unknown): SaveFailure<S> {
  if (!isApiError(error))
    return { kind: 'refused', message: 'Something unexpected went wrong while saving.' };
  if (error.code === STALE_VERSION_CODE) {
    const current = error.details?.current;
    return {
      kind: 'stale',
      message: error.message,
      current: typeof current === 'object' && current !== null ? (current as S) : null,
    };
  }
  if (error.status === 0 || error.status >= 500) {
    return { kind: 'retry', retryAfterMs: error.retryAfterMs ?? null };
  }
  if (error.status === 400) return { kind: 'invalid', message: error.message, fields: error.fields ?? {} };
  return { kind: 'refused', message: error.message };
}

export class AutosaveEngine<D, S extends Versioned> {
  private readonly options: AutosaveOptions<D, S>;
  private readonly delayMs: number;
  private readonly retryDelaysMs: readonly number[];
  private readonly now: () => number;
  private readonly classify: (error: unknown) => SaveFailure<S>;
  private readonly listeners = new Set<() => void>();

  private editable: boolean;
  private doc: D;
  /** JSON of the last document seen, to ignore repeats. */
  private docJson: string;
  /** The server's version and the payload it holds. */
  private base: { version: number; payload: string };
  /** The document the server holds at `base.version` (the common ancestor of a merge). */
  private baseDoc: D;
  private inFlight: Promise<void> | null = null;
  /** A save was asked for while one was in flight: send the latest document when it ends. */
  private queued = false;
  /** Saving stops while a conflict waits for a choice. */
  private blocked = false;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private attempt = 0;
  private active = false;
  private restorePending = false;
  private snapshot: SyncSnapshot<D, S>;

  constructor(options: AutosaveOptions<D, S>) {
    this.options = options;
    this.delayMs = options.delayMs ?? AUTOSAVE_DELAY_MS;
    this.retryDelaysMs = options.retryDelaysMs ?? RETRY_DELAYS_MS;
    this.now = options.now ?? Date.now;
    this.classify = options.classify ?? classifySaveError;
    const { server, key, drafts } = options;
    this.editable = options.editable(server);
    this.doc = options.document;
    this.base = { version: server.version, payload: this.payloadOf(options.document) };
    this.baseDoc = options.document;

    let status: SyncStatus = 'saved';
    let conflict: SyncConflict<D, S> | null = null;
    let restored: SyncSnapshot<D, S>['restored'] = null;
    const draft = drafts.read(key);
    if (draft !== null) {
      if (!this.editable || this.payloadOf(draft.values) === this.base.payload) {
        drafts.clear(key);
      } else if (draft.baseVersion === server.version) {
        this.doc = draft.values;
        restored = { kind: 'restore', savedAt: draft.savedAt };
        status = 'waiting';
        this.restorePending = true;
      } else {
        this.doc = draft.values;
        restored = { kind: 'conflict', savedAt: draft.savedAt };
        status = 'conflict';
        this.blocked = true;
        conflict = {
          reason: 'draft-behind',
          message: null,
          mine: draft.values,
          theirs: server,
          base: draft.baseValues ?? null,
          state: 'choose',
        };
      }
    }
    this.docJson = JSON.stringify(this.doc);
    this.snapshot = { status, version: this.base.version, error: null, conflict, restored };
  }

  // --- reading -------------------------------------------------------------------------------------

  /** The document to show when the editor opens (a restored draft, or the server's record). */
  document(): D {
    return this.doc;
  }

  getSnapshot = (): SyncSnapshot<D, S> => this.snapshot;

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  // --- lifecycle -----------------------------------------------------------------------------------

  /** Begins timing (a restored draft is sent now); call when the editor is on screen. */
  start(): void {
    this.active = true;
    if (this.restorePending) {
      this.restorePending = false;
      this.schedule(RESTORE_DELAY_MS);
    }
  }

  /** Stops the timers; a save in flight still lands. The draft stays in the browser. */
  stop(): void {
    this.active = false;
    this.clearTimer();
  }

  // --- commands ------------------------------------------------------------------------------------

  /** Every change of the document: kept locally at once, sent after a pause in the typing. */
  edit = (doc: D): void => {
    const json = JSON.stringify(doc);
    if (json === this.docJson) return;
    this.docJson = json;
    this.doc = doc;
    if (!this.editable) return;
    this.writeDraft();
    if (this.blocked) return;
    if (this.payloadOf(doc) === this.base.payload) {
      if (this.inFlight === null) {
        this.clearTimer();
        this.options.drafts.clear(this.options.key);
        this.update({ status: 'saved', error: null });
      }
      return;
    }
    // While offline the planned retry sends the latest document.
    if (this.snapshot.status === 'offline') return;
    if (this.snapshot.status !== 'saving') this.update({ status: 'waiting' });
    this.schedule(this.delayMs);
  };

  /** Sends now (a section change, before submit); resolves when the server has answered. */
  flush = async (): Promise<void> => {
    this.clearTimer();
    while (this.inFlight !== null) await this.inFlight;
    await this.send();
  };

  /** Try at once when offline (the connection is back). */
  retryNow = (): void => {
    if (this.snapshot.status === 'offline') void this.send();
  };

  /** Keeps the typing and saves it on top of their version. */
  keepMine = (): void => {
    const conflict = this.snapshot.conflict;
    if (conflict === null || conflict.state !== 'choose') return;
    this.resolve(this.doc);
  };

  /**
   * Settles a conflict with a document made from both versions (the field-by-field merge): it goes on
   * top of their version and is sent. Returns it for the form; null when there is no conflict.
   */
  resolve = (merged: D): D | null => {
    const conflict = this.snapshot.conflict;
    if (conflict === null || conflict.state !== 'choose') return null;
    const { theirs } = conflict;
    this.setBase(theirs);
    this.doc = merged;
    this.docJson = JSON.stringify(merged);
    this.blocked = false;
    this.serverRecord(theirs);
    this.writeDraft();
    this.update({ status: 'waiting', conflict: { ...conflict, state: 'kept' } });
    void this.send();
    return merged;
  };

  /**
   * The server's record seen by polling (another device saved). Newer than ours: with nothing unsaved
   * here it becomes the document ('refreshed'); with unsaved typing the typing is never overwritten and
   * the conflict is shown instead ('conflict'). Older or equal, or a save in flight: 'ignored'.
   */
  serverMoved = (theirs: S): 'refreshed' | 'conflict' | 'ignored' => {
    if (theirs.version <= this.base.version || this.inFlight !== null || this.blocked) return 'ignored';
    // The server already holds exactly this typing (a save whose answer was lost landed): saved.
    if (this.payloadOf(this.options.toDocument(theirs)) === this.payloadOf(this.doc)) {
      this.setBase(theirs);
      this.attempt = 0;
      this.clearTimer();
      this.options.drafts.clear(this.options.key);
      this.serverRecord(theirs);
      this.update({ status: 'saved', error: null });
      return 'ignored';
    }
    if (!this.editable || this.payloadOf(this.doc) === this.base.payload) {
      this.setBase(theirs);
      this.doc = this.options.toDocument(theirs);
      this.docJson = JSON.stringify(this.doc);
      this.clearTimer();
      this.options.drafts.clear(this.options.key);
      this.serverRecord(theirs);
      this.update({ status: 'saved', error: null });
      return 'refreshed';
    }
    this.blocked = true;
    this.queued = false;
    this.clearTimer();
    this.update({
      status: 'conflict',
      conflict: {
        reason: 'saved-first',
        message: 'This round was saved on another device while you were typing here.',
        mine: this.doc,
        theirs,
        base: this.baseDoc,
        state: 'choose',
      },
    });
    return 'conflict';
  };

  /** Drops the typing for their version; returns the document to put in the form (null: no conflict). */
  takeTheirs = (): D | null => {
    const conflict = this.snapshot.conflict;
    if (conflict === null || conflict.state !== 'choose') return null;
    const { theirs } = conflict;
    const doc = this.options.toDocument(theirs);
    this.base = { version: theirs.version, payload: this.payloadOf(doc) };
    this.baseDoc = doc;
    this.doc = doc;
    this.docJson = JSON.stringify(doc);
    this.blocked = false;
    this.clearTimer();
    this.options.drafts.clear(this.options.key);
    this.serverRecord(theirs);
    this.update({ status: 'saved', error: null, conflict: { ...conflict, state: 'loaded' } });
    return doc;
  };

  /** Hides the conflict notice (saving stays stopped if no choice was made). */
  dismissConflict = (): void => {
    this.update({ conflict: null });
  };

  dismissRestored = (): void => {
    this.update({ restored: null });
  };

  /** The server's answer to something else (submit) becomes the base; the draft is done with. */
  accept = (server: S): void => {
    this.clearTimer();
    this.setBase(server);
    this.options.drafts.clear(this.options.key);
    this.serverRecord(server);
    this.update({ status: 'saved', error: null });
  };

  // --- inside --------------------------------------------------------------------------------------

  private setBase(server: S): void {
    const doc = this.options.toDocument(server);
    this.base = { version: server.version, payload: this.payloadOf(doc) };
    this.baseDoc = doc;
  }

  private payloadOf(doc: D): string {
    return JSON.stringify(this.options.payload(doc));
  }

  private update(patch: Partial<SyncSnapshot<D, S>>): void {
    this.snapshot = { ...this.snapshot, ...patch, version: this.base.version };
    for (const listener of this.listeners) listener();
  }

  private serverRecord(server: S): void {
    this.editable = this.options.editable(server);
    this.options.onServerRecord?.(server);
  }

  private writeDraft(): void {
    this.options.drafts.write({
      key: this.options.key,
      baseVersion: this.base.version,
      savedAt: this.now(),
      values: this.doc,
      baseValues: this.baseDoc,
      ...(this.options.scope === undefined ? {} : { scope: this.options.scope }),
    });
  }

  private clearTimer(): void {
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
  }

  private schedule(ms: number): void {
    this.clearTimer();
    if (!this.active) return;
    this.timer = setTimeout(() => {
      this.timer = null;
      void this.send();
    }, ms);
  }

  /** Sends the latest document unless the server has it; coalesces behind a save in flight. */
  private send(): Promise<void> {
    this.clearTimer();
    if (!this.editable || this.blocked) return Promise.resolve();
    if (this.inFlight !== null) {
      this.queued = true;
      return this.inFlight;
    }
    const payload = this.payloadOf(this.doc);
    if (payload === this.base.payload) {
      this.options.drafts.clear(this.options.key);
      this.update({ status: 'saved', error: null });
      return Promise.resolve();
    }
    this.update({ status: 'saving' });
    const run = this.run(this.doc, payload).finally(() => {
      this.inFlight = null;
      if (this.queued) {
        this.queued = false;
        void this.send();
      }
    });
    this.inFlight = run;
    return run;
  }

  private async run(doc: D, payload: string): Promise<void> {
    let saved: S;
    try {
      saved = await this.options.save(doc, this.base.version);
    } catch (error) {
      const landed = await this.failed(error, payload);
      if (landed === null) return;
      saved = landed;
    }
    this.base = { version: saved.version, payload };
    this.baseDoc = doc;
    this.attempt = 0;
    this.serverRecord(saved);
    if (this.payloadOf(this.doc) === payload) {
      this.options.drafts.clear(this.options.key);
      this.update({ status: 'saved', error: null });
    } else {
      // Typing went on while the save was out: keep it against the new version, send it in turn.
      this.writeDraft();
      this.update({ status: 'waiting', error: null });
      if (this.timer === null && !this.queued) this.schedule(this.delayMs);
    }
  }

  /**
   * A refused or lost save. Returns the server's record when the refusal shows the save had landed after
   * all (an earlier try whose answer was lost: the server is one version on and holds exactly what was
   * sent), so it counts as saved rather than as someone else's change.
   */
  private async failed(error: unknown, sent: string): Promise<S | null> {
    const failure = this.classify(error);
    switch (failure.kind) {
      case 'stale': {
        const theirs = failure.current ?? (await this.options.reload().catch(() => null));
        if (theirs === null) {
          this.retryLater(null);
          return null;
        }
        if (theirs.version > this.base.version && this.payloadOf(this.options.toDocument(theirs)) === sent) {
          return theirs;
        }
        this.blocked = true;
        this.queued = false;
        this.clearTimer();
        this.update({
          status: 'conflict',
          conflict: {
            reason: 'saved-first',
            message: failure.message,
            mine: this.doc,
            theirs,
            base: this.baseDoc,
            state: 'choose',
          },
        });
        return null;
      }
      case 'retry':
        this.retryLater(failure.retryAfterMs);
        return null;
      case 'invalid':
        this.update({
          status: 'error',
          error: { invalid: true, message: failure.message, fields: failure.fields },
        });
        return null;
      case 'refused':
        this.update({ status: 'error', error: { invalid: false, message: failure.message, fields: {} } });
        return null;
    }
  }

  private retryLater(retryAfterMs: number | null): void {
    const backOff = this.retryDelaysMs[Math.min(this.attempt, this.retryDelaysMs.length - 1)];
    this.attempt += 1;
    this.queued = false;
    this.update({ status: 'offline', error: null });
    this.schedule(retryAfterMs ?? backOff);
  }
}
