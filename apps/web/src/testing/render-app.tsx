import { QueryClient } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { AppProvider } from '@/app/provider';
import { createRoutes, handleSessionExpiry } from '@/app/router';

/** Renders the whole app (real routes, loaders and providers) at `path`, in memory. */
export function renderApp(path: string) {
  const queryClient = new QueryClient({
    defaultOptions: { queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } },
  });
  const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: [path] });
  handleSessionExpiry(router);
  const view = render(
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>,
  );
  const location = () => `${router.state.location.pathname}${router.state.location.search}`;
  return { ...view, router, queryClient, location };
}
