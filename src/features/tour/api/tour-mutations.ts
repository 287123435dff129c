import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateEngagementBody, CreateLegBody, EngagementView, LegView, UpdateEngagementBody, UpdateLegBody } from '@domain/contracts/tour.ts';
import { api, seg } from '../../../lib/api.ts';

const base = (productionId: string) => `/productions/${seg(productionId)}/tour`;

/** Engagements and legs: create and save (with version; a stale save answers 409). Every change refreshes the tour. */
export function useTourMutations(productionId: string) {
  const qc = useQueryClient();
  const refresh = () => void qc.invalidateQueries({ queryKey: ['tour', productionId] });
  return {
    createEngagement: useMutation({
      mutationFn: async (body: Omit<CreateEngagementBody, 'notes'> & { notes?: string }) => (await api.post<{ engagement: EngagementView }>(`${base(productionId)}/engagements`, body)).engagement,
      onSuccess: refresh,
    }),
    updateEngagement: useMutation({
      mutationFn: async ({ id, ...body }: UpdateEngagementBody & { id: string }) => (await api.patch<{ engagement: EngagementView }>(`${base(productionId)}/engagements/${seg(id)}`, body)).engagement,
      onSuccess: refresh,
    }),
    deleteEngagement: useMutation({ mutationFn: (id: string) => api.delete(`${base(productionId)}/engagements/${seg(id)}`), onSuccess: refresh }),
    createLeg: useMutation({
      mutationFn: async (body: Partial<CreateLegBody> & { toEngagementId: string }) => (await api.post<{ leg: LegView }>(`${base(productionId)}/legs`, body)).leg,
      onSuccess: refresh,
    }),
    updateLeg: useMutation({
      mutationFn: async ({ id, ...body }: UpdateLegBody & { id: string }) => (await api.patch<{ leg: LegView }>(`${base(productionId)}/legs/${seg(id)}`, body)).leg,
      onSuccess: refresh,
    }),
  };
}
