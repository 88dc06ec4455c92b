import { csrfTokenSchema } from '@keyloom/shared';
import { describe, expect, it, vi } from 'vitest';
import { mockFetch } from '@/testing/mock-fetch';
import { ApiError, apiRequest, resetCsrfToken } from './api-client';

const csrfRejection = { status: 403, body: { statusCode: 403, message: 'Invalid CSRF token.' } };

describe('apiRequest', () => {
  it('sends GETs without a CSRF token, with same-origin cookies', async () => {
    const api = mockFetch({ 'GET /api/users': { body: [] } });
    await apiRequest('/users');
    expect(api.requests).toHaveLength(1);
    expect(api.requests[0]?.headers.has('X-CSRF-Token')).toBe(false);
    const init = (fetch as unknown as { mock: { calls: Array<[string, RequestInit]> } }).mock.calls[0]?.[1];
    expect(init?.credentials).toBe('same-origin');
  });

  it('fetches the CSRF token once and reuses it until reset', async () => {
    let issued = 0;
    const api = mockFetch({
      'GET /api/auth/csrf': () => ({ body: { token: `token-issued-number-${++issued}` } }),
      'POST /api/auth/logout': { status: 204 },
    });
    await apiRequest('/auth/logout', { method: 'POST' });
    await apiRequest('/auth/logout', { method: 'POST' });
    resetCsrfToken();
    await apiRequest('/auth/logout', { method: 'POST' });

    const sent = api
      .requestsTo('POST /api/auth/logout')
      .map((request) => request.headers.get('X-CSRF-Token'));
    expect(sent).toEqual(['token-issued-number-1', 'token-issued-number-1', 'token-issued-number-2']);
  });

  it('retries a CSRF rejection only once', async () => {
    const api = mockFetch({
      'GET /api/auth/csrf': { body: { token: 'a-token-that-is-always-stale' } },
      'POST /api/auth/logout': csrfRejection,
    });
    await expect(apiRequest('/auth/logout', { method: 'POST' })).rejects.toMatchObject({ status: 403 });
    expect(api.requestsTo('POST /api/auth/logout')).toHaveLength(2);
  });

  it('does not retry a 403 that is about the role, not the token', async () => {
    const api = mockFetch({
      'GET /api/auth/csrf': { body: { token: 'a-perfectly-good-token' } },
      'POST /api/users': {
        status: 403,
        body: { statusCode: 403, message: 'Only administrators can do that.' },
      },
    });
    await expect(apiRequest('/users', { method: 'POST', body: {} })).rejects.toThrow(
      'Only administrators can do that.',
    );
    expect(api.requestsTo('POST /api/users')).toHaveLength(1);
  });

  it('turns an error body into an ApiError with its field issues', async () => {
    mockFetch({
      'GET /api/auth/csrf': { body: { token: 'a-perfectly-good-token' } },
      'POST /api/users': {
        status: 400,
        body: {
          statusCode: 400,
          message: 'Check the fields.',
          issues: [{ path: 'email', message: 'Taken.' }],
        },
      },
    });
    const error = await apiRequest('/users', { method: 'POST', body: {} }).catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 400,
      message: 'Check the fields.',
      issues: [{ path: 'email', message: 'Taken.' }],
    });
  });

  it('reports a body that is not an API error, and an answer of the wrong shape', async () => {
    mockFetch({ 'GET /api/broken': { status: 502 }, 'GET /api/odd': { body: { unexpected: true } } });
    await expect(apiRequest('/broken')).rejects.toMatchObject({
      status: 502,
      message: expect.stringContaining('HTTP 502'),
    });
    await expect(apiRequest('/odd', { schema: csrfTokenSchema })).rejects.toMatchObject({
      status: 200,
      message: expect.stringContaining('did not expect'),
    });
  });

  it('reports an unreachable server as status 0', async () => {
    vi.stubGlobal('fetch', vi.fn().mockRejectedValue(new TypeError('Failed to fetch')));
    await expect(apiRequest('/auth/me')).rejects.toMatchObject({
      status: 0,
      message: expect.stringContaining('could not reach'),
    });
  });
});
