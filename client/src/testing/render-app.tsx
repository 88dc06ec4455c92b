import { render } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { AppProvider } from '@/app/provider';
import { createAppQueryClient } from '@/app/query-client';
import { routes } from '@/app/router';

/**
 * Renders the whole app (shell, guards, lazy pages) at `url` with an in-memory router.
 * Mock fetch first (see mock-fetch.ts): the app asks the API who is signed in.
 */
export const renderApp = (url: string) => {
  const queryClient = createAppQueryClient({ retry: false });
  const router = createMemoryRouter(routes, { initialEntries: [url] });
  const user = userEvent.setup();
  const view = render(
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>,
  );
  return { ...view, user, router, queryClient };
};

/** The current path and query of a router from renderApp. */
export const currentUrl = (router: ReturnType<typeof renderApp>['router']): string =>
  `${router.state.location.pathname}${router.state.location.search}`;
