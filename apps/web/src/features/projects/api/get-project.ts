import { useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { projectQueryOptions, projectsQueryOptions } from '@/api/resources/projects';

export function useProjects() {
  return useSuspenseQuery(projectsQueryOptions());
}

export function useProject(projectId: string) {
  return useSuspenseQuery(projectQueryOptions(projectId));
}

/** Reads the project from the server now (into the one cache entry), e.g. after a 409. */
export function useReloadProject(projectId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.fetchQuery({ ...projectQueryOptions(projectId), staleTime: 0 });
}
