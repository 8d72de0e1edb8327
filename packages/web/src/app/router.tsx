import { createBrowserRouter, Navigate, type RouteObject } from 'react-router-dom';
import { AdminOutboxRoute } from './routes/admin-outbox';
import { AppLayout } from './routes/app-layout';
import { EventsRoute } from './routes/events';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { InvitationRoute } from './routes/invitation';
import { NotFoundRoute } from './routes/not-found';
import { ResetPasswordRoute } from './routes/reset-password';
import { SignInRoute } from './routes/sign-in';
import { paths } from '@/config/paths';

export const routes: RouteObject[] = [
  { path: paths.signIn, element: <SignInRoute /> },
  { path: paths.forgotPassword, element: <ForgotPasswordRoute /> },
  { path: '/reset-password/:token', element: <ResetPasswordRoute /> },
  { path: '/invitations/:token', element: <InvitationRoute /> },
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
      { path: paths.adminOutbox, element: <AdminOutboxRoute /> },
      {
        path: paths.comparison,
        lazy: () => import('./routes/comparison').then((m) => ({ Component: m.ComparisonRoute })),
      },
      {
        path: paths.plotsPreview,
        // The preview pulls in D3 and the fixture; it loads only when visited.
        lazy: () => import('./routes/plots-preview').then((m) => ({ Component: m.PlotsPreviewRoute })),
      },
    ],
  },
  { path: '*', element: <NotFoundRoute /> },
];

export function createAppRouter() {
  return createBrowserRouter(routes);
}
