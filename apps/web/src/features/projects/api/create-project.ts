import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateProjectRequest, ProjectSummary } from '@/api/contract';
import { projectKeys } from '@/features/projects/api/get-projects';
import { apiClient, unwrap } from '@/lib/api-client';

/** A new project; the caller becomes its admin. 409 (fields.code) when the code is taken. */
export function createProject(body: CreateProjectRequest): Promise<ProjectSummary> {
  return unwrap(apiClient.POST('/api/projects', { body }));
}

export function useCreateProject() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...projectKeys.all, 'create'],
    mutationFn: createProject,
    onSuccess: (project) => {
      queryClient.setQueryData(projectKeys.detail(project.id), project);
      return queryClient.invalidateQueries({ queryKey: projectKeys.list() });
    },
  });
}
