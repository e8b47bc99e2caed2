// An HTTP client of the Roundbook API for the proof scripts (cluster, faults), behaving as a tablet's sync:
// JSON in and out, a bearer token, every attempt bounded in time, and a request retried with the same body
// and headers when it met a 502/503/504 or a dropped connection (creates carry their own id or
// Idempotency-Key, so a retry never makes a second one). Every attempt is classified and counted.
import { InfraError } from './log.mjs';

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** An answer the client does not retry (4xx, or a 5xx that is not "try again"): status and parsed body. */
export class ApiError extends InfraError {
  constructor(method, url, status, body, text) {
    super(`${method} ${url} → ${status} ${String(text ?? '').slice(0, 300)}`);
    this.status = status;
    this.body = body;
  }
}

/**
 * How one attempt ended:
 * - `ok` 2xx; `refused` 4xx (the request itself was wrong or stale);
 * - `unavailable` 503 with Retry-After (a clean "try again");
 * - `gateway` 502/504 (a balancer in front could not reach an API process);
 * - `dropped` no answer: connection refused or reset (the API process itself was down or died);
 * - `timeout` no answer within the bound (a hang);
 * - `server-error` any other 5xx, including a 503 without Retry-After (a defect).
 */
export function outcomeOf(status, retryAfter) {
  if (status >= 200 && status < 300) return 'ok';
  if (status >= 400 && status < 500) return 'refused';
  if (status === 503) return retryAfter ? 'unavailable' : 'server-error';
  if (status === 502 || status === 504) return 'gateway';
  if (status >= 500) return 'server-error';
  return 'refused';
}

/** Outcomes after which the same request is sent again. */
const RETRIED = new Set(['unavailable', 'gateway', 'dropped', 'timeout']);

/**
 * A client of `baseUrl` (a function is read at every attempt, for a target that moves).
 * `timeoutMs` bounds each attempt; `onAttempt({ method, url, outcome, status, ms, at })` sees every one.
 */
export function apiClient(baseUrl, { token = null, timeoutMs = 30000, onAttempt } = {}) {
  const stats = { requests: 0, retries: 0, causes: {}, outcomes: {} };
  const base = typeof baseUrl === 'function' ? baseUrl : () => baseUrl;

  /** One attempt: `{ outcome, status, retryAfter, body, text, cause }`, never throws. */
  async function attempt(method, url, body, headers = {}) {
    stats.requests++;
    const started = Date.now();
    let result;
    try {
      const raw = body instanceof Uint8Array;
      const r = await fetch(`${base()}${url}`, {
        method,
        headers: {
          ...(body === undefined
            ? {}
            : { 'content-type': raw ? 'application/octet-stream' : 'application/json' }),
          ...(token ? { authorization: `Bearer ${token}` } : {}),
          ...headers,
        },
        body: body === undefined ? undefined : raw ? body : JSON.stringify(body),
        signal: AbortSignal.timeout(timeoutMs),
      });
      const text = await r.text();
      const retryAfter = r.headers.get('retry-after');
      let parsed = null;
      try {
        parsed = text ? JSON.parse(text) : null;
      } catch {
        parsed = null;
      }
      result = { outcome: outcomeOf(r.status, retryAfter), status: r.status, retryAfter, body: parsed, text };
      result.cause = String(r.status);
    } catch (err) {
      const timedOut = err?.name === 'TimeoutError';
      result = {
        outcome: timedOut ? 'timeout' : 'dropped',
        status: 0,
        cause: timedOut ? 'timeout' : (err?.cause?.code ?? err?.name ?? 'error'),
      };
    }
    stats.outcomes[result.outcome] = (stats.outcomes[result.outcome] ?? 0) + 1;
    onAttempt?.({ method, url, ...result, ms: Date.now() - started, at: Date.now() });
    return result;
  }

  /**
   * Sends until an answer that is not "try again", or until `untilMs` has passed; resolves with the parsed
   * body of a 2xx, throws ApiError otherwise. `retry: false` sends once. The pause between tries grows to
   * 1 s (a Retry-After asks for longer; these proofs keep it short to measure the recovery).
   */
  async function call(method, url, body, { retry = true, untilMs = 90000, headers } = {}) {
    const deadline = Date.now() + untilMs;
    for (let n = 0; ; n++) {
      const r = await attempt(method, url, body, headers);
      if (r.outcome === 'ok') return r.body;
      if (!RETRIED.has(r.outcome) || !retry || Date.now() > deadline)
        throw Object.assign(new ApiError(method, url, r.status, r.body, r.text ?? r.cause), {
          outcome: r.outcome,
        });
      stats.retries++;
      stats.causes[r.cause] = (stats.causes[r.cause] ?? 0) + 1;
      await sleep(Math.min(1000, 100 * (n + 1)));
    }
  }

  return { call, attempt, stats };
}

/** Signs in with the demo password and returns a client carrying the token. */
export async function signedIn(baseUrl, email, password, options = {}) {
  const { accessToken } = await apiClient(baseUrl, options).call('POST', '/api/auth/login', {
    email,
    password,
  });
  return apiClient(baseUrl, { ...options, token: accessToken });
}
