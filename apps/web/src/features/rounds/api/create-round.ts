import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { resourceKeys } from '@/api/resources/keys';
import { createRound, nextRoundQueryOptions, roundSaved } from '@/api/resources/rounds';
import type { HeadingDetail, NextRound, ProjectDetail, Round, Stage } from '@/features/rounds/api/types';
import { newJointId } from '@/features/rounds/schemas/round-form';
import { keepPendingRound, provisionalRound } from '@/features/rounds/utils/offline-round';
import { isApiError } from '@/lib/api-client';
import { readSession } from '@/lib/session';

export function useNextRound(projectId: string, headingId: string, stage: Stage | null) {
  return useQuery({
    ...nextRoundQueryOptions(projectId, headingId, stage ?? 'full-face'),
    enabled: stage !== null,
  });
}

export interface CreateRoundInput {
  stage: Stage;
  faceChainage: number;
  /** What /next said (from this device's cache when offline): lets the round open with no connection. */
  next?: NextRound;
}

/**
 * Opens a round with an id made here. With no connection it opens all the same, from what this device
 * knows, and waits in the outbox until it can be created (lib/sync/outbox, utils/offline-round).
 */
export function useCreateRound(projectId: string, heading: Pick<HeadingDetail, 'id' | 'chainageSense'>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.headingRounds(projectId, heading.id), 'create'],
    // Not paused while the browser says offline: the offline branch below is what should run then.
    networkMode: 'always',
    mutationFn: async ({ stage, faceChainage, next }: CreateRoundInput): Promise<Round> => {
      const body = { id: newJointId(), stage, faceChainage };
      try {
        return await createRound(projectId, heading.id, body);
      } catch (error) {
        const session = readSession();
        if (!isApiError(error) || error.status !== 0 || next === undefined || session === null) throw error;
        const project = queryClient.getQueryData<ProjectDetail>(resourceKeys.project(projectId));
        const round = provisionalRound({
          id: body.id,
          heading,
          stage,
          faceChainage,
          next,
          timeZone: project?.timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone,
          mapper: { id: session.user.id, name: session.user.name },
        });
        if (!keepPendingRound({ projectId, headingId: heading.id, body, round })) throw error;
        return round;
      }
    },
    onSuccess: (round) => roundSaved(queryClient, projectId, round, { board: true }),
  });
}
