import { DEFAULT_SET_PARAMETERS, emptyGround, roundLengthOf, shiftOf } from '@roundbook/domain';
import type { QueryClient } from '@tanstack/react-query';
import { createRound, roundSaved } from '@/api/resources/rounds';
import type { CreateRoundRequest, HeadingDetail, Round, Stage } from '@/features/rounds/api/types';
import { newJointId } from '@/features/rounds/schemas/round-form';
import { outbox } from '@/lib/sync/outbox';

/**
 * A round opened with no connection (underground): made here with its own id, shown at once from what
 * this device knows (the heading, the last round of the stage), kept in the outbox and created on the
 * server, once, when the connection is back (the id makes a retried create find the same round).
 */
export const CREATE_ROUND = 'create-round';

export interface PendingRound {
  projectId: string;
  headingId: string;
  body: CreateRoundRequest & { id: string };
  /** The round as shown until the server has it. */
  round: Round;
}

export interface ProvisionalInput {
  heading: Pick<HeadingDetail, 'id' | 'chainageSense'>;
  stage: Stage;
  faceChainage: number;
  next: { roundNumber: number; previousChainage: number; plannedRoundLength: number };
  timeZone: string;
  mapper: { id: string; name: string };
  now?: Date;
  id?: string;
}

const notYet = {
  value: null,
  label: null,
  error: 'Not worked out yet: the round is on this device only.',
  parts: {},
};

/** The round as the server would open it (same defaults); ratings and triggers wait for the first save. */
export function provisionalRound(input: ProvisionalInput): Round {
  const now = input.now ?? new Date();
  return {
    id: input.id ?? newJointId(),
    headingId: input.heading.id,
    stage: input.stage,
    roundNumber: input.next.roundNumber,
    faceChainage: input.faceChainage,
    previousChainage: input.next.previousChainage,
    roundLength: roundLengthOf(input.faceChainage, input.next.previousChainage, input.heading.chainageSense),
    ...shiftOf(now, input.timeZone),
    mappedBy: input.mapper.id,
    mappedByName: input.mapper.name,
    mappedAt: now.toISOString(),
    distantParts: '',
    ground: emptyGround(),
    joints: [],
    qInput: null,
    rmrInput: null,
    gsiObserved: null,
    sketch: null,
    setParameters: DEFAULT_SET_PARAMETERS as Round['setParameters'],
    ratings: { q: notYet, rmr: notYet, gsi: notYet },
    inflowPer10m: null,
    suggestedClassIds: [],
    recommendedClassId: null,
    confirmedClassId: null,
    confirmedRoundLength: null,
    nextRoundLength: null,
    recommendationReason: '',
    status: 'draft',
    triggerLevel: null,
    triggerFirings: [],
    triggersNotEvaluated: [],
    triggersWaiting: [],
    assessment: {},
    assessmentVersion: '',
    revision: 1,
    submittedAt: null,
    warnings: [],
    plannedRoundLength: input.next.plannedRoundLength,
    version: 1,
  };
}

/** Keeps a round opened offline in the outbox of its mapper; false when the browser refused. */
export function keepPendingRound(pending: PendingRound): boolean {
  return outbox.put<PendingRound>({
    id: pending.body.id,
    kind: CREATE_ROUND,
    owner: pending.round.mappedBy,
    createdAt: Date.now(),
    payload: pending,
  });
}

export function pendingRoundOf(owner: string, roundId: string): PendingRound | null {
  const entry = outbox.find<PendingRound>(owner, roundId);
  return entry !== null && entry.kind === CREATE_ROUND ? entry.payload : null;
}

const sending = new Map<string, Promise<Round>>();

/**
 * Creates a round opened offline on the server (one request at a time per round) and takes it out of
 * the outbox; null when the round is not waiting. Throws the API's error when it could not be sent.
 */
export function sendPendingRound(
  owner: string,
  roundId: string,
  queryClient?: QueryClient,
): Promise<Round | null> {
  const pending = pendingRoundOf(owner, roundId);
  if (pending === null) return Promise.resolve(null);
  const running = sending.get(roundId);
  if (running !== undefined) return running;
  const run = createRound(pending.projectId, pending.headingId, pending.body)
    .then(async (round) => {
      outbox.remove(owner, roundId);
      if (queryClient !== undefined)
        await roundSaved(queryClient, pending.projectId, round, { board: true, waitForLists: false });
      return round;
    })
    .finally(() => sending.delete(roundId));
  sending.set(roundId, run);
  return run;
}

/** Sends every round the person opened offline, oldest first; stops at the first that fails. */
export async function sendPendingRounds(owner: string, queryClient?: QueryClient): Promise<number> {
  let sent = 0;
  for (const entry of outbox.list<PendingRound>(owner, CREATE_ROUND)) {
    await sendPendingRound(owner, entry.id, queryClient);
    sent += 1;
  }
  return sent;
}
