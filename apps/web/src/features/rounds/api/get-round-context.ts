import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { roundKeys } from '@/features/rounds/api/keys';
import type { HeadingDetail, ProjectDetail, SupportClassLibrary } from '@/features/rounds/api/types';
import { apiClient, unwrap } from '@/lib/api-client';

// What a round is read against: its project (notation, ground scale, time zone), its heading (drive,
// chainage style, planned round length) and the project's support classes.

export function getProjectDetail(projectId: string): Promise<ProjectDetail> {
  return unwrap(apiClient.GET('/api/projects/{projectId}', { params: { path: { projectId } } }));
}

export function getHeading(projectId: string, headingId: string): Promise<HeadingDetail> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/headings/{headingId}', {
      params: { path: { projectId, headingId } },
    }),
  );
}

export function getSupportClasses(projectId: string): Promise<SupportClassLibrary> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/support-classes', { params: { path: { projectId } } }),
  );
}

export const projectDetailQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: roundKeys.projectDetail(projectId),
    queryFn: () => getProjectDetail(projectId),
  });

export const headingQueryOptions = (projectId: string, headingId: string) =>
  queryOptions({
    queryKey: [...roundKeys.heading(projectId, headingId), 'detail'] as const,
    queryFn: () => getHeading(projectId, headingId),
  });

export const supportClassesQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: roundKeys.supportClasses(projectId),
    queryFn: () => getSupportClasses(projectId),
  });

export function useProjectDetail(projectId: string) {
  return useSuspenseQuery(projectDetailQueryOptions(projectId));
}

export function useHeading(projectId: string, headingId: string) {
  return useSuspenseQuery(headingQueryOptions(projectId, headingId));
}

export function useSupportClasses(projectId: string) {
  return useSuspenseQuery(supportClassesQueryOptions(projectId));
}
