import { createBrowserRouter, Navigate, type RouteObject } from 'react-router-dom';
import { AccountRoute } from './routes/account';
import { AdminOutboxRoute } from './routes/admin-outbox';
import { AppLayout } from './routes/app-layout';
import { BodiesRoute } from './routes/bodies';
import { EventsRoute } from './routes/events';
import { FitLinkRoute } from './routes/fit-link';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { InvitationRoute } from './routes/invitation';
import { NotFoundRoute } from './routes/not-found';
import { ResetPasswordRoute } from './routes/reset-password';
import { SignInRoute } from './routes/sign-in';
import { TeamRoute } from './routes/team';
import { paths } from '@/config/paths';

export const routes: RouteObject[] = [
  { path: paths.signIn, element: <SignInRoute /> },
  { path: paths.forgotPassword, element: <ForgotPasswordRoute /> },
  { path: '/reset-password/:token', element: <ResetPasswordRoute /> },
  { path: '/invitations/:token', element: <InvitationRoute /> },
  { path: '/events/:eventId/fits/:fitId', element: <FitLinkRoute /> },
  { path: paths.comparison, element: <Navigate to={paths.bodies} replace /> },
  {
    element: <AppLayout />,
    children: [
      { index: true, element: <Navigate to={paths.events} replace /> },
      { path: paths.events, element: <EventsRoute /> },
      {
        path: '/events/:eventId',
        // The desk (DataGrid, forms, and D3 behind it) loads on first visit, not with the sign-in page.
        lazy: () => import('./routes/event').then((m) => ({ Component: m.EventRoute })),
      },
      { path: paths.bodies, element: <BodiesRoute /> },
      {
        path: '/bodies/:bodyId',
        // The comparison, shape and dynamics plots (D3 behind them) load with the body page, not before.
        lazy: () => import('./routes/body').then((m) => ({ Component: m.BodyRoute })),
      },
      { path: paths.team, element: <TeamRoute /> },
      { path: paths.account, element: <AccountRoute /> },
      { path: paths.adminOutbox, element: <AdminOutboxRoute /> },
      // The plots on an invented occultation, for working on them; not part of the product.
      ...(import.meta.env.DEV
        ? [
            {
              path: paths.plotsPreview,
              lazy: () => import('./routes/plots-preview').then((m) => ({ Component: m.PlotsPreviewRoute })),
            },
          ]
        : []),
    ],
  },
  { path: '*', element: <NotFoundRoute /> },
];

export function createAppRouter() {
  return createBrowserRouter(routes);
}
