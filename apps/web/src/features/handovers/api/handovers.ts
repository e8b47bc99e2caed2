import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  acknowledgeHandover,
  getHandoverPdfUrl,
  receivedHandoversQueryOptions,
  type Handover,
} from '@/api/resources/handovers';
import { invalidateResource } from '@/api/resources/invalidate';
import { resourceKeys } from '@/api/resources/keys';

export type { Handover };

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
