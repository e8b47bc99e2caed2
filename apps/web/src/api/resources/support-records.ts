import type { QueryClient } from '@tanstack/react-query';
import { queryOptions } from '@tanstack/react-query';
import type { SaveSupportRecordRequest, SupportRecord } from '@/api/contract';
import { invalidateResource } from '@/api/resources/invalidate';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET/PUT /projects/{projectId}/rounds/{roundId}/support-record.

export function getSupportRecord(projectId: string, roundId: string): Promise<SupportRecord> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/rounds/{roundId}/support-record', {
      params: { path: { projectId, roundId } },
    }),
  );
}

/** The round's checklist: as recorded, or prefilled from the confirmed class until the first save. */
export const supportRecordQueryOptions = (projectId: string, roundId: string) =>
  queryOptions({
    queryKey: resourceKeys.roundSupportRecord(projectId, roundId),
    queryFn: () => getSupportRecord(projectId, roundId),
  });

export function saveSupportRecord(
  projectId: string,
  roundId: string,
  body: SaveSupportRecordRequest,
): Promise<SupportRecord> {
  return unwrap(
    apiClient.PUT('/api/projects/{projectId}/rounds/{roundId}/support-record', {
      params: { path: { projectId, roundId } },
      body,
    }),
  );
}

/** After a save: the record is the server's answer; the Board's flag (the project) is read again. */
export async function supportRecordChanged(
  queryClient: QueryClient,
  projectId: string,
  record: SupportRecord,
): Promise<void> {
  queryClient.setQueryData(resourceKeys.roundSupportRecord(projectId, record.roundId), record);
  await Promise.all([
    invalidateResource(queryClient, resourceKeys.project(projectId), { exact: true }),
    invalidateResource(queryClient, resourceKeys.projects(), { exact: true }),
  ]);
}
