import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ProjectSummary, UpdateProjectRequest } from '@/api/contract';
import { projectKeys } from '@/features/projects/api/get-projects';
import { apiClient, unwrap } from '@/lib/api-client';

export function updateProject(projectId: string, body: UpdateProjectRequest): Promise<ProjectSummary> {
  return unwrap(apiClient.PATCH('/api/projects/{projectId}', { params: { path: { projectId } }, body }));
}

export function useUpdateProject(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...projectKeys.detail(projectId), 'update'],
    mutationFn: (body: UpdateProjectRequest) => updateProject(projectId, body),
    onSuccess: (project) => {
      queryClient.setQueryData(projectKeys.detail(projectId), project);
      return queryClient.invalidateQueries({ queryKey: projectKeys.list() });
    },
  });
}
