import { screen } from '@testing-library/react';
import { SyncBarView, summarise } from '@/app/sync-bar';
import { SyncState } from '@/lib/sync/sync-state';
import { renderWithProviders } from '@/testing/render-with-providers';

const NOW = Date.parse('2026-12-03T10:00:00Z');

describe('SyncBarView', () => {
  it('says online, all saved and when the server last took a change', () => {
    renderWithProviders(
      <SyncBarView
        online
        syncing={false}
        waiting={0}
        problems={[]}
        lastSyncedAt={NOW - 5 * 60_000}
        now={NOW}
      />,
    );
    const bar = screen.getByTestId('sync-bar');
    expect(bar).toHaveTextContent('Online');
    expect(bar).toHaveTextContent('All changes saved');
    expect(bar).toHaveTextContent('Last synced 5 min ago');
    expect(screen.queryByRole('button', { name: 'Send now' })).toBeNull();
  });

  it('says offline with the number of changes waiting, and never synced', () => {
    renderWithProviders(
      <SyncBarView online={false} syncing={false} waiting={3} problems={[]} lastSyncedAt={null} now={NOW} />,
    );
    const bar = screen.getByTestId('sync-bar');
    expect(bar).toHaveTextContent('Offline');
    expect(bar).toHaveTextContent('3 changes waiting on this device');
    expect(bar).toHaveTextContent('Not synced from this device yet');
  });

  it('shows syncing, and a save failure in words', () => {
    renderWithProviders(
      <SyncBarView
        online
        syncing
        waiting={1}
        problems={['Round 12: not saved — Face chainage is out of range.']}
        lastSyncedAt={NOW}
        now={NOW}
      />,
    );
    expect(screen.getByTestId('sync-summary')).toHaveTextContent('Syncing…');
    expect(screen.getByTestId('sync-problem')).toHaveTextContent('Face chainage is out of range.');
  });

  it('offers Send now when online with changes waiting', () => {
    const retry = jest.fn();
    renderWithProviders(
      <SyncBarView
        online
        syncing={false}
        waiting={1}
        problems={[]}
        lastSyncedAt={null}
        onRetry={retry}
        now={NOW}
      />,
    );
    screen.getByRole('button', { name: 'Send now' }).click();
    expect(retry).toHaveBeenCalledTimes(1);
  });

  it('is sticky at the bottom of the window (in view wherever the page is scrolled)', () => {
    renderWithProviders(
      <SyncBarView online syncing={false} waiting={0} problems={[]} lastSyncedAt={null} now={NOW} />,
    );
    const style = window.getComputedStyle(screen.getByTestId('sync-bar'));
    expect(style.position).toBe('sticky');
    expect(style.bottom).toBe('0px');
  });
});

describe('summarise', () => {
  it('counts open records with unsent typing, drafts of closed rounds and rounds opened offline, once each', () => {
    const state = new SyncState();
    state.report('r1', { status: 'waiting', message: null, label: 'Round 1' });
    state.report('r2', { status: 'saved', message: null, label: 'Round 2' });
    state.report('r3', { status: 'error', message: 'Face chainage is out of range.', label: 'Round 3' });
    const s = summarise(state.getSnapshot(), ['n1', 'n2'], ['r1', 'r4']);
    // r1 (open, waiting; its draft not counted twice), r3 (refused), r4 (closed draft), 2 outbox entries.
    expect(s.waiting).toBe(5);
    expect(s.syncing).toBe(false);
    expect(s.problems).toEqual(['Round 3: not saved — Face chainage is out of range.']);
  });

  it('counts a round opened offline once: its outbox entry, its draft and its open editor are one change', () => {
    const state = new SyncState();
    state.report('r-new', { status: 'waiting', message: null, label: 'Round 19' });
    expect(summarise(state.getSnapshot(), ['r-new'], ['r-new']).waiting).toBe(1);
    // The same round once its editor is closed: still one.
    state.report('r-new', null);
    expect(summarise(state.getSnapshot(), ['r-new'], ['r-new']).waiting).toBe(1);
    // And beside a round opened online whose typing waits: two.
    state.report('r-1', { status: 'offline', message: null, label: 'Round 18' });
    expect(summarise(state.getSnapshot(), ['r-new'], ['r-new', 'r-1']).waiting).toBe(2);
  });

  it('is syncing while a save is out, and keeps the last sync time', () => {
    const state = new SyncState();
    state.report('r1', { status: 'saving', message: null, label: 'Round 1' });
    state.synced(NOW);
    const s = summarise(state.getSnapshot(), [], []);
    expect(s.syncing).toBe(true);
    expect(s.lastSyncedAt).toBe(NOW);
    expect(new SyncState().getSnapshot().lastSyncedAt).toBe(NOW);
  });
});
