import { IDBFactory, IDBKeyRange } from 'fake-indexeddb';
import { deviceStore } from '@/lib/sync/device-store';
import { adoptLegacyDrafts, localStorageDrafts } from '@/lib/sync/local-draft';

// Drafts of the version before per-person names: `roundbook.round-draft.<roundId>` naming `roundId`.

interface Note {
  text: string;
}

const LEGACY = 'roundbook.round-draft.';
const mine = localStorageDrafts<Note>(`${LEGACY}u-a.`);

const legacyValue = (roundId: string, savedAt: number, text: string) => ({
  roundId,
  baseVersion: 4,
  savedAt,
  values: { text },
});
const legacy = (roundId: string, savedAt: number, text: string) =>
  deviceStore.putDraft(`${LEGACY}${roundId}`, legacyValue(roundId, savedAt, text));

describe('drafts of the previous version', () => {
  it('are read again: moved once under the person signed in, the old names gone', () => {
    legacy('r-1', 1000, 'Crown dripping');
    legacy('r-2', 2000, 'Left wall blocky');

    expect(adoptLegacyDrafts(LEGACY, mine).sort()).toEqual(['r-1', 'r-2']);
    expect(mine.read('r-1')).toEqual({
      key: 'r-1',
      baseVersion: 4,
      savedAt: 1000,
      values: { text: 'Crown dripping' },
    });
    expect(mine.read('r-2')?.values.text).toBe('Left wall blocky');
    expect(deviceStore.getDraft(`${LEGACY}r-1`)).toBeNull();
    expect(mine.keys().sort()).toEqual(['r-1', 'r-2']);
    // Once: nothing left to move.
    expect(adoptLegacyDrafts(LEGACY, mine)).toEqual([]);
  });

  it('never replaces newer typing of the same round, and leaves other people and foreign rows alone', () => {
    legacy('r-1', 1000, 'old');
    mine.write({ key: 'r-1', baseVersion: 5, savedAt: 5000, values: { text: 'newer' } });
    const theirs = localStorageDrafts<Note>(`${LEGACY}u-b.`);
    theirs.write({ key: 'r-9', baseVersion: 1, savedAt: 10, values: { text: 'theirs' } });
    deviceStore.putDraft(`${LEGACY}odd`, { something: 'else' });

    expect(adoptLegacyDrafts(LEGACY, mine)).toEqual(['r-1']);

    expect(mine.read('r-1')?.values.text).toBe('newer');
    expect(deviceStore.getDraft(`${LEGACY}r-1`)).toBeNull();
    expect(theirs.read('r-9')?.values.text).toBe('theirs');
    expect(mine.keys()).toEqual(['r-1']);
    expect(deviceStore.getDraft(`${LEGACY}odd`)).toEqual({ something: 'else' });
  });

  it('written to localStorage by the old version reach IndexedDB and are adopted from there', async () => {
    const engine = { indexedDB: new IDBFactory(), IDBKeyRange };
    window.localStorage.setItem(`${LEGACY}r-7`, JSON.stringify(legacyValue('r-7', 700, 'Sidewall wet')));
    await deviceStore.open({ engine });
    expect(adoptLegacyDrafts(LEGACY, mine)).toEqual(['r-7']);
    await deviceStore.written();

    // A later visit (IndexedDB read afresh): the adopted draft is there, the old one is not.
    await deviceStore.open({ engine });
    expect(mine.read('r-7')?.values.text).toBe('Sidewall wet');
    expect(deviceStore.draftIds()).toEqual([`${LEGACY}u-a.r-7`]);
    expect(window.localStorage.length).toBe(0);
  });
});
