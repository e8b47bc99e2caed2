import type { Readable } from 'node:stream';

export interface StoredObject {
  body: Readable;
  contentType?: string;
  contentLength?: number;
}

export interface UploadedPart {
  partNumber: number;
  etag: string;
}

/**
 * Object storage could not be reached or answered with a server error: the caller should say so (503 with
 * Retry-After) and leave its own state as it was.
 */
export class StorageUnavailableError extends Error {
  constructor(cause: unknown) {
    super(`Object storage is unavailable: ${cause instanceof Error ? cause.message : String(cause)}`);
    this.name = 'StorageUnavailableError';
  }
}

/** The object (or upload) asked for does not exist. */
export class StorageNotFoundError extends Error {
  constructor(key: string) {
    super(`No stored object at ${key}`);
    this.name = 'StorageNotFoundError';
  }
}

/** Object storage behind an interface (twenty's STORAGE_TYPE; immich's storage repository). */
export abstract class StorageService {
  abstract put(key: string, body: Buffer | Readable, contentType: string): Promise<void>;
  abstract get(key: string): Promise<StoredObject>;
  abstract delete(key: string): Promise<void>;
  /** Reachability for /api/health: resolves with a short description or throws. */
  abstract check(): Promise<string>;

  /** The object's first bytes (inclusive range 0..length-1). */
  abstract head(key: string, length: number): Promise<Buffer>;
  /** Size and content type of a stored object. */
  abstract stat(key: string): Promise<{ size: number; contentType?: string }>;
  /** Starts a multipart upload; resolves with its upload id. */
  abstract createMultipart(key: string, contentType: string): Promise<string>;
  /** Streams one part (of known length) into a multipart upload. */
  abstract uploadPart(
    key: string,
    uploadId: string,
    partNumber: number,
    body: Readable,
    length: number,
  ): Promise<UploadedPart>;
  abstract completeMultipart(key: string, uploadId: string, parts: UploadedPart[]): Promise<void>;
  abstract abortMultipart(key: string, uploadId: string): Promise<void>;
  /** A short-lived signed GET address of the object. */
  abstract signedGetUrl(key: string, expiresInSeconds: number, downloadName?: string): Promise<string>;
}
