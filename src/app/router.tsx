import { createBrowserRouter, Navigate, RouterProvider } from 'react-router';
import { paths } from '@/config/paths.ts';
import { RequireRight, RequireSession } from './layout/require-session.tsx';
import { AccountRoute } from './routes/account.tsx';
import { ConversionLayout } from './routes/conversion/layout.tsx';
import { ConversionOverviewRoute } from './routes/conversion/overview.tsx';
import { ConversionBenchRoute } from './routes/conversion/bench.tsx';
import { ConversionChecksRoute } from './routes/conversion/checks.tsx';
import { ConversionFeedsRoute } from './routes/conversion/feeds.tsx';
import { ConversionFilesRoute } from './routes/conversion/files.tsx';
import { ConversionHistoryRoute } from './routes/conversion/history.tsx';
import { ConversionPinMapRoute } from './routes/conversion/pin-map.tsx';
import { ConversionRevisionRoute } from './routes/conversion/revision.tsx';
import { ConversionRevisionsRoute } from './routes/conversion/revisions.tsx';
import { CalculatorRoute } from './routes/calculator.tsx';
import { LibraryRoute } from './routes/library.tsx';
import { ConversionsRoute } from './routes/conversions.tsx';
import { NotFoundRoute, RouteError } from './routes/route-error.tsx';
import { OutboxRoute } from './routes/outbox.tsx';
import { SetPasswordRoute } from './routes/set-password.tsx';
import { SettingsRoute } from './routes/settings.tsx';
import { SignInRoute } from './routes/sign-in.tsx';
import { UsersRoute } from './routes/users.tsx';

const router = createBrowserRouter([
  { path: paths.signIn.path, element: <SignInRoute />, errorElement: <RouteError /> },
  { path: paths.setPassword.path, element: <SetPasswordRoute />, errorElement: <RouteError /> },
  {
    element: <RequireSession />,
    errorElement: <RouteError />,
    children: [
      { path: paths.home.path, element: <Navigate to={paths.conversions.getHref()} replace /> },
      { path: paths.conversions.path, element: <ConversionsRoute /> },
      {
        path: paths.conversion.path,
        element: <ConversionLayout />,
        children: [
          { index: true, element: <ConversionOverviewRoute /> },
          { path: 'pins', element: <ConversionPinMapRoute /> },
          { path: 'feeds', element: <ConversionFeedsRoute /> },
          { path: 'checks', element: <ConversionChecksRoute /> },
          { path: 'files', element: <ConversionFilesRoute /> },
          { path: 'revisions', element: <ConversionRevisionsRoute /> },
          { path: 'revisions/:number', element: <ConversionRevisionRoute /> },
          { path: 'bench', element: <ConversionBenchRoute /> },
          { path: 'history', element: <ConversionHistoryRoute /> },
        ],
      },
      { path: paths.account.path, element: <AccountRoute /> },
      { path: paths.calculator.path, element: <CalculatorRoute /> },
      { path: paths.library.path, element: <LibraryRoute /> },
      {
        element: <RequireRight right="users:manage" />,
        children: [{ path: paths.users.path, element: <UsersRoute /> }],
      },
      {
        element: <RequireRight right="workshop:settings" />,
        children: [{ path: paths.settings.path, element: <SettingsRoute /> }],
      },
      {
        element: <RequireRight right="outbox:read" />,
        children: [{ path: paths.outbox.path, element: <OutboxRoute /> }],
      },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
