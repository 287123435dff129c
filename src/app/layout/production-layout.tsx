import { useEffect } from 'react';
import { Link, Outlet } from 'react-router-dom';
import { buttonClasses, EmptyState } from '../../components/ui/index.ts';
import { useCurrentProduction } from '../../lib/current-production.ts';
import { useSessionUser } from '../../lib/session.ts';
import { rememberLastProduction } from '../last-production.ts';

/** `/p/:productionId/*`: only for members; remembers the production for next time. */
export function ProductionLayout() {
  const user = useSessionUser();
  const { productionId, membership } = useCurrentProduction();
  const userId = user?.id;

  useEffect(() => {
    if (userId && productionId && membership) rememberLastProduction(userId, productionId);
  }, [userId, productionId, membership]);

  if (!membership) {
    return (
      <EmptyState
        title="You are not on this production"
        action={
          <Link to="/" className={buttonClasses()}>
            Go to your productions
          </Link>
        }
      >
        It may have been removed, or your access changed. An administrator can add you.
      </EmptyState>
    );
  }
  return <Outlet />;
}
