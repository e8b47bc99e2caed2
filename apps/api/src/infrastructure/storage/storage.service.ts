import type { Readable } from 'node:stream';

export interface StoredObject {
  body: Readable;
  contentType?: string;
  contentLength?: number;
}

/** Object storage behind an interface (twenty's STORAGE_TYPE; immich's storage repository). */
export abstract class StorageService {
  abstract put(key: string, body: Buffer | Readable, contentType: string): Promise<void>;
  abstract get(key: string): Promise<StoredObject>;
  abstract delete(key: string): Promise<void>;
  /** Reachability for /api/health: resolves with a short description or throws. */
  abstract check(): Promise<string>;
}
