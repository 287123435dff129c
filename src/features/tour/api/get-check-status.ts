import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CheckStatusView } from '@domain/contracts/tour.ts';
import { api, seg } from '../../../lib/api.ts';

export type { CheckStatusView };

/** `GET /api/productions/:productionId/tour/check-status` → per engagement: expected, here, missing, damaged and flags. */
export async function getCheckStatuses(productionId: string): Promise<CheckStatusView[]> {
  const res = await api.get<{ statuses: CheckStatusView[] }>(`/productions/${seg(productionId)}/tour/check-status`);
  return res.statuses;
}

export function checkStatusesQueryOptions(productionId: string) {
  return queryOptions({ queryKey: ['tour', productionId, 'check-status'] as const, queryFn: () => getCheckStatuses(productionId) });
}

export function useCheckStatuses(productionId: string) {
  return useQuery(checkStatusesQueryOptions(productionId));
}
