import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { ProjectSummary } from '@/api/contract';
import { projectKeys } from '@/features/projects/api/get-projects';
import { apiClient, unwrap } from '@/lib/api-client';

export function getProject(projectId: string): Promise<ProjectSummary> {
  return unwrap(apiClient.GET('/api/projects/{projectId}', { params: { path: { projectId } } }));
}

export const projectQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: projectKeys.detail(projectId),
    queryFn: () => getProject(projectId),
  });

export function useProject(projectId: string) {
  return useSuspenseQuery(projectQueryOptions(projectId));
}
