import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AccessMatrixView } from '@domain/contracts/tour.ts';
import { api, seg } from '../../../lib/api.ts';

export type { AccessMatrixView };

/** `GET /api/productions/:productionId/tour/access-matrix` → every crate and section against every engagement's venue. */
export async function getAccessMatrix(productionId: string): Promise<AccessMatrixView> {
  const res = await api.get<{ matrix: AccessMatrixView }>(`/productions/${seg(productionId)}/tour/access-matrix`);
  return res.matrix;
}

export function accessMatrixQueryOptions(productionId: string) {
  return queryOptions({ queryKey: ['tour', productionId, 'access-matrix'] as const, queryFn: () => getAccessMatrix(productionId) });
}

export function useAccessMatrix(productionId: string) {
  return useQuery(accessMatrixQueryOptions(productionId));
}
