// Field-mode benchmark (issue 17), the part that runs inside the browser: built by infra/bench-field.mjs into
// one script and put into the signed-in app's page. It uses the app's own modules: the API client with the
// page's session, the round made offline exactly as the New round panel makes it (utils/offline-round), and
// the drafts and outbox in this browser's IndexedDB (lib/sync).
import { createRound, saveRound } from '@/api/resources/rounds';
import type { HeadingDetail, Round, Stage } from '@/features/rounds/api/types';
import { roundDraftsFor } from '@/features/rounds/hooks/use-round-autosave';
import type { JointRow, RoundFormValues } from '@/features/rounds/schemas/round-form';
import { emptyJoint, formValuesOf, newJointId, saveRequestOf } from '@/features/rounds/schemas/round-form';
import { keepPendingRound, provisionalRound } from '@/features/rounds/utils/offline-round';
import { readSession } from '@/lib/session';
import { deviceStore } from '@/lib/sync/device-store';

export interface BenchHeading {
  projectId: string;
  headingId: string;
  chainageSense: NonNullable<HeadingDetail['chainageSense']>;
  stage: Stage;
  timeZone: string;
}

export interface BenchRound {
  roundNumber: number;
  previousChainage: number;
  faceChainage: number;
}

/** Ten invented joints of one round (three sets and strays), with spacing, roughness and a note each. */
export function tenJoints(seed: number): JointRow[] {
  const rows: JointRow[] = [];
  for (let j = 0; j < 10; j++) {
    const dipDirection = (40 + 110 * (j % 3) + ((seed * 7 + j * 3) % 15)) % 360;
    const dip = 35 + ((seed + j * 11) % 50);
    rows.push({
      ...emptyJoint('dip-direction/dip'),
      orientationText: `${String(dipDirection).padStart(3, '0')}/${String(dip).padStart(2, '0')}`,
      spacingM: (0.2 + (j % 4) * 0.15).toFixed(2),
      persistenceM: String(1 + (j % 5)),
      apertureMm: String(j % 3),
      jr: ['1.5', '2', '3'][j % 3],
      ja: ['1', '2', '4'][j % 3],
      notes: `Joint ${j + 1} of round ${seed}: planar, iron-stained, dry`,
    });
  }
  return rows;
}

function withJoints(values: RoundFormValues, seed: number): RoundFormValues {
  return {
    ...values,
    distantParts: `Crown seen from the platform (round ${seed})`,
    groundNotes: 'Blocky, moderately weathered; invented benchmark ground',
    joints: tenJoints(seed),
  };
}

/**
 * Online, as the Round editor does it: each round created (POST with its own id), then its ten joints saved
 * (PUT), one round after the other. Returns the time of all the requests in ms.
 */
async function onlineSaves(heading: BenchHeading, rounds: BenchRound[]): Promise<number> {
  const t0 = performance.now();
  for (const [i, r] of rounds.entries()) {
    const created: Round = await createRound(heading.projectId, heading.headingId, {
      id: newJointId(),
      stage: heading.stage,
      faceChainage: r.faceChainage,
    });
    const values = withJoints(formValuesOf(created), i + 1);
    await saveRound(heading.projectId, created.id, saveRequestOf(values, created.version, r.faceChainage));
  }
  return performance.now() - t0;
}

/**
 * Offline (the network cut): each round opened as the New round panel opens one with no connection (kept in
 * the outbox under its mapper), and its ten joints typed into its draft, as the Round editor keeps them.
 * Everything is in IndexedDB when this resolves; the app's own sender is what sends them after a reload.
 */
async function makeOffline(heading: BenchHeading, rounds: BenchRound[]): Promise<string[]> {
  const session = readSession();
  if (session === null) throw new Error('The bench page is not signed in.');
  await deviceStore.open();
  const drafts = roundDraftsFor(session.user.id);
  const ids: string[] = [];
  for (const [i, r] of rounds.entries()) {
    const id = newJointId();
    const round = provisionalRound({
      id,
      heading: { id: heading.headingId, chainageSense: heading.chainageSense },
      stage: heading.stage,
      faceChainage: r.faceChainage,
      next: { roundNumber: r.roundNumber, previousChainage: r.previousChainage, plannedRoundLength: 3 },
      timeZone: heading.timeZone,
      mapper: { id: session.user.id, name: session.user.name },
    });
    const body = { id, stage: heading.stage, faceChainage: r.faceChainage };
    if (!keepPendingRound({ projectId: heading.projectId, headingId: heading.headingId, body, round }))
      throw new Error('The outbox refused a round.');
    const base = formValuesOf(round);
    const kept = drafts.write({
      key: id,
      baseVersion: round.version,
      savedAt: Date.now(),
      values: withJoints(base, 1000 + i),
      baseValues: base,
      scope: { projectId: heading.projectId },
    });
    if (!kept) throw new Error('The drafts refused a round.');
    ids.push(id);
  }
  await deviceStore.written();
  deviceStore.close();
  return ids;
}

declare global {
  interface Window {
    roundbookFieldBench?: { onlineSaves: typeof onlineSaves; makeOffline: typeof makeOffline };
  }
}

window.roundbookFieldBench = { onlineSaves, makeOffline };
