import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { AppShell } from '@/components/layout/app-shell';
import { PageLoading } from '@/components/layout/page-loading';
import { RequireRole } from '@/features/auth/components/require-role';
import { HomeRedirect } from './routes/home-redirect';
import { RootLayout } from './routes/root-layout';
import { RouteError } from './routes/route-error';

// Each page is its own chunk: the first download holds only the shell and the guards.
export const routes: RouteObject[] = [
  {
    path: '/',
    element: <RootLayout />,
    // Shown while the first page's chunk loads on a cold start.
    hydrateFallbackElement: (
      <AppShell>
        <PageLoading />
      </AppShell>
    ),
    errorElement: <RouteError />,
    children: [
      {
        errorElement: <RouteError />,
        children: [
          { index: true, element: <HomeRedirect /> },
          {
            path: 'sign-in',
            lazy: async () => ({ Component: (await import('./routes/sign-in')).SignInRoute }),
          },
          {
            element: <RequireRole roles={['admin']} />,
            children: [
              {
                path: 'admin/staff',
                lazy: async () => ({ Component: (await import('./routes/admin/staff')).StaffRoute }),
              },
            ],
          },
          {
            element: <RequireRole roles={['clinician']} />,
            children: [
              {
                path: 'caseload',
                lazy: async () => ({ Component: (await import('./routes/caseload')).CaseloadRoute }),
              },
            ],
          },
          {
            element: <RequireRole roles={['supervisor']} />,
            children: [
              {
                path: 'reviews',
                lazy: async () => ({ Component: (await import('./routes/reviews')).ReviewsRoute }),
              },
            ],
          },
          {
            element: <RequireRole roles={['carer']} />,
            children: [
              {
                path: 'my-clients',
                lazy: async () => ({ Component: (await import('./routes/my-clients')).MyClientsRoute }),
              },
            ],
          },
          {
            path: '*',
            lazy: async () => ({ Component: (await import('./routes/not-found')).NotFoundRoute }),
          },
        ],
      },
    ],
  },
];

export const createAppRouter = () => createBrowserRouter(routes);
