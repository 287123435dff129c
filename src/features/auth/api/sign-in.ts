import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sessionUser, type SignInBody } from '@domain/contracts/auth.ts';
import { api, adoptCsrfToken } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';
import { replaceSession, type SessionUser } from '../../../lib/session.ts';

/** `POST /api/auth/sign-in`. 401 `invalid_credentials`; 429 `rate_limited`. */
export async function signIn(body: SignInBody): Promise<SessionUser> {
  const res = await api.post<{ user: unknown; csrfToken?: string }>('/auth/sign-in', body);
  // The server starts a new session here; its CSRF token comes with the answer.
  adoptCsrfToken(res?.csrfToken);
  return parseResponse(sessionUser, res?.user, 'sign-in');
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (user) => {
      replaceSession(queryClient, user);
    },
  });
}
