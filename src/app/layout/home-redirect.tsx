import { Link, Navigate } from 'react-router-dom';
import { buttonClasses, EmptyState, PageHeader } from '../../components/ui/index.ts';
import { useSessionUser } from '../../lib/session.ts';
import { readLastProduction } from '../last-production.ts';
import { productionPath } from '../navigation.ts';

/** `/`: opens the production used last on this device, else the first one; or says there is none. */
export function HomeRedirect() {
  const user = useSessionUser();
  if (!user) return null;
  const last = readLastProduction(user.id);
  const target = user.memberships.find((m) => m.productionId === last) ?? user.memberships[0];
  if (target) return <Navigate to={productionPath(target.productionId)} replace />;

  return (
    <>
      <PageHeader title={`Welcome, ${user.name}`} />
      <EmptyState
        title="You are not on any production yet"
        action={
          user.isAdmin ? (
            <Link to="/admin/people" className={buttonClasses()}>
              Give people access
            </Link>
          ) : undefined
        }
      >
        {user.isAdmin
          ? 'As an administrator you can add yourself and others to a production from the People page.'
          : 'An administrator adds you to a production. Once they do, it opens here.'}
      </EmptyState>
    </>
  );
}
