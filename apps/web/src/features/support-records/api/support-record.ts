import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { SaveSupportRecordRequest } from '@/api/contract';
import { resourceKeys } from '@/api/resources/keys';
import {
  saveSupportRecord,
  supportRecordChanged,
  supportRecordQueryOptions,
} from '@/api/resources/support-records';

export function useSupportRecord(projectId: string, roundId: string) {
  return useQuery(supportRecordQueryOptions(projectId, roundId));
}

/** Saves the whole checklist with the version read; the answer becomes the cached record. */
export function useSaveSupportRecord(projectId: string, roundId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...resourceKeys.roundSupportRecord(projectId, roundId), 'save'],
    mutationFn: (body: SaveSupportRecordRequest) => saveSupportRecord(projectId, roundId, body),
    onSuccess: (record) => supportRecordChanged(queryClient, projectId, record),
  });
}
