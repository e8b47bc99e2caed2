import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateProjectRequest } from '@/api/contract';
import { resourceKeys } from '@/api/resources/keys';
import { createProject, projectSaved, updateProject } from '@/api/resources/projects';

export function useCreateProject() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.projects(), 'create'],
    mutationFn: createProject,
    onSuccess: (project) => projectSaved(queryClient, project),
  });
}

export function useUpdateProject(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.project(projectId), 'update'],
    mutationFn: (body: UpdateProjectRequest) => updateProject(projectId, body),
    onSuccess: (project) => projectSaved(queryClient, project),
  });
}
