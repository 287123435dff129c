import { vi } from 'vitest';

/** One recorded request to the fake server. */
export interface Call {
  method: string;
  path: string;
  headers: Record<string, string>;
  body: unknown;
}

export interface Reply {
  status?: number;
  body?: unknown;
}

export type Handler = Reply | ((call: Call, nth: number) => Reply);

/**
 * Replaces `fetch` with a small in-memory server, so the app's own fetchers, query options and
 * hooks all run; only the network is fake. Routes are keyed `"METHOD /api/path"`. Unknown
 * routes answer 404 like the real API.
 */
export function fakeApi(routes: Record<string, Handler>) {
  const calls: Call[] = [];
  const counts = new Map<string, number>();
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(typeof input === 'string' ? input : input instanceof URL ? input.href : input.url, 'http://ballast.test');
    const method = (init.method ?? 'GET').toUpperCase();
    const headers = Object.fromEntries(Object.entries((init.headers ?? {}) as Record<string, string>).map(([k, v]) => [k.toLowerCase(), v]));
    const body = typeof init.body === 'string' ? JSON.parse(init.body) : undefined;
    const call: Call = { method, path: url.pathname + url.search, headers, body };
    calls.push(call);
    const key = `${method} ${url.pathname}`;
    const handler = routes[key];
    const nth = counts.get(key) ?? 0;
    counts.set(key, nth + 1);
    const reply: Reply = handler === undefined
      ? { status: 404, body: { error: { code: 'not_found', message: `No route ${key}` } } }
      : typeof handler === 'function'
        ? handler(call, nth)
        : handler;
    const status = reply.status ?? 200;
    if (status === 204) return new Response(null, { status });
    return new Response(reply.body === undefined ? null : JSON.stringify(reply.body), {
      status,
      headers: { 'content-type': 'application/json' },
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  return {
    calls,
    /** Requests to one route, e.g. `callsTo('PATCH /api/productions/…')`. */
    callsTo: (key: string) => calls.filter((c) => `${c.method} ${c.path.split('?')[0]}` === key),
  };
}

export const CSRF_TOKEN = 'token-from-test-server';

/** The routes every signed-in screen needs: the user and a CSRF token. */
export function sessionRoutes(user: unknown): Record<string, Handler> {
  return {
    'GET /api/auth/me': user ? { body: { user } } : { status: 401, body: { error: { code: 'unauthenticated', message: 'Sign in to continue.' } } },
    'GET /api/auth/csrf': { body: { csrfToken: CSRF_TOKEN } },
  };
}
