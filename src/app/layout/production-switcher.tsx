import { useLocation, useNavigate } from 'react-router-dom';
import { controlClasses } from '../../components/ui/index.ts';
import type { SessionUser } from '../../lib/session.ts';
import { switchTarget } from '../navigation.ts';
import { useNavProduction } from './use-nav-production.ts';

/** Lists the productions the person belongs to; choosing one opens it at the same screen. */
export function ProductionSwitcher({ user }: { user: SessionUser }) {
  const { productionId, membership } = useNavProduction();
  const location = useLocation();
  const navigate = useNavigate();
  if (user.memberships.length === 0) return null;

  function choose(id: string) {
    const target = user.memberships.find((m) => m.productionId === id);
    if (!target) return;
    navigate(switchTarget(location.pathname, id, target.role, user.isAdmin));
  }

  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor="production-switcher" className="text-sm font-semibold text-ink-700">
        Production
      </label>
      <select id="production-switcher" className={controlClasses} value={membership ? (productionId ?? '') : ''} onChange={(e) => choose(e.target.value)}>
        {!membership && (
          <option value="" disabled>
            Choose a production
          </option>
        )}
        {user.memberships.map((m) => (
          <option key={m.productionId} value={m.productionId}>
            {m.productionName}
          </option>
        ))}
      </select>
    </div>
  );
}
