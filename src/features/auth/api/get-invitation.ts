import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, seg } from '../../../lib/api.ts';

export interface InvitationView {
  email: string;
  name: string;
}

/** `GET /api/invitations/:token` → who was invited; 404 when unknown, used or expired. */
export async function getInvitation(token: string): Promise<InvitationView> {
  return api.get<InvitationView>(`/invitations/${seg(token)}`);
}

export function invitationQueryOptions(token: string) {
  return queryOptions({ queryKey: ['invitations', token] as const, queryFn: () => getInvitation(token), staleTime: Infinity });
}

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}
