import { heading } from '@/features/rounds/testing/round-fixtures';
import {
  keepPendingRound,
  pendingRoundOf,
  provisionalRound,
  sendPendingRounds,
} from '@/features/rounds/utils/offline-round';
import { outbox } from '@/lib/sync/outbox';
import { jsonResponse, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';

afterEach(() => restoreFetch());

const POST = 'POST /api/projects/p-1/headings/h-1/rounds';
const NOW = new Date('2026-12-03T09:30:00Z');

function pending(owner: { id: string; name: string }, id: string) {
  const round = provisionalRound({
    id,
    heading,
    stage: 'full-face',
    faceChainage: 1253.5,
    next: { roundNumber: 19, previousChainage: 1250, plannedRoundLength: 3.5 },
    timeZone: 'Europe/London',
    mapper: owner,
    now: NOW,
  });
  return {
    projectId: 'p-1',
    headingId: 'h-1',
    body: { id, stage: 'full-face' as const, faceChainage: 1253.5 },
    round,
  };
}

const A = { id: 'u-a', name: 'Tobin Maelor' };
const B = { id: 'u-b', name: 'Ailsa Drummond' };

describe('a round opened offline', () => {
  it('opens as the server would: draft, version 1, round length from the previous face, shift of the project', () => {
    const { round } = pending(A, 'r-new');
    expect(round).toMatchObject({
      id: 'r-new',
      status: 'draft',
      version: 1,
      roundNumber: 19,
      previousChainage: 1250,
      roundLength: 3.5,
      shiftDate: '2026-12-03',
      shift: 'day',
      mappedBy: 'u-a',
      mappedByName: 'Tobin Maelor',
    });
  });

  it('is created once when the connection is back, and only by the person who opened it', async () => {
    expect(keepPendingRound(pending(A, 'r-new'))).toBe(true);
    const created = { ...pending(A, 'r-new').round, version: 1 };
    const mock = mockApi({ [POST]: () => jsonResponse(created, 201) });

    // Someone else signs in on this tablet: the first person's round is not sent under their name.
    expect(await sendPendingRounds(B.id)).toBe(0);
    expect(requestedRoutes(mock)).toEqual([]);
    expect(outbox.list(B.id)).toEqual([]);
    expect(pendingRoundOf(A.id, 'r-new')).not.toBeNull();

    // The same person signs in again: sent with its own id (a retry finds the same round), then gone.
    expect(await sendPendingRounds(A.id)).toBe(1);
    expect(requestedRoutes(mock)).toEqual([POST]);
    const body = (await (mock.mock.calls[0][0] as Request).json()) as { id: string };
    expect(body.id).toBe('r-new');
    expect(pendingRoundOf(A.id, 'r-new')).toBeNull();
    expect(await sendPendingRounds(A.id)).toBe(0);
    expect(requestedRoutes(mock)).toHaveLength(1);
  });

  it('stays in the outbox when the server still cannot be reached', async () => {
    keepPendingRound(pending(A, 'r-new'));
    mockApi({ [POST]: () => Promise.reject(new TypeError('Failed to fetch')) });
    await expect(sendPendingRounds(A.id)).rejects.toMatchObject({ status: 0 });
    expect(pendingRoundOf(A.id, 'r-new')).not.toBeNull();
  });
});
