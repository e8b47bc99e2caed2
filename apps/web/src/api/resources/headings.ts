import type { QueryClient } from '@tanstack/react-query';
import { queryOptions } from '@tanstack/react-query';
import type { CreateHeadingRequest, Heading, UpdateHeadingRequest } from '@/api/contract';
import { invalidateResource } from '@/api/resources/invalidate';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET/POST /projects/{projectId}/headings, GET/PATCH …/headings/{headingId}.

export function getHeadings(projectId: string): Promise<Heading[]> {
  return unwrap(apiClient.GET('/api/projects/{projectId}/headings', { params: { path: { projectId } } }));
}

export const headingsQueryOptions = (projectId: string) =>
  queryOptions({ queryKey: resourceKeys.headings(projectId), queryFn: () => getHeadings(projectId) });

export function getHeading(projectId: string, headingId: string): Promise<Heading> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/headings/{headingId}', {
      params: { path: { projectId, headingId } },
    }),
  );
}

/** One heading: drive, chainage style, profile, planned round length. */
export const headingQueryOptions = (projectId: string, headingId: string) =>
  queryOptions({
    queryKey: resourceKeys.heading(projectId, headingId),
    queryFn: () => getHeading(projectId, headingId),
  });

export function createHeading(projectId: string, body: CreateHeadingRequest): Promise<Heading> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/headings', { params: { path: { projectId } }, body }),
  );
}

export function updateHeading(
  projectId: string,
  headingId: string,
  body: UpdateHeadingRequest,
): Promise<Heading> {
  return unwrap(
    apiClient.PATCH('/api/projects/{projectId}/headings/{headingId}', {
      params: { path: { projectId, headingId } },
      body,
    }),
  );
}

/**
 * After a heading is saved: the heading itself, the project's list of headings, the projects (they
 * carry heading summaries for the Board) and the project's rounds (their warnings read the heading's
 * planned round length) are read again.
 */
export async function headingSaved(
  queryClient: QueryClient,
  projectId: string,
  heading: Heading,
): Promise<void> {
  queryClient.setQueryData(resourceKeys.heading(projectId, heading.id), heading);
  await Promise.all([
    invalidateResource(queryClient, resourceKeys.headings(projectId), { exact: true }),
    invalidateResource(queryClient, resourceKeys.projects(), { exact: true }),
    invalidateResource(queryClient, resourceKeys.project(projectId), { exact: true }),
    invalidateResource(queryClient, resourceKeys.rounds(projectId)),
  ]);
}
