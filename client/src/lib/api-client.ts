import { apiErrorSchema, csrfTokenSchema } from '@keyloom/shared';
import type { z } from 'zod';
import { env } from '@/config/env';

export type FieldIssue = { path: string; message: string };

/**
 * An error answered by the API (or a failure to reach it).
 * `status` is the HTTP status, or 0 when the request never got an answer.
 */
export class ApiError extends Error {
  readonly status: number;
  readonly issues: readonly FieldIssue[];
  /** The API's machine-readable reason, where it gives one (e.g. a password change is due). */
  readonly code: string | undefined;

  constructor(status: number, message: string, issues: readonly FieldIssue[] = [], code?: string) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.issues = issues;
    this.code = code;
  }
}

export const isApiError = (error: unknown): error is ApiError => error instanceof ApiError;

const UNREACHABLE_MESSAGE = 'Keyloom could not reach the server. Check your connection and try again.';
const UNEXPECTED_MESSAGE =
  'The server sent an answer Keyloom did not expect. Try again, or tell your administrator.';

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

type RequestOptions<T> = {
  method?: Method;
  /** JSON-encoded, except FormData, which goes as multipart/form-data. */
  body?: unknown;
  /** Validates the JSON answer; omit for answers whose body is not used. */
  schema?: z.ZodType<T>;
  signal?: AbortSignal;
  /** Extra request headers, e.g. an Idempotency-Key. */
  headers?: Record<string, string>;
};

// ---- CSRF token -------------------------------------------------------------------------
// One token per session: fetched on the first state-changing request, dropped whenever the
// session changes (sign-in, sign-out) or the API says the token is stale.

let csrfToken: Promise<string> | null = null;

const fetchCsrfToken = async (): Promise<string> => {
  const { token } = await send(`${env.API_URL}/auth/csrf`, { method: 'GET', schema: csrfTokenSchema }, {});
  return token;
};

const getCsrfToken = (): Promise<string> => {
  if (!csrfToken) {
    csrfToken = fetchCsrfToken();
    // A failed fetch must not poison later attempts.
    csrfToken.catch(() => {
      csrfToken = null;
    });
  }
  return csrfToken;
};

/** Forget the CSRF token; call after sign-in and sign-out (the session is regenerated). */
export const resetCsrfToken = (): void => {
  csrfToken = null;
};

// ---- Requests ---------------------------------------------------------------------------

const readJson = async (response: Response): Promise<unknown> => {
  const text = await response.text();
  if (!text) return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
};

const toApiError = (status: number, body: unknown): ApiError => {
  const parsed = apiErrorSchema.safeParse(body);
  if (parsed.success)
    return new ApiError(status, parsed.data.message, parsed.data.issues ?? [], parsed.data.code);
  return new ApiError(status, `The server answered with an error (HTTP ${status}). Try again in a moment.`);
};

async function send<T>(url: string, options: RequestOptions<T>, headers: Record<string, string>): Promise<T> {
  const init: RequestInit = {
    method: options.method ?? 'GET',
    credentials: 'same-origin',
    headers: { Accept: 'application/json', ...options.headers, ...headers },
    signal: options.signal,
  };
  if (options.body instanceof FormData) {
    // The browser sets the multipart boundary itself.
    init.body = options.body;
  } else if (options.body !== undefined) {
    init.body = JSON.stringify(options.body);
    init.headers = { ...init.headers, 'Content-Type': 'application/json' };
  }

  let response: Response;
  try {
    response = await fetch(url, init);
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(0, UNREACHABLE_MESSAGE);
  }

  const body = await readJson(response);
  if (!response.ok) throw toApiError(response.status, body);
  if (!options.schema) return body as T;
  const parsed = options.schema.safeParse(body);
  if (!parsed.success) throw new ApiError(response.status, UNEXPECTED_MESSAGE);
  return parsed.data;
}

const isCsrfRejection = (error: unknown): boolean =>
  isApiError(error) && error.status === 403 && /csrf/i.test(error.message);

/**
 * Calls the Keyloom API on this origin with the session cookie.
 * State-changing methods carry the `X-CSRF-Token` header; a 403 that blames the token
 * refreshes it and retries once.
 * @param path the path under the API root, starting with "/", e.g. "/users"
 */
export async function apiRequest<T>(path: string, options: RequestOptions<T> = {}): Promise<T> {
  const url = `${env.API_URL}${path}`;
  const method = options.method ?? 'GET';
  if (method === 'GET') return send(url, options, {});

  const withToken = async (): Promise<T> => send(url, options, { 'X-CSRF-Token': await getCsrfToken() });
  try {
    return await withToken();
  } catch (error) {
    if (!isCsrfRejection(error)) throw error;
    resetCsrfToken();
    return withToken();
  }
}

/**
 * "?a=1&b=x" from the values that are set (undefined, null and "" are left out); "" when none is.
 * @param params query values in the order they should appear
 */
export const toQueryString = (params: Record<string, string | number | null | undefined>): string => {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value !== undefined && value !== null && value !== '') search.set(key, String(value));
  }
  const text = search.toString();
  return text ? `?${text}` : '';
};
