import { useCurrentProduction, type CurrentProduction } from '../../lib/current-production.ts';
import { useSessionUser } from '../../lib/session.ts';
import { readLastProduction } from '../last-production.ts';

/**
 * The production the shell's switcher and navigation refer to: the one in the URL, or on
 * screens outside any production (account, admin) the one used last, so its navigation stays
 * at hand.
 */
export function useNavProduction(): CurrentProduction & { fromUrl: boolean } {
  const current = useCurrentProduction();
  const user = useSessionUser();
  if (current.productionId || !user) return { ...current, fromUrl: true };
  const last = readLastProduction(user.id);
  const membership = user.memberships.find((m) => m.productionId === last) ?? user.memberships[0] ?? null;
  return { productionId: membership?.productionId ?? null, membership, role: membership?.role ?? null, fromUrl: false };
}
