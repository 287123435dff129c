import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProductionRole } from '@domain/policy/index.ts';
import { api, seg } from '../../../lib/api.ts';

export interface ProductionMember {
  userId: string;
  name: string;
  email: string;
  role: ProductionRole;
  venueIds: string[];
}

/** `GET /api/productions/:productionId/members` → the people on the production. */
export async function getMembers(productionId: string): Promise<ProductionMember[]> {
  const res = await api.get<{ members: ProductionMember[] }>(`/productions/${seg(productionId)}/members`);
  return res?.members ?? [];
}

export function membersQueryOptions(productionId: string) {
  return queryOptions({ queryKey: ['productions', productionId, 'members'] as const, queryFn: () => getMembers(productionId) });
}

export function useMembers(productionId: string) {
  return useQuery(membersQueryOptions(productionId));
}
