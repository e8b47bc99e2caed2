import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { resourceKeys } from '@/api/resources/keys';
import { createRound, nextRoundQueryOptions, roundSaved } from '@/api/resources/rounds';
import type { CreateRoundRequest, Stage } from '@/features/rounds/api/types';

export function useNextRound(projectId: string, headingId: string, stage: Stage | null) {
  return useQuery({
    ...nextRoundQueryOptions(projectId, headingId, stage ?? 'full-face'),
    enabled: stage !== null,
  });
}

export function useCreateRound(projectId: string, headingId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.headingRounds(projectId, headingId), 'create'],
    mutationFn: (body: CreateRoundRequest) => createRound(projectId, headingId, body),
    onSuccess: (round) => roundSaved(queryClient, projectId, round, { board: true }),
  });
}
