import { IDBFactory, IDBKeyRange } from 'fake-indexeddb';
import { deviceStore } from '@/lib/sync/device-store';
import { localStorageDrafts } from '@/lib/sync/local-draft';
import { outbox } from '@/lib/sync/outbox';

// Drafts and the outbox in IndexedDB (fake-indexeddb), moved once from where the previous version kept
// them in localStorage: `roundbook.round-draft.<owner>.<round>` and `roundbook.outbox.<owner>` (an array).

interface Note {
  text: string;
}

const drafts = localStorageDrafts<Note>('roundbook.round-draft.u-a.');
const draft = (key: string, savedAt: number, text: string) => ({
  key,
  baseVersion: 2,
  savedAt,
  values: { text },
});
const entry = (id: string, owner = 'u-a') => ({
  id,
  kind: 'create-round',
  owner,
  createdAt: 1,
  payload: { id },
});

let engine: { indexedDB: IDBFactory; IDBKeyRange: typeof IDBKeyRange };
beforeEach(() => {
  engine = { indexedDB: new IDBFactory(), IDBKeyRange };
});

/** What the previous version left in localStorage. */
function oldVersionLeft() {
  window.localStorage.setItem(
    'roundbook.round-draft.u-a.r-1',
    JSON.stringify(draft('r-1', 100, 'Crown wet')),
  );
  window.localStorage.setItem('roundbook.round-draft.u-a.r-2', JSON.stringify(draft('r-2', 200, 'Blocky')));
  window.localStorage.setItem('roundbook.outbox.u-a', JSON.stringify([entry('r-2'), entry('r-3')]));
  window.localStorage.setItem('roundbook.outbox.u-b', JSON.stringify([entry('r-9', 'u-b')]));
  window.localStorage.setItem('roundbook.session', '{"kept":"yes"}');
}

/** A reload: the page's memory gone, IndexedDB read afresh. */
const reload = (options: Parameters<typeof deviceStore.open>[0] = {}) =>
  deviceStore.open({ engine, ...options });

describe('the device store', () => {
  it('moves what localStorage held into IndexedDB once, in order, and leaves other keys alone', async () => {
    oldVersionLeft();
    expect(await reload()).toBe('persistent');

    expect(drafts.read('r-1')?.values.text).toBe('Crown wet');
    expect(outbox.list('u-a').map((e) => e.id)).toEqual(['r-2', 'r-3']);
    expect(outbox.list('u-b').map((e) => e.id)).toEqual(['r-9']);
    expect(Object.keys(window.localStorage)).toEqual(['roundbook.session']);

    // A reload reads the same rows from IndexedDB alone.
    await reload();
    expect(drafts.keys().sort()).toEqual(['r-1', 'r-2']);
    expect(outbox.list('u-a').map((e) => e.id)).toEqual(['r-2', 'r-3']);
    expect(outbox.find('u-a', 'r-3')).toEqual(entry('r-3'));
  });

  it('keeps every change across a reload: written, replaced in place, removed', async () => {
    await reload();
    drafts.write(draft('r-1', 1, 'first'));
    drafts.write(draft('r-1', 2, 'second'));
    drafts.write(draft('r-4', 3, 'gone soon'));
    drafts.clear('r-4');
    outbox.put(entry('r-1'));
    outbox.put(entry('r-2'));
    outbox.put({ ...entry('r-1'), createdAt: 9 });
    outbox.remove('u-a', 'r-5');
    await deviceStore.written();

    await reload();
    expect(drafts.read('r-1')?.values.text).toBe('second');
    expect(drafts.keys()).toEqual(['r-1']);
    expect(outbox.list('u-a').map((e) => [e.id, e.createdAt])).toEqual([
      ['r-1', 9],
      ['r-2', 1],
    ]);
  });

  it('loses nothing when the move is interrupted: localStorage stays, its rows are used, the next open moves them', async () => {
    oldVersionLeft();
    await reload({
      duringMove: () => {
        throw new Error('tab closed');
      },
    });
    // Nothing reached IndexedDB; localStorage is as it was, and its rows are shown all the same.
    expect(window.localStorage.getItem('roundbook.round-draft.u-a.r-1')).not.toBeNull();
    expect(drafts.read('r-2')?.values.text).toBe('Blocky');
    expect(outbox.list('u-a').map((e) => e.id)).toEqual(['r-2', 'r-3']);

    // Meanwhile: newer typing of r-1, and r-3 sent.
    drafts.write(draft('r-1', 150, 'Crown wet, two drippers'));
    outbox.remove('u-a', 'r-3');
    await deviceStore.written();

    await reload();
    expect(drafts.read('r-1')?.values.text).toBe('Crown wet, two drippers');
    expect(drafts.read('r-2')?.values.text).toBe('Blocky');
    // The sent round is not sent again, and nothing is doubled.
    expect(outbox.list('u-a').map((e) => e.id)).toEqual(['r-2']);
    expect(outbox.list('u-b').map((e) => e.id)).toEqual(['r-9']);
    expect(Object.keys(window.localStorage)).toEqual(['roundbook.session']);
  });

  it('when localStorage could not be emptied after the move, the next open keeps the newer rows and doubles none', async () => {
    oldVersionLeft();
    const stuck = new Proxy(window.localStorage, {
      get(target, prop: string | symbol) {
        if (prop === 'removeItem')
          return () => {
            throw new Error('page closed before clean-up');
          };
        const value = Reflect.get(target, prop) as unknown;
        return typeof value === 'function' ? (value as (...a: unknown[]) => unknown).bind(target) : value;
      },
    });
    await reload({ storage: stuck });
    drafts.write(draft('r-2', 300, 'Blocky, wedge at crown'));
    await deviceStore.written();

    await reload();
    expect(drafts.read('r-2')?.values.text).toBe('Blocky, wedge at crown');
    expect(outbox.list('u-a').map((e) => e.id)).toEqual(['r-2', 'r-3']);
    expect(Object.keys(window.localStorage)).toEqual(['roundbook.session']);
  });

  it('without IndexedDB shows what localStorage holds, says it keeps nothing new, and deletes nothing', async () => {
    oldVersionLeft();
    const broken = {
      indexedDB: {
        open: () => {
          throw new Error('IndexedDB switched off');
        },
      } as unknown as IDBFactory,
      IDBKeyRange,
    };
    expect(await deviceStore.open({ engine: broken })).toBe('unavailable');
    expect(drafts.read('r-1')?.values.text).toBe('Crown wet');
    expect(outbox.list('u-a')).toHaveLength(2);
    expect(drafts.write(draft('r-5', 1, 'x'))).toBe(false);
    expect(outbox.put(entry('r-6'))).toBe(false);
    expect(window.localStorage.getItem('roundbook.outbox.u-a')).not.toBeNull();
  });
});
