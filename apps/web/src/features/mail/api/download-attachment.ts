import { useMutation } from '@tanstack/react-query';
import { fetchBlob } from '@/lib/api-client';

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
  const blob = await fetchBlob(attachmentPath(ref));
  const url = URL.createObjectURL(blob);
  try {
    const link = document.createElement('a');
    link.href = url;
    link.download = ref.filename;
    document.body.append(link);
    link.click();
    link.remove();
  } finally {
    setTimeout(() => URL.revokeObjectURL(url), 10_000);
  }
}

export function useDownloadAttachment() {
  return useMutation({ mutationKey: ['mail', 'attachment'], mutationFn: downloadAttachment });
}
