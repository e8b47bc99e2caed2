import type { QueryClient } from '@tanstack/react-query';
import { queryOptions } from '@tanstack/react-query';
import type {
  CreateSupportClassRequest,
  SupportClassLibrary,
  UpdateSupportClassRequest,
} from '@/api/contract';
import { invalidateResource } from '@/api/resources/invalidate';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET/POST /projects/{projectId}/support-classes, PATCH/DELETE …/{classId}, PUT …/order.

/** The project's classes, best ground first, with the range warnings of the active ones. */
export function getSupportClasses(projectId: string): Promise<SupportClassLibrary> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/support-classes', { params: { path: { projectId } } }),
  );
}

/** One entry for Setup's library and for the Round screen's Support section. */
export const supportClassesQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: resourceKeys.supportClasses(projectId),
    queryFn: () => getSupportClasses(projectId),
  });

export function createSupportClass(
  projectId: string,
  body: CreateSupportClassRequest,
): Promise<SupportClassLibrary> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/support-classes', { params: { path: { projectId } }, body }),
  );
}

export function updateSupportClass(
  projectId: string,
  classId: string,
  body: UpdateSupportClassRequest,
): Promise<SupportClassLibrary> {
  return unwrap(
    apiClient.PATCH('/api/projects/{projectId}/support-classes/{classId}', {
      params: { path: { projectId, classId } },
      body,
    }),
  );
}

export function deleteSupportClass(projectId: string, classId: string): Promise<SupportClassLibrary> {
  return unwrap(
    apiClient.DELETE('/api/projects/{projectId}/support-classes/{classId}', {
      params: { path: { projectId, classId } },
    }),
  );
}

export function reorderSupportClasses(projectId: string, ids: string[]): Promise<SupportClassLibrary> {
  return unwrap(
    apiClient.PUT('/api/projects/{projectId}/support-classes/order', {
      params: { path: { projectId } },
      body: { ids },
    }),
  );
}

/**
 * After any change of the library. The answer is the whole library: it replaces the one cache entry,
 * so Setup and an open round show it at once. The project's rounds are read again, since the server
 * suggests classes from today's ranges.
 */
export function supportClassesChanged(
  queryClient: QueryClient,
  projectId: string,
  library: SupportClassLibrary,
): Promise<void> {
  queryClient.setQueryData(resourceKeys.supportClasses(projectId), library);
  return invalidateResource(queryClient, resourceKeys.rounds(projectId));
}
