import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiError } from './api.ts';
import { sessionQueryOptions } from './session.ts';

export interface QueryClientOptions {
  /** Tests turn retries off to see error states at once. */
  retry?: boolean;
}

/**
 * The app's query client. A 401 from any request means the session ended (expired, signed out
 * in another tab), so the cached user is cleared and the auth gate sends the person to sign in.
 */
export function createQueryClient(options: QueryClientOptions = {}): QueryClient {
  const sessionKey = sessionQueryOptions().queryKey;
  const onError = (error: unknown) => {
    if (error instanceof ApiError && error.status === 401 && queryClient.getQueryData(sessionKey)) {
      queryClient.setQueryData(sessionKey, null);
    }
  };
  const queryClient: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError }),
    mutationCache: new MutationCache({ onError }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: options.retry === false ? false : shouldRetry,
        refetchOnWindowFocus: true,
      },
      mutations: { retry: false },
    },
  });
  return queryClient;
}

/** Retries only what a retry can fix: no network, or a server error. Never a 4xx. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.status > 0 && error.status < 500) return false;
  return failureCount < 2;
}
