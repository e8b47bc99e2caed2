import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { roundKeys } from '@/features/rounds/api/keys';
import type { Round } from '@/features/rounds/api/types';
import { apiClient, unwrap } from '@/lib/api-client';

export function getRound(projectId: string, roundId: string): Promise<Round> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/rounds/{roundId}', { params: { path: { projectId, roundId } } }),
  );
}

export const roundQueryOptions = (projectId: string, roundId: string) =>
  queryOptions({
    queryKey: roundKeys.detail(projectId, roundId),
    queryFn: () => getRound(projectId, roundId),
    // The editor owns the record while it is open; a background refetch must not replace the typing.
    staleTime: Infinity,
  });

export function useRound(projectId: string, roundId: string) {
  return useSuspenseQuery(roundQueryOptions(projectId, roundId));
}
