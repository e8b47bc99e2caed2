import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { roundKeys } from '@/features/rounds/api/keys';
import type { CreateRoundRequest, NextRound, Round, Stage } from '@/features/rounds/api/types';
import { apiClient, unwrap } from '@/lib/api-client';

export function getNextRound(projectId: string, headingId: string, stage: Stage): Promise<NextRound> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/headings/{headingId}/rounds/next', {
      params: { path: { projectId, headingId }, query: { stage } },
    }),
  );
}

export const nextRoundQueryOptions = (projectId: string, headingId: string, stage: Stage) =>
  queryOptions({
    queryKey: roundKeys.next(projectId, headingId, stage),
    queryFn: () => getNextRound(projectId, headingId, stage),
    staleTime: 0,
  });

export function useNextRound(projectId: string, headingId: string, stage: Stage | null) {
  return useQuery({
    ...nextRoundQueryOptions(projectId, headingId, stage ?? 'full-face'),
    enabled: stage !== null,
  });
}

export function createRound(projectId: string, headingId: string, body: CreateRoundRequest): Promise<Round> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/headings/{headingId}/rounds', {
      params: { path: { projectId, headingId } },
      body,
    }),
  );
}

export function useCreateRound(projectId: string, headingId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateRoundRequest) => createRound(projectId, headingId, body),
    onSuccess: async (round) => {
      queryClient.setQueryData(roundKeys.detail(projectId, round.id), round);
      await queryClient.invalidateQueries({ queryKey: roundKeys.heading(projectId, headingId) });
    },
  });
}
