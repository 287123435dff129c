import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TourView } from '@domain/contracts/tour.ts';
import { api, seg } from '../../../lib/api.ts';

export type { TourView };

/** `GET /api/productions/:productionId/tour` → engagements, legs, vehicles, crates (venue staff: their engagements only). */
export async function getTour(productionId: string): Promise<TourView> {
  const res = await api.get<{ tour: TourView }>(`/productions/${seg(productionId)}/tour`);
  return res.tour;
}

export function tourQueryOptions(productionId: string) {
  return queryOptions({ queryKey: ['tour', productionId] as const, queryFn: () => getTour(productionId) });
}

export function useTour(productionId: string) {
  return useQuery(tourQueryOptions(productionId));
}
