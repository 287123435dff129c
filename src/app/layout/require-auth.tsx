import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { ErrorState, PageLoading } from '../../components/ui/index.ts';
import { signInPath } from '../../lib/safe-next.ts';
import { useSession } from '../../lib/session.ts';
import { AppLayout } from './app-layout.tsx';

/** Everything inside needs a signed-in person; others go to sign in and come back afterwards. */
export function RequireAuth() {
  const session = useSession();
  const location = useLocation();
  if (session.isPending) return <PageLoading />;
  if (session.isError) {
    return (
      <div className="mx-auto max-w-lg p-6">
        <ErrorState title="Ballast could not start" error={session.error} onRetry={() => session.refetch()} retrying={session.isFetching} />
      </div>
    );
  }
  if (!session.data) return <Navigate to={signInPath(location.pathname + location.search)} replace />;
  return (
    <AppLayout user={session.data}>
      <Outlet />
    </AppLayout>
  );
}
