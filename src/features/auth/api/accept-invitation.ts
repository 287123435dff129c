import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sessionUser } from '@domain/contracts/auth.ts';
import { api, adoptCsrfToken, seg } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';
import { replaceSession, type SessionUser } from '../../../lib/session.ts';

/** `POST /api/invitations/:token/accept` {name, password} → the new user, signed in. */
export async function acceptInvitation(token: string, body: { name: string; password: string }): Promise<SessionUser> {
  const res = await api.post<{ user: unknown; csrfToken?: string }>(`/invitations/${seg(token)}/accept`, body);
  // The server starts a new session here; its CSRF token comes with the answer.
  adoptCsrfToken(res?.csrfToken);
  return parseResponse(sessionUser, res?.user, 'accepting the invitation');
}

export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: { name: string; password: string }) => acceptInvitation(token, body),
    onSuccess: (user) => {
      replaceSession(queryClient, user);
    },
  });
}
