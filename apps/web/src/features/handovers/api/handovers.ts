import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  acknowledgeHandover,
  composeHandover,
  getHandoverPdfUrl,
  handoverDraftQueryOptions,
  headingHandoversQueryOptions,
  receivedHandoversQueryOptions,
  type ComposeHandoverRequest,
  type Handover,
  type HandoverDraft,
} from '@/api/resources/handovers';
import { invalidateResource } from '@/api/resources/invalidate';
import { resourceKeys } from '@/api/resources/keys';

export type { ComposeHandoverRequest, Handover, HandoverDraft };

export function useHeadingHandovers(projectId: string, headingId: string) {
  return useQuery(headingHandoversQueryOptions(projectId, headingId));
}

export function useHandoverDraft(projectId: string, headingIds: string[]) {
  return useQuery(handoverDraftQueryOptions(projectId, headingIds));
}

/** Saves and sends a handover; the project (Board) and the handed-over headings' histories are read again. */
export function useComposeHandover(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: ['handovers', 'compose', projectId],
    mutationFn: (body: ComposeHandoverRequest) => composeHandover(projectId, body),
    onSuccess: (sent) =>
      Promise.all([
        invalidateResource(queryClient, resourceKeys.project(projectId)),
        ...sent.headings.map((h) =>
          invalidateResource(queryClient, resourceKeys.headingHandovers(projectId, h.headingId)),
        ),
      ]).then(() => undefined),
  });
}

export function useReceivedHandovers() {
  return useQuery(receivedHandoversQueryOptions());
}

/** Acknowledges one handover (optionally with a comment); the Received list is read again. */
export function useAcknowledgeHandover() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: ['handovers', 'acknowledge'],
    mutationFn: (v: { projectId: string; handoverId: string; comment: string }) =>
      acknowledgeHandover(v.projectId, v.handoverId, { comment: v.comment.trim() || null }),
    onSuccess: () => invalidateResource(queryClient, resourceKeys.receivedHandovers()),
  });
}

/** Opens the stored PDF through its short-lived signed address. */
export async function openHandoverPdf(projectId: string, handoverId: string): Promise<void> {
  const { url } = await getHandoverPdfUrl(projectId, handoverId);
  window.open(url, '_blank', 'noopener');
}
