import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { buttonClasses, ErrorState } from '../components/ui/index.ts';
import { ApiError } from '../lib/api.ts';
import { NotFound } from './not-found.tsx';

/**
 * Shown in place of a screen that crashed or failed to load; the shell around it stays, so the
 * person can go elsewhere. Set on every route.
 */
export function RouteErrorBoundary() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFound />;
  const chunkFailed = error instanceof TypeError && /dynamically imported module|Importing a module script failed/i.test(error.message);
  const message = chunkFailed
    ? new Error('This screen could not be downloaded. Ballast may have been updated: reload the page.')
    : isRouteErrorResponse(error)
      ? new Error(`${error.status} ${error.statusText}`)
      : error instanceof ApiError || error instanceof Error
        ? error
        : new Error('Something unexpected happened.');
  return (
    <div className="p-4 sm:p-6">
      <ErrorState
        title="This screen ran into a problem"
        error={message}
        onRetry={() => window.location.reload()}
        action={
          <Link to="/" className={buttonClasses({ variant: 'ghost' })}>
            Go to the start
          </Link>
        }
      />
    </div>
  );
}
