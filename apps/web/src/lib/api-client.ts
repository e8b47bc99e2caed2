import createClient from 'openapi-fetch';
import type { Middleware } from 'openapi-fetch';
import type { ApiErrorBody, paths } from '@/api/contract';
import { expireSession, getAccessToken } from '@/lib/session';

/** Codes the web app produces itself (the API's own codes come from its error body). */
export const NETWORK_ERROR_CODE = 'SERVER_UNREACHABLE';

/** Every failed API call ends up as one of these. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string> | undefined;
  /** Extra facts some errors carry, e.g. `current` (the saved version) with 409 STALE_VERSION. */
  readonly details: Record<string, unknown> | undefined;
  /** How long the server asked us to wait before trying again (`Retry-After`), in ms. */
  readonly retryAfterMs: number | undefined;

  constructor(
    status: number,
    code: string,
    message: string,
    fields?: Record<string, string>,
    details?: Record<string, unknown>,
    retryAfterMs?: number,
  ) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
    this.details = details;
    this.retryAfterMs = retryAfterMs;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

let sessionExpiredHandler: (() => void) | null = null;

/** Called when the API answers 401 to a request that carried a token (expired or revoked). */
export function setSessionExpiredHandler(handler: (() => void) | null): void {
  sessionExpiredHandler = handler;
}

const PUBLIC_PATHS = new Set([
  '/api/auth/login',
  '/api/config',
  '/api/invitations/{token}',
  '/api/invitations/{token}/accept',
]);

const authMiddleware: Middleware = {
  onRequest({ request, schemaPath }) {
    const token = getAccessToken();
    if (token !== null && !PUBLIC_PATHS.has(schemaPath)) {
      request.headers.set('Authorization', `Bearer ${token}`);
    }
    return undefined;
  },
  onResponse({ request, response }) {
    if (response.status === 401 && request.headers.has('Authorization')) {
      expireSession();
      sessionExpiredHandler?.();
    }
    return undefined;
  },
};

function origin(): string {
  return typeof window === 'undefined' ? '' : window.location.origin;
}

/** The typed client for Roundbook's API (same origin, everything under /api). */
export const apiClient = createClient<paths>({
  baseUrl: origin(),
  // Resolve fetch on each call, so tests (and polyfills) can replace it.
  fetch: (request: Request) => globalThis.fetch(request),
});
apiClient.use(authMiddleware);

function isErrorBody(value: unknown): value is ApiErrorBody {
  return typeof value === 'object' && value !== null && typeof (value as ApiErrorBody).code === 'string';
}

function unreachable(retryAfterMs?: number): ApiError {
  return new ApiError(
    0,
    NETWORK_ERROR_CODE,
    'The Roundbook server could not be reached.',
    undefined,
    undefined,
    retryAfterMs,
  );
}

/** The longest wait a `Retry-After` may ask for; anything longer is read as this. */
const MAX_RETRY_AFTER_MS = 10 * 60_000;

/** `Retry-After` as delay-seconds or an HTTP date (RFC 9110, section 10.2.3), in ms from `now`. */
export function parseRetryAfter(value: string | null, now: number = Date.now()): number | undefined {
  if (value === null || value.trim() === '') return undefined;
  const text = value.trim();
  const ms = /^\d+$/.test(text) ? Number(text) * 1000 : Date.parse(text) - now;
  if (!Number.isFinite(ms)) return undefined;
  return Math.min(Math.max(ms, 0), MAX_RETRY_AFTER_MS);
}

export function toApiError(response: Response, body: unknown): ApiError {
  const retryAfterMs = parseRetryAfter(response.headers.get('Retry-After'));
  // A proxy in front of a stopped API answers 502/503/504 without our error body.
  if (!isErrorBody(body) && [502, 503, 504].includes(response.status)) return unreachable(retryAfterMs);
  if (isErrorBody(body)) {
    const details = (body as { details?: unknown }).details;
    return new ApiError(
      response.status,
      body.code,
      body.message ?? body.code,
      body.fields,
      typeof details === 'object' && details !== null ? (details as Record<string, unknown>) : undefined,
      retryAfterMs,
    );
  }
  return new ApiError(
    response.status,
    `HTTP_${response.status}`,
    response.statusText || 'Request failed',
    undefined,
    undefined,
    retryAfterMs,
  );
}

interface ClientResult<T> {
  data?: T;
  error?: unknown;
  response: Response;
}

/** Awaits an `apiClient` call and returns its data, or throws an `ApiError`. */
export async function unwrap<T>(call: Promise<ClientResult<T>>): Promise<T> {
  let result: ClientResult<T>;
  try {
    result = await call;
  } catch (error) {
    if (isApiError(error)) throw error;
    throw unreachable();
  }
  const { data, error, response } = result;
  if (!response.ok || error !== undefined) throw toApiError(response, error);
  return data as T;
}

/** GET a file (attachment, PDF) with the bearer token; for paths outside the JSON contract. */
export async function fetchBlob(path: string): Promise<Blob> {
  const token = getAccessToken();
  const headers = new Headers();
  if (token !== null) headers.set('Authorization', `Bearer ${token}`);
  let response: Response;
  try {
    response = await globalThis.fetch(new Request(`${origin()}${path}`, { headers }));
  } catch {
    throw unreachable();
  }
  if (response.status === 401 && token !== null) {
    expireSession();
    sessionExpiredHandler?.();
  }
  if (!response.ok) {
    const body: unknown = await response.json().catch(() => null);
    throw toApiError(response, body);
  }
  return response.blob();
}
