import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api.ts';

export interface ProductionSummary {
  id: string;
  name: string;
}

/** `GET /api/admin/productions` → every production in the company, for granting access. */
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
