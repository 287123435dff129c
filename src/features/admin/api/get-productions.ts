import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api.ts';

export interface VenueSummary {
  id: string;
  name: string;
}

export interface ProductionSummary {
  id: string;
  name: string;
  /** The production's venues, for granting a venue user access to some of them. */
  venues?: VenueSummary[];
}

/** `GET /api/admin/productions` → every production in the company with its venues, for granting access. */
export async function getAllProductions(): Promise<ProductionSummary[]> {
  const res = await api.get<{ productions: ProductionSummary[] }>('/admin/productions');
  return res?.productions ?? [];
}

export function allProductionsQueryOptions() {
  return queryOptions({ queryKey: ['admin', 'productions'] as const, queryFn: getAllProductions });
}

export function useAllProductions() {
  return useQuery(allProductionsQueryOptions());
}
