/** A stand-in for the Roundbook API in unit tests: answers fetch() from a table of routes. */
export type MockHandler = (request: Request) => Response | Promise<Response>;
export type MockRoutes = Record<string, MockHandler | object>;

export function jsonResponse(body: unknown, status = 200): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

export function apiError(status: number, code: string, message = code): MockHandler {
  return () => jsonResponse({ code, message }, status);
}

const realFetch = globalThis.fetch;

/**
 * Replaces fetch for the current test. Keys are "METHOD /path" (query ignored); a value is either a
 * handler or a JSON body answered with 200. Unknown routes answer 404 so a missing mock is obvious.
 */
export function mockApi(routes: MockRoutes) {
  const mock = jest.fn(async (input: RequestInfo | URL): Promise<Response> => {
    const request = input instanceof Request ? input : new Request(input);
    const url = new URL(request.url);
    const route = routes[`${request.method} ${url.pathname}`];
    if (route === undefined) {
      return jsonResponse(
        { code: 'NOT_FOUND', message: `No mock for ${request.method} ${url.pathname}` },
        404,
      );
    }
    return typeof route === 'function' ? (route as MockHandler)(request) : jsonResponse(route);
  });
  globalThis.fetch = mock as typeof fetch;
  return mock;
}

export function restoreFetch(): void {
  globalThis.fetch = realFetch;
}

/** The requests a mock received, as "METHOD /path" strings. */
export function requestedRoutes(mock: jest.Mock): string[] {
  return mock.mock.calls.map(([input]) => {
    const request = input as Request;
    return `${request.method} ${new URL(request.url).pathname}`;
  });
}
