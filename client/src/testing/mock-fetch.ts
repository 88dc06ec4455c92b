import { vi } from 'vitest';

export type RecordedRequest = {
  method: string;
  /** Path and query, e.g. "/api/users". */
  path: string;
  headers: Headers;
  /** The parsed JSON body, when there was one. */
  body: unknown;
  /** The multipart body, when the request sent FormData. */
  formData?: FormData;
};

export type MockResponse = { status?: number; body?: unknown };

type Handler = MockResponse | ((request: RecordedRequest) => MockResponse | Promise<MockResponse>);

/** Handlers keyed by "METHOD /path", e.g. "POST /api/auth/login". */
export type MockRoutes = Record<string, Handler>;

const json = ({ status = 200, body }: MockResponse): Response =>
  new Response(body === undefined ? null : JSON.stringify(body), {
    status,
    headers: body === undefined ? {} : { 'Content-Type': 'application/json' },
  });

/**
 * Replaces global fetch with a router over `routes`. Every request is recorded; one without a
 * handler gets a 404 that names it, and is listed in `unhandled` so a test can fail on it.
 */
export const mockFetch = (routes: MockRoutes) => {
  const requests: RecordedRequest[] = [];
  const unhandled: string[] = [];

  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(typeof input === 'string' ? input : input.toString(), 'http://keyloom.test');
    const method = (init.method ?? 'GET').toUpperCase();
    const text = typeof init.body === 'string' ? init.body : undefined;
    const request: RecordedRequest = {
      method,
      path: `${url.pathname}${url.search}`,
      headers: new Headers(init.headers),
      body: text ? (JSON.parse(text) as unknown) : undefined,
      formData: init.body instanceof FormData ? init.body : undefined,
    };
    requests.push(request);

    const key = `${method} ${url.pathname}`;
    const handler = routes[key];
    if (!handler) {
      unhandled.push(key);
      return json({ status: 404, body: { statusCode: 404, message: `No mock for ${key}` } });
    }
    return json(typeof handler === 'function' ? await handler(request) : handler);
  });

  vi.stubGlobal('fetch', fetchMock);
  return {
    requests,
    unhandled,
    /** The recorded requests for one "METHOD /path". */
    requestsTo: (key: string) => requests.filter((request) => `${request.method} ${request.path}` === key),
  };
};

export const CSRF_TOKEN = 'csrf-token-for-tests-0001';

/** The answers every signed-in screen needs: the session and a CSRF token. */
export const sessionRoutes = (me: unknown): MockRoutes => ({
  'GET /api/auth/me': me
    ? { body: me }
    : { status: 401, body: { statusCode: 401, message: 'Sign in first.' } },
  'GET /api/auth/csrf': { body: { token: CSRF_TOKEN } },
});
