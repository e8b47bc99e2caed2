import { queryOptions } from '@tanstack/react-query';
import type { components } from '@/api/generated/schema';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET /handovers/received; POST /projects/{projectId}/handovers/{handoverId}/acknowledge;
// GET /projects/{projectId}/handovers/{handoverId}/pdf.

type Schemas = components['schemas'];
export type Handover = Schemas['HandoverDto'];

export function getReceivedHandovers(): Promise<Handover[]> {
  return unwrap(apiClient.GET('/api/handovers/received'));
}

export const receivedHandoversQueryOptions = () =>
  queryOptions({
    queryKey: resourceKeys.receivedHandovers(),
    queryFn: getReceivedHandovers,
    // A new handover may arrive while the page is open at shift change.
    refetchInterval: 60_000,
  });

export function acknowledgeHandover(
  projectId: string,
  handoverId: string,
  body: Schemas['AcknowledgeHandoverDto'],
): Promise<Handover> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/handovers/{handoverId}/acknowledge', {
      params: { path: { projectId, handoverId } },
      body,
    }),
  );
}

export function getHandoverPdfUrl(projectId: string, handoverId: string): Promise<Schemas['HandoverUrlDto']> {
  return unwrap(
    apiClient.GET('/api/projects/{projectId}/handovers/{handoverId}/pdf', {
      params: { path: { projectId, handoverId } },
    }),
  );
}
