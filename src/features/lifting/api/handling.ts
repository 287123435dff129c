import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { HandlingAssessment, HandlingSubject } from '@domain/contracts/handling-tasks.ts';
import type { HandlingTaskBody, HandlingTaskInput, LiftingSettingsView } from '@domain/contracts/lifting-api.ts';
import { api, seg } from '../../../lib/api.ts';
import { liftingBase, liftingKeys } from './keys.ts';

export interface HandlingItem extends HandlingSubject {
  task: HandlingTaskInput | null;
  version: number;
  assessment: HandlingAssessment;
}

/** `GET …/lifting/handling` → every item heavier than the threshold with its verdict and working. */
export async function getHandling(productionId: string): Promise<{ settings: LiftingSettingsView; items: HandlingItem[] }> {
  return api.get(`${liftingBase(productionId)}/handling`);
}

export function handlingQuery(productionId: string) {
  return queryOptions({ queryKey: liftingKeys.handling(productionId), queryFn: () => getHandling(productionId) });
}

export const useHandling = (productionId: string) => useQuery(handlingQuery(productionId));

/** `PUT …/lifting/handling/:itemId` — the crew's task inputs for one item (409 when stale). */
export function useSaveHandlingTask(productionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: HandlingTaskBody & { itemId: string }) =>
      api.put<{ task: HandlingTaskInput; version: number }>(`${liftingBase(productionId)}/handling/${seg(v.itemId)}`, { itemKind: v.itemKind, version: v.version, task: v.task }),
    onSettled: () => qc.invalidateQueries({ queryKey: liftingKeys.handling(productionId) }),
  });
}
