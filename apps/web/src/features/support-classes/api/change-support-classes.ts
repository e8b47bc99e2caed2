import { useMutation, useQueryClient } from '@tanstack/react-query';
import type {
  CreateSupportClassRequest,
  SupportClassLibrary,
  UpdateSupportClassRequest,
} from '@/api/contract';
import { supportClassKeys } from '@/features/support-classes/api/get-support-classes';
import { apiClient, unwrap } from '@/lib/api-client';

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

export type SupportClassChange =
  | { kind: 'create'; body: CreateSupportClassRequest }
  | { kind: 'update'; classId: string; body: UpdateSupportClassRequest }
  | { kind: 'delete'; classId: string }
  | { kind: 'reorder'; ids: string[] };

function run(projectId: string, change: SupportClassChange): Promise<SupportClassLibrary> {
  switch (change.kind) {
    case 'create':
      return createSupportClass(projectId, change.body);
    case 'update':
      return updateSupportClass(projectId, change.classId, change.body);
    case 'delete':
      return deleteSupportClass(projectId, change.classId);
    case 'reorder':
      return reorderSupportClasses(projectId, change.ids);
  }
}

/** Every change answers with the whole library (classes and warnings); it replaces the cached one. */
export function useChangeSupportClasses(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...supportClassKeys.all, projectId, 'change'],
    mutationFn: (change: SupportClassChange) => run(projectId, change),
    onSuccess: (library) => queryClient.setQueryData(supportClassKeys.library(projectId), library),
  });
}
