/**
 * The one way the client talks to the Ballast API.
 *
 * - Same-origin cookies carry the session (`credentials: 'same-origin'`).
 * - Every state-changing request carries a CSRF token in `x-csrf-token`. The token is fetched
 *   once from `GET /api/auth/csrf` and cached; when the server refuses it (403, code `csrf`,
 *   e.g. after the session changed at sign-in) it is fetched again and the request retried once.
 * - Failures become an {@link ApiError} carrying the HTTP status and the server's error body.
 */

export interface ApiIssue {
  /** Dotted path of the field the problem is about, e.g. `membership.role`. */
  path: string;
  message: string;
}

interface ErrorBody {
  error?: { code?: unknown; message?: unknown; issues?: unknown; current?: unknown };
}

/** A failed API call. `status` is 0 when the server could not be reached at all. */
export class ApiError extends Error {
  override readonly name = 'ApiError';
  readonly status: number;
  readonly code: string;
  readonly issues: ApiIssue[];
  /** On 409: the record as it is now on the server. */
  readonly current: unknown;

  constructor(status: number, code: string, message: string, issues: ApiIssue[] = [], current?: unknown) {
    super(message);
    this.status = status;
    this.code = code;
    this.issues = issues;
    this.current = current;
  }
}

export function isApiError(error: unknown, code?: string): error is ApiError {
  return error instanceof ApiError && (code === undefined || error.code === code);
}

/** A sentence a person can read, for any error the client may meet. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong.';
}

const API_ROOT = '/api';
const CSRF_HEADER = 'x-csrf-token';

let csrfToken: Promise<string> | null = null;

/** Forget the cached CSRF token; the next state-changing request fetches a fresh one. */
export function resetCsrfToken(): void {
  csrfToken = null;
}

/**
 * Use the token the server handed out with a new session (sign-in, accepting an invitation);
 * without one, forget the old token so the next change fetches a fresh one.
 */
export function adoptCsrfToken(token: unknown): void {
  csrfToken = typeof token === 'string' && token ? Promise.resolve(token) : null;
}

function getCsrfToken(): Promise<string> {
  if (!csrfToken) {
    const pending = send<{ csrfToken: string }>('GET', '/auth/csrf').then((body) => {
      if (!body || typeof body.csrfToken !== 'string') {
        throw new ApiError(500, 'bad_response', 'The server sent no security token. Reload the page and try again.');
      }
      return body.csrfToken;
    });
    // A failed fetch must not poison the cache.
    pending.catch(() => {
      if (csrfToken === pending) csrfToken = null;
    });
    csrfToken = pending;
  }
  return csrfToken;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

async function send<T>(method: Method, path: string, body?: unknown, token?: string): Promise<T> {
  const headers: Record<string, string> = { accept: 'application/json' };
  if (body !== undefined) headers['content-type'] = 'application/json';
  if (token) headers[CSRF_HEADER] = token;

  let response: Response;
  try {
    response = await fetch(`${API_ROOT}${path}`, {
      method,
      headers,
      credentials: 'same-origin',
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch (_cause) {
    throw new ApiError(0, 'network', 'Ballast cannot be reached. Check your connection and try again.');
  }

  if (response.status === 204 || response.status === 205) return undefined as T;
  const text = await response.text();
  let parsed: unknown = undefined;
  if (text) {
    try {
      parsed = JSON.parse(text);
    } catch (_cause) {
      parsed = undefined;
    }
  }
  if (response.ok) return parsed as T;
  throw toApiError(response.status, parsed);
}

function toApiError(status: number, parsed: unknown): ApiError {
  const error = (parsed as ErrorBody | undefined)?.error;
  const code = typeof error?.code === 'string' ? error.code : `http_${status}`;
  const message = typeof error?.message === 'string' && error.message ? error.message : fallbackMessage(status);
  const issues = Array.isArray(error?.issues)
    ? error.issues.filter(
        (i): i is ApiIssue => typeof i === 'object' && i !== null && typeof (i as ApiIssue).message === 'string',
      ).map((i) => ({ path: String(i.path ?? ''), message: i.message }))
    : [];
  return new ApiError(status, code, message, issues, error?.current);
}

function fallbackMessage(status: number): string {
  if (status === 401) return 'Please sign in.';
  if (status === 403) return 'You do not have access to this.';
  if (status === 404) return 'Not found.';
  if (status === 409) return 'Someone else changed this in the meantime.';
  if (status === 429) return 'Too many attempts. Wait a moment and try again.';
  if (status >= 500) return `The server had a problem (HTTP ${status}). Try again in a moment.`;
  return `The request failed (HTTP ${status}).`;
}

async function request<T>(method: Method, path: string, body?: unknown): Promise<T> {
  if (method === 'GET') return send<T>(method, path);
  try {
    return await send<T>(method, path, body, await getCsrfToken());
  } catch (error) {
    if (!(error instanceof ApiError && error.status === 403 && error.code === 'csrf')) throw error;
    // The token went stale (new session, server restart): fetch a new one and try once more.
    resetCsrfToken();
    return send<T>(method, path, body, await getCsrfToken());
  }
}

/** Paths are relative to `/api`, e.g. `api.get('/auth/me')`. */
export const api = {
  get: <T>(path: string) => request<T>('GET', path),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, body ?? {}),
  put: <T>(path: string, body?: unknown) => request<T>('PUT', path, body ?? {}),
  patch: <T>(path: string, body?: unknown) => request<T>('PATCH', path, body ?? {}),
  delete: <T = void>(path: string) => request<T>('DELETE', path),
};

/** Encodes one path segment taken from user data or the URL. */
export function seg(value: string): string {
  return encodeURIComponent(value);
}

/** The record as it is now on the server, when a save was refused as stale (409 with it); else null. */
export function staleCurrent<T = Record<string, unknown>>(error: unknown): T | null {
  return error instanceof ApiError && error.status === 409 && error.current && typeof error.current === 'object' ? (error.current as T) : null;
}
