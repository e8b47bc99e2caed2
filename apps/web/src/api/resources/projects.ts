import type { QueryClient } from '@tanstack/react-query';
import { queryOptions } from '@tanstack/react-query';
import type { CreateProjectRequest, ProjectSummary, UpdateProjectRequest } from '@/api/contract';
import { invalidateResource } from '@/api/resources/invalidate';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET/POST /projects, GET/PATCH /projects/{projectId}.

export function getProjects(): Promise<ProjectSummary[]> {
  return unwrap(apiClient.GET('/api/projects'));
}

export const projectsQueryOptions = () =>
  queryOptions({ queryKey: resourceKeys.projects(), queryFn: getProjects });

export function getProject(projectId: string): Promise<ProjectSummary> {
  return unwrap(apiClient.GET('/api/projects/{projectId}', { params: { path: { projectId } } }));
}

/** The project with its settings (notation, ground scale, time zone); Setup and the Round screen read it. */
export const projectQueryOptions = (projectId: string) =>
  queryOptions({ queryKey: resourceKeys.project(projectId), queryFn: () => getProject(projectId) });

/** A new project; the caller becomes its admin. 409 (fields.code) when the code is taken. */
export function createProject(body: CreateProjectRequest): Promise<ProjectSummary> {
  return unwrap(apiClient.POST('/api/projects', { body }));
}

export function updateProject(projectId: string, body: UpdateProjectRequest): Promise<ProjectSummary> {
  return unwrap(apiClient.PATCH('/api/projects/{projectId}', { params: { path: { projectId } }, body }));
}

/** After a create or an update: the answer is the project; the Board's list is read again. */
export function projectSaved(queryClient: QueryClient, project: ProjectSummary): Promise<void> {
  queryClient.setQueryData(resourceKeys.project(project.id), project);
  return invalidateResource(queryClient, resourceKeys.projects(), { exact: true });
}
