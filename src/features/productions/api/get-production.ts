import { queryOptions, useQuery } from '@tanstack/react-query';
import { productionView, type ProductionView } from '@domain/contracts/productions.ts';
import { api, seg } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';

export type { ProductionView };

/** `GET /api/productions/:productionId` → the production's settings and version. */
export async function getProduction(productionId: string): Promise<ProductionView> {
  const res = await api.get<{ production: unknown }>(`/productions/${seg(productionId)}`);
  return parseResponse(productionView, res?.production, 'the production');
}

export function productionQueryOptions(productionId: string) {
  return queryOptions({ queryKey: ['productions', productionId] as const, queryFn: () => getProduction(productionId) });
}

export function useProduction(productionId: string) {
  return useQuery(productionQueryOptions(productionId));
}
