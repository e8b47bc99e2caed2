import type { Round, SaveRoundRequest } from '@/features/rounds/api/types';
import { roundDraftsFor } from '@/features/rounds/hooks/use-round-autosave';
import { formValuesOf } from '@/features/rounds/schemas/round-form';
import { draftRound, heading } from '@/features/rounds/testing/round-fixtures';
import { sendWaitingRounds } from '@/features/rounds/utils/background-sender';
import { keepPendingRound, pendingRoundOf, provisionalRound } from '@/features/rounds/utils/offline-round';
import { clearSession, saveSession } from '@/lib/session';
import { jsonResponse, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';

// The app shell's sender: rounds no longer on screen are sent when the connection is back, in order per
// round, and only while their own person is signed in.

const A = { id: 'u-a', name: 'Tobin Maelor' };
const signIn = (user: { id: string; name: string }) =>
  saveSession({
    accessToken: `t-${user.id}`,
    expiresAt: '2099-01-01T00:00:00Z',
    user: { ...user, email: 'a@x.test' },
  });

const POST = 'POST /api/projects/p-1/headings/h-1/rounds';
const PUT = (id: string) => `PUT /api/projects/p-1/rounds/${id}`;

function keepTyping(owner: string, round: Round, distantParts: string) {
  roundDraftsFor(owner).write({
    key: round.id,
    baseVersion: round.version,
    savedAt: 1000,
    values: { ...formValuesOf(round), distantParts },
    baseValues: formValuesOf(round),
    scope: { projectId: 'p-1' },
  });
}

function openedOffline(id: string): Round {
  const round = provisionalRound({
    id,
    heading,
    stage: 'full-face',
    faceChainage: 1253.5,
    next: { roundNumber: 19, previousChainage: 1250, plannedRoundLength: 3.5 },
    timeZone: 'Europe/London',
    mapper: A,
  });
  keepPendingRound({
    projectId: 'p-1',
    headingId: 'h-1',
    body: { id, stage: 'full-face', faceChainage: 1253.5 },
    round,
  });
  return round;
}

/** The API: saves answer the record one version on. */
const savesOn = (base: Round) => async (request: Request) => {
  const body = (await request.clone().json()) as SaveRoundRequest;
  return jsonResponse({ ...base, distantParts: body.distantParts, version: body.version + 1 });
};

afterEach(() => {
  restoreFetch();
  clearSession();
});

describe('the background sender', () => {
  it('creates a round opened offline, then saves its typing on top, with its editor closed', async () => {
    signIn(A);
    const round = openedOffline('r-new');
    keepTyping(A.id, round, 'Crown seen from the platform');
    const mock = mockApi({
      [POST]: () => jsonResponse({ ...round, version: 1 }, 201),
      [PUT('r-new')]: savesOn(round),
    });

    expect(await sendWaitingRounds(A.id)).toEqual({ sent: 2, leftForEditor: [] });
    expect(requestedRoutes(mock)).toEqual([POST, PUT('r-new')]);
    const put = (await (mock.mock.calls[1][0] as Request).json()) as SaveRoundRequest;
    expect(put).toMatchObject({ version: 1, distantParts: 'Crown seen from the platform' });
    expect(pendingRoundOf(A.id, 'r-new')).toBeNull();
    expect(roundDraftsFor(A.id).keys()).toEqual([]);
    // Nothing waits: a second run sends nothing.
    expect(await sendWaitingRounds(A.id)).toEqual({ sent: 0, leftForEditor: [] });
    expect(requestedRoutes(mock)).toHaveLength(2);
  });

  it('leaves rounds open in an editor to the editor, and sends nothing for another person', async () => {
    keepTyping(A.id, draftRound, 'Typed by A');
    const mock = mockApi({ [PUT(draftRound.id)]: savesOn(draftRound) });

    signIn({ id: 'u-b', name: 'Ailsa Drummond' });
    expect(await sendWaitingRounds(A.id)).toEqual({ sent: 0, leftForEditor: [] });
    signIn(A);
    expect(await sendWaitingRounds(A.id, { isOpen: (id) => id === draftRound.id })).toEqual({
      sent: 0,
      leftForEditor: [],
    });
    expect(requestedRoutes(mock)).toEqual([]);
    expect(roundDraftsFor(A.id).read(draftRound.id)?.values.distantParts).toBe('Typed by A');
  });

  it('treats a 409 that holds exactly the typing as sent (the first try landed, its answer was lost)', async () => {
    signIn(A);
    keepTyping(A.id, draftRound, 'Left wall blocky');
    const landed = { ...draftRound, distantParts: 'Left wall blocky', version: draftRound.version + 1 };
    mockApi({
      [PUT(draftRound.id)]: () =>
        jsonResponse({ code: 'STALE_VERSION', message: 'Saved first', details: { current: landed } }, 409),
    });
    expect(await sendWaitingRounds(A.id)).toEqual({ sent: 0, leftForEditor: [] });
    expect(roundDraftsFor(A.id).keys()).toEqual([]);
  });

  it('keeps typing the server moved past (for its editor to show), and stops when unreachable', async () => {
    signIn(A);
    keepTyping(A.id, draftRound, 'Mine');
    const theirs = { ...draftRound, distantParts: 'Theirs', version: draftRound.version + 1 };
    mockApi({
      [PUT(draftRound.id)]: () =>
        jsonResponse({ code: 'STALE_VERSION', message: 'Saved first', details: { current: theirs } }, 409),
    });
    expect(await sendWaitingRounds(A.id)).toEqual({ sent: 0, leftForEditor: [draftRound.id] });
    expect(roundDraftsFor(A.id).read(draftRound.id)?.values.distantParts).toBe('Mine');

    mockApi({ [PUT(draftRound.id)]: () => Promise.reject(new TypeError('Failed to fetch')) });
    await expect(sendWaitingRounds(A.id)).rejects.toMatchObject({ status: 0 });
    expect(roundDraftsFor(A.id).read(draftRound.id)?.values.distantParts).toBe('Mine');
  });
});
