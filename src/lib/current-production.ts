import { useParams } from 'react-router-dom';
import { roleMay, type Action, type ProductionRole } from '@domain/policy/index.ts';
import type { MembershipView } from '@domain/contracts/auth.ts';
import { useSessionUser } from './session.ts';

export interface CurrentProduction {
  /** From the URL (`/p/:productionId/...`); null outside a production. */
  productionId: string | null;
  /** The signed-in user's membership there; null if they are not a member. */
  membership: MembershipView | null;
  role: ProductionRole | null;
}

/** The production the URL points at, and the user's role in it. */
export function useCurrentProduction(): CurrentProduction {
  const { productionId = null } = useParams();
  const user = useSessionUser();
  const membership = (productionId && user?.memberships.find((m) => m.productionId === productionId)) || null;
  return { productionId, membership, role: membership?.role ?? null };
}

/**
 * Whether the signed-in user's role in the current production may ever do `action`.
 * For hiding buttons and links only; the server decides for real.
 */
export function useMay(action: Action): boolean {
  const user = useSessionUser();
  const { role } = useCurrentProduction();
  return user ? roleMay(role, user.isAdmin, action) : false;
}
