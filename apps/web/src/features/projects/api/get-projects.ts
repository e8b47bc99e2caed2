import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { ProjectSummary } from '@/api/contract';
import { apiClient, unwrap } from '@/lib/api-client';

export const projectKeys = {
  all: ['projects'] as const,
  list: () => [...projectKeys.all, 'list'] as const,
  detail: (projectId: string) => [...projectKeys.all, 'detail', projectId] as const,
};

export function getProjects(): Promise<ProjectSummary[]> {
  return unwrap(apiClient.GET('/api/projects'));
}

export const projectsQueryOptions = () =>
  queryOptions({
    queryKey: projectKeys.list(),
    queryFn: getProjects,
  });

export function useProjects() {
  return useSuspenseQuery(projectsQueryOptions());
}
