import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { sessionUser, type SessionUser } from '@domain/contracts/auth.ts';
import { api, ApiError } from './api.ts';
import { parseResponse } from './parse.ts';

export type { SessionUser, MembershipView } from '@domain/contracts/auth.ts';

/**
 * The signed-in person, or `null` when nobody is signed in. Shared by the app shell and
 * every feature, so it lives here rather than in a feature.
 */
export async function getSession(): Promise<SessionUser | null> {
  try {
    const body = await api.get<{ user: unknown }>('/auth/me');
    return parseResponse(sessionUser, body?.user, 'the signed-in user');
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export function sessionQueryOptions() {
  return queryOptions({ queryKey: ['auth', 'me'] as const, queryFn: getSession, staleTime: 60_000 });
}

export function useSession() {
  return useQuery(sessionQueryOptions());
}

/** The signed-in user; `null` while loading or when signed out. */
export function useSessionUser(): SessionUser | null {
  return useSession().data ?? null;
}

/**
 * Puts a new signed-in user (or nobody) in the cache after sign-in, sign-out or accepting an
 * invitation. Everything else cached belonged to the previous session, so it is dropped.
 */
export function replaceSession(queryClient: QueryClient, user: SessionUser | null): void {
  const key = sessionQueryOptions().queryKey;
  queryClient.removeQueries({ predicate: (query) => !isSessionKey(query.queryKey) });
  queryClient.setQueryData(key, user);
}

function isSessionKey(key: readonly unknown[]): boolean {
  const own = sessionQueryOptions().queryKey;
  return key.length === own.length && key.every((part, i) => part === own[i]);
}
