import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InvitationBody } from '@domain/contracts/auth.ts';
import { api } from '../../../lib/api.ts';
import { usersQueryOptions } from './get-users.ts';

export interface InvitationCreated {
  id: string;
  email: string;
  /** ISO date-time after which the link no longer works. */
  expiresAt: string;
  /** False when the invitation was saved but its e-mail could not be sent. */
  delivered?: boolean;
}

/** `POST /api/admin/invitations` → 201 with the invitation; the e-mail goes out from the server. */
export async function createInvitation(body: InvitationBody): Promise<InvitationCreated> {
  const res = await api.post<{ invitation: InvitationCreated }>('/admin/invitations', body);
  return res.invitation;
}

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueryOptions().queryKey }),
  });
}
