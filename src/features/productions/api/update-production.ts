import { useMutation, useQueryClient } from '@tanstack/react-query';
import { productionView, type ProductionSettingsBody } from '@domain/contracts/productions.ts';
import { api, ApiError, seg } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';
import { sessionQueryOptions } from '../../../lib/session.ts';
import { productionQueryOptions, type ProductionView } from './get-production.ts';

/**
 * `PATCH /api/productions/:productionId` {version, ...changes} → the saved production.
 * A stale `version` gets 409 `conflict` with the current production in `error.current`.
 */
export async function updateProduction(productionId: string, body: ProductionSettingsBody): Promise<ProductionView> {
  const res = await api.patch<{ production: unknown }>(`/productions/${seg(productionId)}`, body);
  return parseResponse(productionView, res?.production, 'saving the production');
}

/** The production as it is now on the server, when a save was refused as stale; else null. */
export function conflictCurrent(error: unknown): ProductionView | null {
  if (!(error instanceof ApiError) || error.status !== 409) return null;
  const parsed = productionView.safeParse(error.current);
  return parsed.success ? parsed.data : null;
}

export function useUpdateProduction(productionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ProductionSettingsBody) => updateProduction(productionId, body),
    onSuccess: (production) => {
      queryClient.setQueryData(productionQueryOptions(productionId).queryKey, production);
      // The production switcher shows names from the session's memberships.
      void queryClient.invalidateQueries({ queryKey: sessionQueryOptions().queryKey });
    },
    onError: (error) => {
      const current = conflictCurrent(error);
      if (current) queryClient.setQueryData(productionQueryOptions(productionId).queryKey, current);
    },
  });
}
