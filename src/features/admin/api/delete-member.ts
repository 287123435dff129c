import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, seg } from '../../../lib/api.ts';

/** `DELETE /api/admin/productions/:productionId/members/:userId` → 204; the person loses access. */
export async function deleteMember({ productionId, userId }: { productionId: string; userId: string }): Promise<void> {
  await api.delete(`/admin/productions/${seg(productionId)}/members/${seg(userId)}`);
}

export function useDeleteMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteMember,
    // See usePutMember: access changes refresh every cached read.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
