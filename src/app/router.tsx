import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useState, type ComponentType } from 'react';
import { createBrowserRouter, Navigate, RouterProvider } from 'react-router-dom';
import { Loading } from '@/components/ui/loading.tsx';
import { paths } from '@/config/paths.ts';
import { RequireRight, RequireSession, SessionOptional } from './layout/require-session.tsx';
import { conversionLoaders } from './loaders.ts';
import { NotFoundRoute, RouteError } from './routes/route-error.tsx';
import { SetPasswordRoute } from './routes/set-password.tsx';
import { SignInRoute } from './routes/sign-in.tsx';

/**
 * Every screen behind sign-in is its own chunk, fetched when first visited: the sign-in page does
 * not download the grid, the PDF viewer or the calculator.
 */
const screen =
  <M,>(load: () => Promise<M>, pick: (module: M) => ComponentType) =>
  async () => ({ Component: pick(await load()) });

function createRouter(queryClient: QueryClient) {
  const load = conversionLoaders(queryClient);
  return createBrowserRouter([
    { path: paths.signIn.path, element: <SignInRoute />, errorElement: <RouteError /> },
    { path: paths.setPassword.path, element: <SetPasswordRoute />, errorElement: <RouteError /> },
    {
      // Help is read before signing in too (from the sign-in page).
      element: <SessionOptional />,
      errorElement: <RouteError />,
      children: [
        {
          path: paths.help.path,
          lazy: screen(
            () => import('./routes/help.tsx'),
            (m) => m.HelpRoute,
          ),
        },
      ],
    },
    {
      element: <RequireSession />,
      errorElement: <RouteError />,
      hydrateFallbackElement: <Loading what="Loading Loomwright" />,
      children: [
        { path: paths.home.path, element: <Navigate to={paths.conversions.getHref()} replace /> },
        {
          path: paths.conversions.path,
          lazy: screen(
            () => import('./routes/conversions.tsx'),
            (m) => m.ConversionsRoute,
          ),
        },
        {
          path: paths.conversion.path,
          loader: load.conversion,
          lazy: screen(
            () => import('./routes/conversion/layout.tsx'),
            (m) => m.ConversionLayout,
          ),
          children: [
            {
              index: true,
              loader: load.overview,
              lazy: screen(
                () => import('./routes/conversion/overview.tsx'),
                (m) => m.ConversionOverviewRoute,
              ),
            },
            {
              path: 'pins',
              loader: load.pinMap,
              lazy: screen(
                () => import('./routes/conversion/pin-map.tsx'),
                (m) => m.ConversionPinMapRoute,
              ),
            },
            {
              path: 'feeds',
              loader: load.feeds,
              lazy: screen(
                () => import('./routes/conversion/feeds.tsx'),
                (m) => m.ConversionFeedsRoute,
              ),
            },
            {
              path: 'wires',
              lazy: screen(
                () => import('./routes/conversion/wires.tsx'),
                (m) => m.ConversionWiresRoute,
              ),
            },
            {
              path: 'box',
              lazy: screen(
                () => import('./routes/conversion/box.tsx'),
                (m) => m.ConversionBoxRoute,
              ),
            },
            {
              path: 'circuits/:kind/:refId',
              lazy: screen(
                () => import('./routes/conversion/circuit.tsx'),
                (m) => m.ConversionCircuitRoute,
              ),
            },
            {
              path: 'checks',
              lazy: screen(
                () => import('./routes/conversion/checks.tsx'),
                (m) => m.ConversionChecksRoute,
              ),
            },
            {
              path: 'files',
              lazy: screen(
                () => import('./routes/conversion/files.tsx'),
                (m) => m.ConversionFilesRoute,
              ),
            },
            {
              path: 'revisions',
              lazy: screen(
                () => import('./routes/conversion/revisions.tsx'),
                (m) => m.ConversionRevisionsRoute,
              ),
            },
            {
              path: 'revisions/:number',
              loader: load.revision,
              lazy: screen(
                () => import('./routes/conversion/revision.tsx'),
                (m) => m.ConversionRevisionRoute,
              ),
            },
            {
              path: 'bench',
              lazy: screen(
                () => import('./routes/conversion/bench.tsx'),
                (m) => m.ConversionBenchRoute,
              ),
            },
            {
              path: 'history',
              lazy: screen(
                () => import('./routes/conversion/history.tsx'),
                (m) => m.ConversionHistoryRoute,
              ),
            },
          ],
        },
        {
          path: paths.account.path,
          lazy: screen(
            () => import('./routes/account.tsx'),
            (m) => m.AccountRoute,
          ),
        },
        {
          path: paths.calculator.path,
          lazy: screen(
            () => import('./routes/calculator.tsx'),
            (m) => m.CalculatorRoute,
          ),
        },
        {
          path: paths.library.path,
          lazy: screen(
            () => import('./routes/library.tsx'),
            (m) => m.LibraryRoute,
          ),
        },
        {
          element: <RequireRight right="users:manage" />,
          children: [
            {
              path: paths.users.path,
              lazy: screen(
                () => import('./routes/users.tsx'),
                (m) => m.UsersRoute,
              ),
            },
          ],
        },
        {
          element: <RequireRight right="workshop:settings" />,
          children: [
            {
              path: paths.settings.path,
              lazy: screen(
                () => import('./routes/settings.tsx'),
                (m) => m.SettingsRoute,
              ),
            },
          ],
        },
        {
          element: <RequireRight right="outbox:read" />,
          children: [
            {
              path: paths.outbox.path,
              lazy: screen(
                () => import('./routes/outbox.tsx'),
                (m) => m.OutboxRoute,
              ),
            },
          ],
        },
        { path: '*', element: <NotFoundRoute /> },
      ],
    },
  ]);
}

export function AppRouter() {
  const queryClient = useQueryClient();
  const [router] = useState(() => createRouter(queryClient));
  return <RouterProvider router={router} />;
}
