import { queryOptions } from '@tanstack/react-query';
import type { components } from '@/api/generated/schema';
import { resourceKeys } from '@/api/resources/keys';
import { apiClient, unwrap } from '@/lib/api-client';

// GET /handovers/received; POST /projects/{projectId}/handovers/{handoverId}/acknowledge;
// GET /projects/{projectId}/handovers/{handoverId}/pdf.

type Schemas = components['schemas'];
export type Handover = Schemas['HandoverDto'];
export type HandoverDraft = Schemas['HandoverDraftDto'];
export type ComposeHandoverRequest = Schemas['ComposeHandoverDto'];

/** GET /projects/{projectId}/headings/{headingId}/handovers: the heading's handovers, newest first. */
export const headingHandoversQueryOptions = (projectId: string, headingId: string) =>
  queryOptions({
    queryKey: resourceKeys.headingHandovers(projectId, headingId),
    queryFn: () =>
      unwrap(
        apiClient.GET('/api/projects/{projectId}/headings/{headingId}/handovers', {
          params: { path: { projectId, headingId } },
        }),
      ),
    // Delivery and acknowledgement change while the page is open.
    refetchInterval: 30_000,
  });

/** GET /projects/{projectId}/handovers/draft: the composer's figures for the chosen headings. */
export const handoverDraftQueryOptions = (projectId: string, headingIds: string[]) =>
  queryOptions({
    queryKey: [
      ...resourceKeys.project(projectId),
      'handover-draft',
      [...headingIds].sort().join(','),
    ] as const,
    queryFn: () =>
      unwrap(
        apiClient.GET('/api/projects/{projectId}/handovers/draft', {
          params: { path: { projectId }, query: { headingIds: headingIds.join(',') } },
        }),
      ),
    enabled: headingIds.length > 0,
    staleTime: 0,
  });

export function composeHandover(projectId: string, body: ComposeHandoverRequest): Promise<Handover> {
  return unwrap(
    apiClient.POST('/api/projects/{projectId}/handovers', { params: { path: { projectId } }, body }),
  );
}

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
