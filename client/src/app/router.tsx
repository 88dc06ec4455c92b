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
            path: 'choose-password',
            lazy: async () => ({
              Component: (await import('./routes/choose-password')).ChoosePasswordRoute,
            }),
          },
          {
            element: <RequireRole roles={['admin', 'clinician', 'supervisor', 'carer']} />,
            children: [
              {
                path: 'account',
                lazy: async () => ({ Component: (await import('./routes/account')).AccountRoute }),
              },
            ],
          },
          {
            element: <RequireRole roles={['admin']} />,
            children: [
              {
                path: 'admin/staff',
                lazy: async () => ({ Component: (await import('./routes/admin/staff')).StaffRoute }),
              },
              {
                path: 'admin/assignments',
                lazy: async () => ({
                  Component: (await import('./routes/admin/assignments')).AssignmentsRoute,
                }),
              },
              {
                path: 'admin/clinic',
                lazy: async () => ({ Component: (await import('./routes/admin/clinic')).ClinicRoute }),
              },
            ],
          },
          {
            element: <RequireRole roles={['clinician', 'supervisor', 'carer']} />,
            children: [
              {
                path: 'clients/:clientId/:tab?',
                lazy: async () => ({ Component: (await import('./routes/clients/client-page')).ClientRoute }),
              },
              {
                path: 'clients/:clientId/profiles/compare',
                lazy: async () => ({
                  Component: (await import('./routes/clients/profile-compare-page')).ProfileCompareRoute,
                }),
              },
              {
                path: 'clients/:clientId/profiles/:versionId',
                lazy: async () => ({
                  Component: (await import('./routes/clients/profile-version-page')).ProfileVersionRoute,
                }),
              },
            ],
          },
          {
            element: <RequireRole roles={['clinician', 'carer']} />,
            children: [
              {
                path: 'clients/:clientId/keyboard',
                lazy: async () => ({
                  Component: (await import('./routes/clients/keyboard-page')).KeyboardRoute,
                }),
              },
            ],
          },
          {
            element: <RequireRole roles={['clinician', 'supervisor']} />,
            children: [
              {
                path: 'clients/:clientId/profiles/:versionId/vocabulary',
                lazy: async () => ({
                  Component: (await import('./routes/clients/vocabulary-page')).VocabularyRoute,
                }),
              },
              {
                path: 'clients/:clientId/profiles/:versionId/report',
                lazy: async () => ({
                  Component: (await import('./routes/clients/version-report-page')).VersionReportRoute,
                }),
              },
              {
                path: 'clients/:clientId/report',
                lazy: async () => ({
                  Component: (await import('./routes/clients/client-report-page')).ClientReportRoute,
                }),
              },
              {
                path: 'clients/:clientId/samples/:sampleId',
                lazy: async () => ({ Component: (await import('./routes/clients/sample-page')).SampleRoute }),
              },
            ],
          },
          {
            element: <RequireRole roles={['supervisor', 'admin']} />,
            children: [
              {
                path: 'audit',
                lazy: async () => ({ Component: (await import('./routes/audit')).AuditRoute }),
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
              {
                path: 'clients',
                lazy: async () => ({ Component: (await import('./routes/caseload')).ClinicClientsRoute }),
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
