import {
  apiClient,
  ApiError,
  NETWORK_ERROR_CODE,
  parseRetryAfter,
  toApiError,
  unwrap,
} from '@/lib/api-client';
import { readSession, saveSession } from '@/lib/session';
import { adminSession } from '@/testing/fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';

afterEach(restoreFetch);

describe('API errors', () => {
  it('carry the status, code, message and field messages of the API body', () => {
    const error = toApiError(new Response(null, { status: 400 }), {
      code: 'VALIDATION_FAILED',
      message: 'Check the fields',
      fields: { email: 'Not an address' },
    });
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 400, code: 'VALIDATION_FAILED', message: 'Check the fields' });
    expect(error.fields).toEqual({ email: 'Not an address' });
  });

  it('treat a gateway error without our body as an unreachable server', () => {
    expect(toApiError(new Response('Bad gateway', { status: 502 }), 'Bad gateway').code).toBe(
      NETWORK_ERROR_CODE,
    );
  });

  it('turn a failed fetch into an unreachable-server error', async () => {
    mockApi({ 'GET /api/projects': () => Promise.reject(new TypeError('fetch failed')) });
    await expect(unwrap(apiClient.GET('/api/projects'))).rejects.toMatchObject({
      status: 0,
      code: NETWORK_ERROR_CODE,
    });
  });
});

describe('Retry-After', () => {
  // RFC 9110 §10.2.3: delay-seconds or an HTTP date.
  it('is read as seconds or as a date, and carried by the error of a busy server', async () => {
    const now = Date.parse('2026-12-02T07:00:00Z');
    expect(parseRetryAfter('120', now)).toBe(120_000);
    expect(parseRetryAfter('Wed, 02 Dec 2026 07:00:30 GMT', now)).toBe(30_000);
    expect(parseRetryAfter('Wed, 02 Dec 2026 06:00:00 GMT', now)).toBe(0);
    expect(parseRetryAfter('soon', now)).toBeUndefined();
    expect(parseRetryAfter(null, now)).toBeUndefined();

    mockApi({
      'GET /api/projects': () => new Response('Busy', { status: 503, headers: { 'Retry-After': '7' } }),
    });
    await expect(unwrap(apiClient.GET('/api/projects'))).rejects.toMatchObject({
      code: NETWORK_ERROR_CODE,
      retryAfterMs: 7000,
    });
  });
});

describe('bearer token', () => {
  it('is sent on private routes but not with the sign-in request', async () => {
    saveSession(adminSession);
    const api = mockApi({ 'GET /api/projects': [], 'POST /api/auth/login': jsonResponse({}) });
    await unwrap(apiClient.GET('/api/projects'));
    await apiClient.POST('/api/auth/login', { body: { email: 'a@roundbook.test', password: 'x' } });
    const [projects, login] = api.mock.calls.map(([r]) => r as Request);
    expect(projects.headers.get('Authorization')).toBe('Bearer token-admin');
    expect(login.headers.has('Authorization')).toBe(false);
  });

  it('is dropped when the API refuses it with 401', async () => {
    saveSession(adminSession);
    mockApi({ 'GET /api/projects': () => jsonResponse({ code: 'UNAUTHORIZED', message: 'Expired' }, 401) });
    await expect(unwrap(apiClient.GET('/api/projects'))).rejects.toMatchObject({ status: 401 });
    expect(readSession()).toBeNull();
  });
});
