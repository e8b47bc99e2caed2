import type { QueryClient } from '@tanstack/react-query';
import { queryOptions } from '@tanstack/react-query';
import type { CloseHazardRequest, CreateHazardRequest, Hazard, UpdateHazardRequest } from '@/api/contract';
import { invalidateResource } from '@/api/resources/invalidate';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET/POST /projects/{projectId}/headings/{headingId}/hazards, GET/PATCH …/{hazardId}, POST …/{hazardId}/close.

interface HeadingPath {
  projectId: string;
  headingId: string;
}

export function getHazards({ projectId, headingId }: HeadingPath): Promise<Hazard[]> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/headings/{headingId}/hazards', {
      params: { path: { projectId, headingId } },
    }),
  );
}

/** The heading's register as the server orders it: open ones first (red, amber, green; by chainage). */
export const hazardsQueryOptions = (projectId: string, headingId: string) =>
  queryOptions({
    queryKey: resourceKeys.headingHazards(projectId, headingId),
    queryFn: () => getHazards({ projectId, headingId }),
  });

/** Raises a hazard; the body's id (made by the client) makes a retry find the first one. */
export function createHazard(at: HeadingPath, body: CreateHazardRequest): Promise<Hazard> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/headings/{headingId}/hazards', {
      params: { path: at },
      body,
    }),
  );
}

export function updateHazard(at: HeadingPath, hazardId: string, body: UpdateHazardRequest): Promise<Hazard> {
  return unwrap(
    apiClient.PATCH('/api/projects/{projectId}/headings/{headingId}/hazards/{hazardId}', {
      params: { path: { ...at, hazardId } },
      body,
    }),
  );
}

export function closeHazard(at: HeadingPath, hazardId: string, body: CloseHazardRequest): Promise<Hazard> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/headings/{headingId}/hazards/{hazardId}/close', {
      params: { path: { ...at, hazardId } },
      body,
    }),
  );
}

/** After a hazard changes, the heading's register is read again (rounds read it on their next save). */
export async function hazardsChanged(queryClient: QueryClient, at: HeadingPath): Promise<void> {
  await invalidateResource(queryClient, resourceKeys.headingHazards(at.projectId, at.headingId));
}
