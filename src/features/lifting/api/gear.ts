import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { GearInput, GearView } from '@domain/contracts/lifting-api.ts';
import { api, seg } from '../../../lib/api.ts';
import { liftingBase, liftingKeys } from './keys.ts';

/** `GET …/lifting/gear` → the rigging gear inventory. */
export async function getGear(productionId: string): Promise<GearView[]> {
  const res = await api.get<{ gear: GearView[] }>(`${liftingBase(productionId)}/gear`);
  return res?.gear ?? [];
}

export function gearQuery(productionId: string) {
  return queryOptions({ queryKey: liftingKeys.gear(productionId), queryFn: () => getGear(productionId) });
}

export const useGear = (productionId: string) => useQuery(gearQuery(productionId));

/** Adds (no id) or saves (id and version; 409 with the current item when stale) a gear item. */
export function useSaveGear(productionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { id?: string; version?: number; item: GearInput }) =>
      v.id
        ? api.patch<{ gear: GearView }>(`${liftingBase(productionId)}/gear/${seg(v.id)}`, { version: v.version, item: v.item })
        : api.post<{ gear: GearView }>(`${liftingBase(productionId)}/gear`, { item: v.item }),
    // Plans that use the item are re-evaluated (and lose an approval) on the server.
    onSettled: () => qc.invalidateQueries({ queryKey: liftingKeys.all(productionId) }),
  });
}

export function useDeleteGear(productionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.delete(`${liftingBase(productionId)}/gear/${seg(id)}`),
    onSettled: () => qc.invalidateQueries({ queryKey: liftingKeys.gear(productionId) }),
  });
}
