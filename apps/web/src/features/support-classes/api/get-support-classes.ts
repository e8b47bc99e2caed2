import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { SupportClassLibrary } from '@/api/contract';
import { apiClient, unwrap } from '@/lib/api-client';

export const supportClassKeys = {
  all: ['support-classes'] as const,
  library: (projectId: string) => [...supportClassKeys.all, projectId, 'library'] as const,
};

/** The project's classes, best ground first, with the range warnings of the active ones. */
export function getSupportClasses(projectId: string): Promise<SupportClassLibrary> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/support-classes', { params: { path: { projectId } } }),
  );
}

export const supportClassesQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: supportClassKeys.library(projectId),
    queryFn: () => getSupportClasses(projectId),
  });

export function useSupportClasses(projectId: string) {
  return useSuspenseQuery(supportClassesQueryOptions(projectId));
}
