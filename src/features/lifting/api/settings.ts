import { queryOptions, useQuery } from '@tanstack/react-query';
import { liftingSettingsView, type LiftingSettingsView } from '@domain/contracts/lifting-api.ts';
import { api } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';
import { liftingBase, liftingKeys } from './keys.ts';

/** `GET …/lifting/settings` → the production's lifting settings (method, column, dynamic factor…). */
export async function getLiftingSettings(productionId: string): Promise<LiftingSettingsView> {
  const res = await api.get<{ settings: unknown }>(`${liftingBase(productionId)}/settings`);
  return parseResponse(liftingSettingsView, res?.settings, 'the lifting settings');
}

export function liftingSettingsQuery(productionId: string) {
  return queryOptions({ queryKey: liftingKeys.settings(productionId), queryFn: () => getLiftingSettings(productionId) });
}

export const useLiftingSettings = (productionId: string) => useQuery(liftingSettingsQuery(productionId));
