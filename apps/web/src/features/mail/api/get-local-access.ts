import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { components } from '@/api/generated/schema';
import { apiClient, unwrap } from '@/lib/api-client';

export type LocalAccess = components['schemas']['LocalAccessDto'];

export const localAccessKeys = { all: ['local-access'] as const };

/** Whether the signed-in person may open the local mail and jobs view (local mode, instance operator). */
export function getLocalAccess(): Promise<LocalAccess> {
  return unwrap(apiClient.GET('/api/local/access'));
}

export const localAccessQueryOptions = () =>
  queryOptions({ queryKey: localAccessKeys.all, queryFn: getLocalAccess, staleTime: 60_000 });

export function useLocalAccess() {
  return useSuspenseQuery(localAccessQueryOptions());
}
