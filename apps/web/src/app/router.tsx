import { createBrowserRouter } from 'react-router';
import { routes } from '@/config/paths';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { HomeRoute } from './routes/home';
import { NotFoundRoute } from './routes/not-found';
import { SessionLoading } from './routes/full-page-states';
import { ProtectedLayout } from './routes/protected-layout';
import { RequirePermission } from './routes/require-permission';
import { ResetPasswordRoute } from './routes/reset-password';
import { RootLayout } from './routes/root-layout';
import { RouteError } from './routes/route-error';
import { SignInRoute } from './routes/sign-in';

/** The only place where features meet: each route composes what its page needs. */
export const router = createBrowserRouter([
  {
    element: <RootLayout />,
    errorElement: <RouteError />,
    // Shown while the first page's code loads (only lazy pages make it wait).
    hydrateFallbackElement: <SessionLoading />,
    children: [
      { path: routes.signIn, element: <SignInRoute /> },
      { path: routes.forgotPassword, element: <ForgotPasswordRoute /> },
      { path: routes.resetPassword, element: <ResetPasswordRoute /> },
      {
        element: <ProtectedLayout />,
        children: [
          {
            // Errors inside a page keep the navigation around them.
            errorElement: <RouteError />,
            children: [
              { index: true, element: <HomeRoute /> },
              {
                path: routes.people,
                // Admin-only pages load on demand, so a technician's phone never downloads them.
                lazy: async () => {
                  const { PeopleRoute } = await import('./routes/people');
                  return {
                    element: (
                      <RequirePermission action="users:manage" pageName="People">
                        <PeopleRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.outbox,
                lazy: async () => {
                  const { OutboxRoute } = await import('./routes/outbox');
                  return {
                    element: (
                      <RequirePermission action="mail:read" pageName="Outbox">
                        <OutboxRoute />
                      </RequirePermission>
                    ),
                  };
                },
                children: [
                  { index: true, lazy: async () => ({ Component: (await import('./routes/outbox')).OutboxIndexRoute }) },
                  { path: ':messageId', lazy: async () => ({ Component: (await import('./routes/outbox')).OutboxMessageRoute }) },
                ],
              },
              { path: '*', element: <NotFoundRoute /> },
            ],
          },
        ],
      },
    ],
  },
]);
