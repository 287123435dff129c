import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ProductionRole } from '@domain/policy/index.ts';
import { api, seg } from '../../../lib/api.ts';

export interface MemberChange {
  productionId: string;
  userId: string;
  role: ProductionRole;
  venueIds: string[];
}

/** `PUT /api/admin/productions/:productionId/members/:userId` {role, venueIds} → adds or changes access. */
export async function putMember({ productionId, userId, role, venueIds }: MemberChange): Promise<unknown> {
  const res = await api.put<{ member: unknown }>(`/admin/productions/${seg(productionId)}/members/${seg(userId)}`, { role, venueIds });
  return res?.member;
}

export function usePutMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: putMember,
    // Access changes touch many views (people, members, maybe the admin's own session), so all
    // cached reads are marked stale rather than naming other features' keys here.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
