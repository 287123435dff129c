import type { ComponentType } from 'react';
import { createBrowserRouter, Outlet, ScrollRestoration, type RouteObject } from 'react-router-dom';
import { PageLoading } from '../components/ui/index.ts';
import { HomeRedirect } from './layout/home-redirect.tsx';
import { ProductionLayout } from './layout/production-layout.tsx';
import { RequireAuth } from './layout/require-auth.tsx';
import { RouteErrorBoundary } from './route-error-boundary.tsx';

type LazyModule = () => Promise<{ Component: ComponentType }>;

/** A screen: loaded on first visit, with its own error boundary so a crash keeps the shell. */
function screen(path: string | undefined, load: LazyModule): RouteObject {
  return path === undefined
    ? { index: true, lazy: load, ErrorBoundary: RouteErrorBoundary }
    : { path, lazy: load, ErrorBoundary: RouteErrorBoundary };
}

function Root() {
  return (
    <>
      <ScrollRestoration />
      <Outlet />
    </>
  );
}

/**
 * Every address of the app. Public screens first; everything else sits behind the sign-in gate
 * and inside the shell. Production screens live under `/p/:productionId`.
 */
export const routes: RouteObject[] = [
  {
    id: 'root',
    Component: Root,
    ErrorBoundary: RouteErrorBoundary,
    HydrateFallback: () => <PageLoading />,
    children: [
      screen('sign-in', () => import('./routes/sign-in.tsx')),
      screen('forgot-password', () => import('./routes/forgot-password.tsx')),
      screen('reset-password', () => import('./routes/reset-password.tsx')),
      screen('invite/:token', () => import('./routes/accept-invitation.tsx')),
      {
        Component: RequireAuth,
        ErrorBoundary: RouteErrorBoundary,
        children: [
          { index: true, Component: HomeRedirect, ErrorBoundary: RouteErrorBoundary },
          screen('account', () => import('./routes/account.tsx')),
          {
            path: 'p/:productionId',
            Component: ProductionLayout,
            ErrorBoundary: RouteErrorBoundary,
            children: [
              screen(undefined, () => import('./routes/production-overview.tsx')),
              screen('machine', () => import('../features/machine/machine-route.tsx')),
              screen('settings', () => import('./routes/production-settings.tsx')),
              screen('crates', () => import('./routes/crates.tsx')),
              screen('crates/:crateId', () => import('./routes/crate.tsx')),
              screen('loads', () => import('./routes/loads.tsx')),
              screen('loads/:runId', () => import('./routes/packing-run.tsx')),
              screen('tour', () => import('./routes/tour.tsx')),
              screen('tour/matrix', () => import('./routes/tour-matrix.tsx')),
              screen('tour/venues/:venueId', () => import('./routes/tour-venue.tsx')),
              screen('tour/engagements/:engagementId', () => import('./routes/tour-engagement.tsx')),
              screen('check-in', () => import('./routes/check-in.tsx')),
              screen('check-in/:engagementId', () => import('./routes/check-in-engagement.tsx')),
              screen('split', () => import('../features/split/split-route.tsx')),
              screen('impact', () => import('../features/impact/impact-route.tsx')),
              screen('lifting', () => import('../features/lifting/routes/lifting-route.tsx')),
              screen('lifting/gear', () => import('../features/lifting/routes/gear-route.tsx')),
              screen('lifting/handling', () => import('../features/lifting/routes/handling-route.tsx')),
              screen('lifting/plans/new', () => import('../features/lifting/routes/new-plan-route.tsx')),
              screen('lifting/plans/:planId', () => import('../features/lifting/routes/plan-route.tsx')),
              screen('*', () => import('./routes/not-found.tsx')),
            ],
          },
          screen('admin/people', () => import('./routes/admin-people.tsx')),
          screen('admin/mail', () => import('./routes/admin-mail.tsx')),
          screen('admin/archives', () => import('./routes/admin-archives.tsx')),
          screen('*', () => import('./routes/not-found.tsx')),
        ],
      },
    ],
  },
];

export function createAppRouter() {
  return createBrowserRouter(routes);
}
