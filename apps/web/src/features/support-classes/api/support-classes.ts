import { useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import type { CreateSupportClassRequest, UpdateSupportClassRequest } from '@/api/contract';
import { resourceKeys } from '@/api/resources/keys';
import {
  createSupportClass,
  deleteSupportClass,
  reorderSupportClasses,
  supportClassesChanged,
  supportClassesQueryOptions,
  updateSupportClass,
} from '@/api/resources/support-classes';

export function useSupportClasses(projectId: string) {
  return useSuspenseQuery(supportClassesQueryOptions(projectId));
}

/** Reads the library from the server now (into its one cache entry), e.g. after a 409. */
export function useReloadSupportClasses(projectId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.fetchQuery({ ...supportClassesQueryOptions(projectId), staleTime: 0 });
}

export type SupportClassChange =
  | { kind: 'create'; body: CreateSupportClassRequest }
  | { kind: 'update'; classId: string; body: UpdateSupportClassRequest }
  | { kind: 'delete'; classId: string }
  | { kind: 'reorder'; ids: string[] };

function run(projectId: string, change: SupportClassChange) {
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

/** Every change answers with the whole library (classes and warnings); see `supportClassesChanged`. */
export function useChangeSupportClasses(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.supportClasses(projectId), 'change'],
    mutationFn: (change: SupportClassChange) => run(projectId, change),
    onSuccess: (library) => supportClassesChanged(queryClient, projectId, library),
  });
}
