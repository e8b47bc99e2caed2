import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { RoundListFilters } from '@/features/rounds/api/keys';
import { roundKeys } from '@/features/rounds/api/keys';
import type { RoundPage } from '@/features/rounds/api/types';
import { apiClient, unwrap } from '@/lib/api-client';

export function getRounds(
  projectId: string,
  headingId: string,
  filters: RoundListFilters,
): Promise<RoundPage> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/headings/{headingId}/rounds', {
      params: { path: { projectId, headingId }, query: filters },
    }),
  );
}

export const roundsQueryOptions = (projectId: string, headingId: string, filters: RoundListFilters) =>
  queryOptions({
    queryKey: roundKeys.list(projectId, headingId, filters),
    queryFn: () => getRounds(projectId, headingId, filters),
    // Paging and sorting keep the last page on screen until the next one arrives.
    placeholderData: keepPreviousData,
  });

export function useRounds(projectId: string, headingId: string, filters: RoundListFilters) {
  return useQuery(roundsQueryOptions(projectId, headingId, filters));
}
