import { ApiError, NETWORK_ERROR_CODE } from '@/lib/api-client';
import type { AutosaveOptions } from '@/lib/sync/autosave';
import { AUTOSAVE_DELAY_MS, AutosaveEngine, RESTORE_DELAY_MS, RETRY_DELAYS_MS } from '@/lib/sync/autosave';
import { localStorageDrafts } from '@/lib/sync/local-draft';

// The engine on its own, with fake timers: a "document" is a note with a browser-only row key (left
// out of what is sent), the "server" answers with the note and the next version.

interface Note {
  rowKey: string;
  text: string;
}
interface SavedNote {
  id: string;
  version: number;
  text: string;
}

const drafts = localStorageDrafts<Note>('test.note-draft.');
const server: SavedNote = { id: 'n-1', version: 3, text: 'face dry' };

const unreachable = () => new ApiError(0, NETWORK_ERROR_CODE, 'The Roundbook server could not be reached.');
const stale = (current?: SavedNote) =>
  new ApiError(
    409,
    'STALE_VERSION',
    'Someone saved this first.',
    undefined,
    current ? { current } : undefined,
  );

interface Call {
  doc: Note;
  version: number;
  settle: { resolve: (saved: SavedNote) => void; reject: (error: unknown) => void };
}

/** A save function whose calls the test answers one by one. */
function manualServer() {
  const calls: Call[] = [];
  const save = jest.fn(
    (doc: Note, version: number) =>
      new Promise<SavedNote>((resolve, reject) => calls.push({ doc, version, settle: { resolve, reject } })),
  );
  const answer = async (i: number) => {
    calls[i].settle.resolve({ id: 'n-1', version: calls[i].version + 1, text: calls[i].doc.text });
    await jest.advanceTimersByTimeAsync(0);
  };
  const fail = async (i: number, error: unknown) => {
    calls[i].settle.reject(error);
    await jest.advanceTimersByTimeAsync(0);
  };
  return { calls, save, answer, fail };
}

function engineWith(
  save: AutosaveOptions<Note, SavedNote>['save'],
  extra: Partial<AutosaveOptions<Note, SavedNote>> = {},
) {
  const onServerRecord = jest.fn();
  const engine = new AutosaveEngine<Note, SavedNote>({
    key: 'n-1',
    server,
    document: { rowKey: 'row-a', text: server.text },
    editable: () => true,
    toDocument: (s) => ({ rowKey: `row-${s.version}`, text: s.text }),
    payload: (doc) => ({ text: doc.text }),
    save,
    reload: () => Promise.reject(new Error('not expected')),
    drafts,
    onServerRecord,
    ...extra,
  });
  engine.start();
  return { engine, onServerRecord };
}

const note = (text: string): Note => ({ rowKey: 'row-a', text });

beforeEach(() => jest.useFakeTimers());
afterEach(() => jest.useRealTimers());

describe('autosave engine: debounce', () => {
  it('coalesces a burst of typing into one save of the last document, 1.5 s after the last change', async () => {
    const api = manualServer();
    const { engine } = engineWith(api.save);
    engine.edit(note('face d'));
    await jest.advanceTimersByTimeAsync(500);
    engine.edit(note('face da'));
    await jest.advanceTimersByTimeAsync(500);
    engine.edit(note('face damp'));
    expect(engine.getSnapshot().status).toBe('waiting');
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS - 1);
    expect(api.save).not.toHaveBeenCalled();
    await jest.advanceTimersByTimeAsync(1);
    expect(api.save).toHaveBeenCalledTimes(1);
    expect(api.calls[0].doc.text).toBe('face damp');
    expect(api.calls[0].version).toBe(3);
    expect(engine.getSnapshot().status).toBe('saving');
    await api.answer(0);
    expect(engine.getSnapshot()).toMatchObject({ status: 'saved', version: 4 });
  });

  it('sends nothing when the typing ends where the server already is', async () => {
    const api = manualServer();
    const { engine } = engineWith(api.save);
    engine.edit(note('face dry, crown wet'));
    engine.edit(note('face dry'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 2);
    expect(api.save).not.toHaveBeenCalled();
    expect(engine.getSnapshot().status).toBe('saved');
    expect(drafts.read('n-1')).toBeNull();
  });
});

describe('autosave engine: one save in flight', () => {
  it('holds later changes behind the save in flight and then sends only the latest, on the new version', async () => {
    const api = manualServer();
    const { engine, onServerRecord } = engineWith(api.save);
    engine.edit(note('one'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    expect(api.save).toHaveBeenCalledTimes(1);

    engine.edit(note('two'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    engine.edit(note('three'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 3);
    // Still the first save only: the second waits for the first answer.
    expect(api.save).toHaveBeenCalledTimes(1);
    expect(engine.getSnapshot().status).toBe('saving');

    await api.answer(0);
    expect(api.save).toHaveBeenCalledTimes(2);
    expect(api.calls[1].doc.text).toBe('three');
    expect(api.calls[1].version).toBe(4);
    await api.answer(1);
    expect(engine.getSnapshot()).toMatchObject({ status: 'saved', version: 5 });
    expect(onServerRecord).toHaveBeenLastCalledWith({ id: 'n-1', version: 5, text: 'three' });
    expect(api.calls.map((c) => c.doc.text)).toEqual(['one', 'three']);
  });

  it('flush sends at once and resolves when the server has the latest document', async () => {
    const api = manualServer();
    const { engine } = engineWith(api.save);
    engine.edit(note('one'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    engine.edit(note('two'));
    let flushed = false;
    const flush = engine.flush().then(() => {
      flushed = true;
    });
    await api.answer(0);
    expect(flushed).toBe(false);
    expect(api.calls[1].doc.text).toBe('two');
    await api.answer(1);
    await flush;
    expect(flushed).toBe(true);
    expect(engine.getSnapshot().status).toBe('saved');
  });
});

describe('autosave engine: failures', () => {
  it('retries a dropped connection with growing waits and keeps the draft until a save lands', async () => {
    const api = manualServer();
    const { engine } = engineWith(api.save);
    engine.edit(note('crown wet'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    await api.fail(0, unreachable());
    expect(engine.getSnapshot().status).toBe('offline');
    expect(drafts.read('n-1')?.values.text).toBe('crown wet');

    await jest.advanceTimersByTimeAsync(RETRY_DELAYS_MS[0] - 1);
    expect(api.save).toHaveBeenCalledTimes(1);
    await jest.advanceTimersByTimeAsync(1);
    expect(api.save).toHaveBeenCalledTimes(2);
    await api.fail(1, unreachable());

    // Typing while offline waits for the planned retry, which sends the latest document.
    engine.edit(note('crown wet, invert dry'));
    await jest.advanceTimersByTimeAsync(RETRY_DELAYS_MS[1] - 1);
    expect(api.save).toHaveBeenCalledTimes(2);
    await jest.advanceTimersByTimeAsync(1);
    expect(api.save).toHaveBeenCalledTimes(3);
    expect(api.calls[2].doc.text).toBe('crown wet, invert dry');
    expect(drafts.read('n-1')?.values.text).toBe('crown wet, invert dry');

    await api.answer(2);
    expect(engine.getSnapshot().status).toBe('saved');
    expect(drafts.read('n-1')).toBeNull();
  });

  it("waits as long as a 503's Retry-After asks, not the usual back-off", async () => {
    const api = manualServer();
    const { engine } = engineWith(api.save);
    engine.edit(note('spalling at the crown'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    await api.fail(0, new ApiError(503, 'UNAVAILABLE', 'Busy', undefined, undefined, 20_000));
    expect(engine.getSnapshot().status).toBe('offline');
    await jest.advanceTimersByTimeAsync(RETRY_DELAYS_MS[0]);
    expect(api.save).toHaveBeenCalledTimes(1);
    await jest.advanceTimersByTimeAsync(20_000 - RETRY_DELAYS_MS[0]);
    expect(api.save).toHaveBeenCalledTimes(2);
  });

  it('tries again at once when told the connection is back', async () => {
    const api = manualServer();
    const { engine } = engineWith(api.save);
    engine.edit(note('crown wet'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    await api.fail(0, unreachable());
    engine.retryNow();
    expect(api.save).toHaveBeenCalledTimes(2);
  });

  it('stops on a 400 with the fields named, and sends again after the next change', async () => {
    const api = manualServer();
    const { engine } = engineWith(api.save);
    engine.edit(note('x'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    await api.fail(0, new ApiError(400, 'VALIDATION_FAILED', 'Check the note', { text: 'Too short' }));
    expect(engine.getSnapshot()).toMatchObject({
      status: 'error',
      error: { invalid: true, message: 'Check the note', fields: { text: 'Too short' } },
    });
    await jest.advanceTimersByTimeAsync(RETRY_DELAYS_MS[3]);
    expect(api.save).toHaveBeenCalledTimes(1);
    engine.edit(note('xy'));
    expect(engine.getSnapshot().status).toBe('waiting');
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    expect(api.save).toHaveBeenCalledTimes(2);
  });
});

describe('autosave engine: someone saved first (409)', () => {
  const theirs: SavedNote = { id: 'n-1', version: 4, text: 'face dry, seen close up' };

  it('keeps both versions, stops saving, and on "keep mine" saves the typing on top of theirs', async () => {
    const api = manualServer();
    const { engine } = engineWith(api.save);
    engine.edit(note('crown only'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    await api.fail(0, stale(theirs));

    const { status, conflict } = engine.getSnapshot();
    expect(status).toBe('conflict');
    expect(conflict).toMatchObject({
      reason: 'saved-first',
      message: 'Someone saved this first.',
      mine: { text: 'crown only' },
      theirs,
      state: 'choose',
    });
    expect(drafts.read('n-1')?.values.text).toBe('crown only');

    engine.edit(note('crown only, left wall too'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 4);
    expect(api.save).toHaveBeenCalledTimes(1);
    expect(drafts.read('n-1')?.values.text).toBe('crown only, left wall too');

    engine.keepMine();
    expect(api.save).toHaveBeenCalledTimes(2);
    expect(api.calls[1]).toMatchObject({ version: 4, doc: { text: 'crown only, left wall too' } });
    await api.answer(1);
    expect(engine.getSnapshot()).toMatchObject({ status: 'saved', version: 5, conflict: { state: 'kept' } });
  });

  it('counts a retry refused because its lost first try had landed as saved, not as a conflict', async () => {
    const api = manualServer();
    const { engine, onServerRecord } = engineWith(api.save);
    engine.edit(note('crown wet'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    // The server committed version 4 but the answer was lost on the way back.
    await api.fail(0, unreachable());
    await jest.advanceTimersByTimeAsync(RETRY_DELAYS_MS[0]);
    expect(api.calls[1].version).toBe(3);
    await api.fail(1, stale({ id: 'n-1', version: 4, text: 'crown wet' }));

    expect(engine.getSnapshot()).toMatchObject({ status: 'saved', version: 4, conflict: null });
    expect(onServerRecord).toHaveBeenLastCalledWith({ id: 'n-1', version: 4, text: 'crown wet' });
    expect(drafts.read('n-1')).toBeNull();
    // Someone else's different text on the same retry would still be a conflict.
    engine.edit(note('crown wet, invert dry'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    await api.fail(2, stale({ id: 'n-1', version: 5, text: 'something else' }));
    expect(engine.getSnapshot().status).toBe('conflict');
  });

  it('takes a polled version that holds exactly the typing waiting for a retry as saved, not as a conflict', async () => {
    const api = manualServer();
    const { engine } = engineWith(api.save);
    engine.edit(note('crown wet'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    await api.fail(0, unreachable());
    expect(engine.serverMoved({ id: 'n-1', version: 4, text: 'crown wet' })).toBe('ignored');
    expect(engine.getSnapshot()).toMatchObject({ status: 'saved', version: 4, conflict: null });
    await jest.advanceTimersByTimeAsync(RETRY_DELAYS_MS[0] * 2);
    expect(api.save).toHaveBeenCalledTimes(1);
    expect(drafts.read('n-1')).toBeNull();
  });

  it('reads their version when the 409 does not carry it, and "take theirs" drops the typing', async () => {
    const api = manualServer();
    const reload = jest.fn(() => Promise.resolve(theirs));
    const { engine, onServerRecord } = engineWith(api.save, { reload });
    engine.edit(note('crown only'));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    await api.fail(0, stale());
    expect(reload).toHaveBeenCalledTimes(1);
    expect(engine.getSnapshot().conflict?.theirs).toEqual(theirs);

    const doc = engine.takeTheirs();
    expect(doc).toEqual({ rowKey: 'row-4', text: theirs.text });
    expect(engine.getSnapshot()).toMatchObject({
      status: 'saved',
      version: 4,
      conflict: { state: 'loaded' },
    });
    expect(onServerRecord).toHaveBeenLastCalledWith(theirs);
    expect(drafts.read('n-1')).toBeNull();
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 2);
    expect(api.save).toHaveBeenCalledTimes(1);
  });
});

describe('autosave engine: the local draft', () => {
  it('survives a reload: a new engine puts the typing back and sends it', async () => {
    const first = manualServer();
    const { engine: before } = engineWith(first.save);
    before.edit(note('typed before the tab closed'));
    before.stop();
    expect(first.save).not.toHaveBeenCalled();

    const api = manualServer();
    const { engine: after } = engineWith(api.save);
    expect(after.document().text).toBe('typed before the tab closed');
    expect(after.getSnapshot()).toMatchObject({ status: 'waiting', restored: { kind: 'restore' } });
    await jest.advanceTimersByTimeAsync(RESTORE_DELAY_MS);
    expect(api.save).toHaveBeenCalledTimes(1);
    expect(api.calls[0]).toMatchObject({ version: 3, doc: { text: 'typed before the tab closed' } });
  });

  it('does not send a draft the server has moved past: it shows both for a choice', async () => {
    const first = manualServer();
    const { engine: before } = engineWith(first.save);
    before.edit(note('typed offline yesterday'));
    before.stop();

    const api = manualServer();
    const moved: SavedNote = { id: 'n-1', version: 6, text: 'face dry, bolts in' };
    const { engine: after } = engineWith(api.save, { server: moved, document: note(moved.text) });
    expect(after.document().text).toBe('typed offline yesterday');
    expect(after.getSnapshot()).toMatchObject({
      status: 'conflict',
      restored: { kind: 'conflict' },
      conflict: { reason: 'draft-behind', mine: { text: 'typed offline yesterday' }, theirs: moved },
    });
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 2);
    expect(api.save).not.toHaveBeenCalled();
  });

  it('is cleared by the save that carries it, and kept (on the new version) while typing goes on', async () => {
    const api = manualServer();
    const { engine } = engineWith(api.save);
    engine.edit(note('one'));
    expect(drafts.read('n-1')).toMatchObject({ baseVersion: 3, values: { text: 'one' } });
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    engine.edit(note('one two'));
    await api.answer(0);
    // The first save landed but the typing went on: the draft stays, based on the new version.
    expect(drafts.read('n-1')).toMatchObject({ baseVersion: 4, values: { text: 'one two' } });
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    await api.answer(1);
    expect(engine.getSnapshot().status).toBe('saved');
    expect(drafts.read('n-1')).toBeNull();
  });

  it('is dropped, not restored, when the record may not be edited from here', () => {
    drafts.write({ key: 'n-1', baseVersion: 3, savedAt: 0, values: note('left over') });
    const { engine } = engineWith(jest.fn(), { editable: () => false });
    expect(engine.document().text).toBe(server.text);
    expect(engine.getSnapshot().restored).toBeNull();
    expect(drafts.read('n-1')).toBeNull();
  });
});
