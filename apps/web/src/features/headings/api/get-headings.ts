import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { Heading } from '@/api/contract';
import { apiClient, unwrap } from '@/lib/api-client';

export const headingKeys = {
  all: ['headings'] as const,
  list: (projectId: string) => [...headingKeys.all, projectId, 'list'] as const,
};

export function getHeadings(projectId: string): Promise<Heading[]> {
  return unwrap(apiClient.GET('/api/projects/{projectId}/headings', { params: { path: { projectId } } }));
}

export const headingsQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: headingKeys.list(projectId),
    queryFn: () => getHeadings(projectId),
  });

export function useHeadings(projectId: string) {
  return useSuspenseQuery(headingsQueryOptions(projectId));
}
