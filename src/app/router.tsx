import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { Loading } from '../components/ui/loading';
import { patterns } from './paths';
import { HomeRoute } from './routes/home-route';
import { NotFoundRoute } from './routes/not-found-route';
import { RouteError } from './routes/route-error';
import { AppShell } from './shell/app-shell';
import { PublicLayout } from './shell/public-layout';

// Pages outside the everyday path load on demand, so a member's phone fetches the member
// table or the mail reader only when a coordinator actually opens them.
const routes: RouteObject[] = [
  {
    id: 'root',
    errorElement: <RouteError />,
    hydrateFallbackElement: <Loading label="Opening Heelwood…" />,
    children: [
      {
        element: <PublicLayout />,
        errorElement: <RouteError />,
        children: [
          {
            path: patterns.signIn,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/sign-in-route')).SignInRoute }),
          },
          {
            path: patterns.signUp,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/sign-up-route')).SignUpRoute }),
          },
          {
            path: patterns.applicationReceived,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/application-received-route')).ApplicationReceivedRoute }),
          },
          {
            path: patterns.forgotPassword,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/forgot-password-route')).ForgotPasswordRoute }),
          },
          {
            path: patterns.resetPassword,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/reset-password-route')).ResetPasswordRoute }),
          },
          { path: '*', element: <NotFoundRoute /> },
        ],
      },
      {
        element: <AppShell />,
        errorElement: <RouteError />,
        children: [
          { index: true, element: <HomeRoute />, errorElement: <RouteError /> },
          {
            path: patterns.members,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/members-route')).MembersRoute }),
          },
          {
            path: patterns.mailbox,
            errorElement: <RouteError />,
            lazy: async () => ({ Component: (await import('./routes/mailbox-route')).MailboxRoute }),
          },
        ],
      },
    ],
  },
];

export function createRouter() {
  return createBrowserRouter(routes);
}

export { routes };
