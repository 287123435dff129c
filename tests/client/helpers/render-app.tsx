import { render } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { AppProviders } from '../../../src/app/providers.tsx';
import { routes } from '../../../src/app/router.tsx';
import { createQueryClient } from '../../../src/lib/query-client.ts';

/** Renders the whole app (real routes, providers and hooks) at `path`. */
export function renderApp(path: string) {
  const queryClient = createQueryClient({ retry: false });
  const router = createMemoryRouter(routes, { initialEntries: [path] });
  const utils = render(
    <AppProviders queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProviders>,
  );
  return { ...utils, router, queryClient };
}
