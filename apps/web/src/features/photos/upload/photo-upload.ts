import type { Photo } from '@/api/resources/photos';
import { completePhotoUpload, photoPartPath, startPhotoUpload } from '@/api/resources/photos';
import { ApiError, NETWORK_ERROR_CODE, parseRetryAfter } from '@/lib/api-client';
import { getAccessToken } from '@/lib/session';

/** What the browser can tell before sending: the types the API accepts and its default size limit. */
export const ACCEPTED_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif'];
export const DEFAULT_MAX_BYTES = 25 * 1024 * 1024;

const HEIC_NAME = /\.(heic|heif)$/i;

/** A reason to refuse the file before any byte is sent, or null when it may go. */
export function refuseBeforeUpload(file: File, maxBytes = DEFAULT_MAX_BYTES): string | null {
  // Some tablets report HEIC photos with no type: the name tells, and the API checks the bytes anyway.
  const type = file.type || (HEIC_NAME.test(file.name) ? 'image/heic' : '');
  if (type !== '' && !ACCEPTED_TYPES.includes(type))
    return `${file.name} is not a JPEG, PNG, WebP or HEIC photo.`;
  if (file.size === 0) return `${file.name} is empty.`;
  if (file.size > maxBytes)
    return `${file.name} is ${(file.size / 1048576).toFixed(1)} MB; a photo can be at most ${(maxBytes / 1048576).toFixed(0)} MB.`;
  return null;
}

/** Where one file's upload stands; kept so a retry sends only the parts not yet stored. */
export interface UploadProgress {
  photoId?: string;
  partSize?: number;
  partCount?: number;
  /** part number → ETag of the parts stored */
  done: Record<number, string>;
  /** bytes sent so far (parts stored plus the part on its way) */
  sentBytes: number;
}

export const freshProgress = (): UploadProgress => ({ done: {}, sentBytes: 0 });

interface PartResult {
  partNumber: number;
  etag: string;
}

/** PUTs one part with XHR (fetch reports no upload progress). */
function sendPart(
  url: string,
  body: Blob,
  onBytes: (loaded: number) => void,
  signal?: AbortSignal,
): Promise<PartResult> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('PUT', url);
    xhr.setRequestHeader('Content-Type', 'application/octet-stream');
    const token = getAccessToken();
    if (token !== null) xhr.setRequestHeader('Authorization', `Bearer ${token}`);
    xhr.upload.onprogress = (e) => onBytes(e.loaded);
    xhr.onload = () => {
      let parsed: unknown;
      try {
        parsed = JSON.parse(xhr.responseText);
      } catch {
        parsed = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(parsed as PartResult);
      const b = (parsed ?? {}) as { code?: string; message?: string };
      reject(
        new ApiError(
          xhr.status,
          b.code ?? `HTTP_${xhr.status}`,
          b.message ?? 'The part could not be stored.',
          undefined,
          undefined,
          parseRetryAfter(xhr.getResponseHeader('Retry-After')),
        ),
      );
    };
    xhr.onerror = () =>
      reject(new ApiError(0, NETWORK_ERROR_CODE, 'The Roundbook server could not be reached.'));
    xhr.onabort = () => reject(new DOMException('Upload cancelled', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(body);
  });
}

/**
 * Uploads one file in parts: start (once), each part not yet stored, then complete. `progress` is updated
 * in place and reported after every change, so calling again after a failure resumes where it stopped.
 */
export async function uploadPhoto(
  at: { projectId: string; roundId: string },
  file: File,
  progress: UploadProgress,
  report: (p: UploadProgress) => void,
  signal?: AbortSignal,
): Promise<Photo> {
  if (!progress.photoId) {
    const started = await startPhotoUpload(at, {
      fileName: file.name,
      contentType: file.type || (HEIC_NAME.test(file.name) ? 'image/heic' : ''),
      size: file.size,
    });
    progress.photoId = started.photo.id;
    progress.partSize = started.partSize;
    progress.partCount = started.partCount;
    report({ ...progress });
  }
  const { photoId, partSize = 0, partCount = 0 } = progress;
  const storedBytes = () =>
    Object.keys(progress.done).reduce(
      (sum, n) => sum + Math.min(partSize, file.size - (Number(n) - 1) * partSize),
      0,
    );
  for (let n = 1; n <= partCount; n++) {
    if (progress.done[n]) continue;
    const blob = file.slice((n - 1) * partSize, n * partSize);
    const before = storedBytes();
    let part: PartResult;
    try {
      part = await sendPart(
        photoPartPath(at, photoId, n),
        blob,
        (loaded) => {
          progress.sentBytes = before + loaded;
          report({ ...progress });
        },
        signal,
      );
    } catch (e) {
      // What was on its way is lost; the stored parts stay stored.
      progress.sentBytes = storedBytes();
      report({ ...progress });
      throw e;
    }
    progress.done[n] = part.etag;
    progress.sentBytes = storedBytes();
    report({ ...progress, done: { ...progress.done } });
  }
  const parts = Object.entries(progress.done).map(([n, etag]) => ({ partNumber: Number(n), etag }));
  return completePhotoUpload(at, photoId, { parts });
}
