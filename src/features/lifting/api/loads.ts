import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HangingPointView, LiftLoadView } from '@domain/contracts/lifting-api.ts';
import { api } from '../../../lib/api.ts';
import { liftingBase, liftingKeys } from './keys.ts';

/** `GET …/lifting/loads` → each section's mass, CoG, uncertainty and bounds, as a lift plan sees them. */
export async function getLoads(productionId: string): Promise<LiftLoadView[]> {
  const res = await api.get<{ loads: LiftLoadView[] }>(`${liftingBase(productionId)}/loads`);
  return res?.loads ?? [];
}

export function loadsQuery(productionId: string) {
  return queryOptions({ queryKey: liftingKeys.loads(productionId), queryFn: () => getLoads(productionId) });
}

export const useLoads = (productionId: string) => useQuery(loadsQuery(productionId));

/** `GET …/lifting/hanging-points` → venues' hanging points with their ratings. */
export async function getHangingPoints(productionId: string): Promise<HangingPointView[]> {
  const res = await api.get<{ hangingPoints: HangingPointView[] }>(`${liftingBase(productionId)}/hanging-points`);
  return res?.hangingPoints ?? [];
}

export function hangingPointsQuery(productionId: string) {
  return queryOptions({ queryKey: liftingKeys.hangingPoints(productionId), queryFn: () => getHangingPoints(productionId) });
}

export const useHangingPoints = (productionId: string) => useQuery(hangingPointsQuery(productionId));
