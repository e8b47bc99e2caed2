import { useMutation } from '@tanstack/react-query';
import { fetchBlob } from '@/lib/api-client';
import { saveBlob } from '@/lib/save-blob';

export interface AttachmentRef {
  messageId: string;
  index: number;
  filename: string;
}

export function attachmentPath({ messageId, index }: AttachmentRef): string {
  return `/api/local/mail/${encodeURIComponent(messageId)}/attachments/${index}`;
}

/** Fetches the attachment with the bearer token and hands it to the browser as a download. */
export async function downloadAttachment(ref: AttachmentRef): Promise<void> {
  saveBlob(await fetchBlob(attachmentPath(ref)), ref.filename);
}

export function useDownloadAttachment() {
  return useMutation({ mutationKey: ['mail', 'attachment'], mutationFn: downloadAttachment });
}
