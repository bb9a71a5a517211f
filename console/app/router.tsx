import type { QueryClient } from '@tanstack/react-query';
import { Outlet, createBrowserRouter } from 'react-router';
import { AppLoading } from '@console/components/errors/app-loading';
import { RouteError } from '@console/components/errors/route-error';
import { paths } from '@console/config/paths';
import { toLazyRoute } from './route-module';

// Every screen is its own chunk, loaded when first visited; its loader starts the screen's queries meanwhile.
export function createAppRouter(queryClient: QueryClient) {
  const lazy = toLazyRoute(queryClient);
  return createBrowserRouter([
    {
      Component: Outlet,
      HydrateFallback: AppLoading,
      ErrorBoundary: RouteError,
      children: [
        { path: paths.auth.signIn.path, lazy: () => import('./routes/auth/sign-in').then(lazy) },
        { path: paths.auth.signUp.path, lazy: () => import('./routes/auth/sign-up').then(lazy) },
        { path: paths.invitations.accept.path, lazy: () => import('./routes/invitation-accept').then(lazy) },
        {
          path: paths.app.root.path,
          lazy: () => import('./routes/app/root').then(lazy),
          children: [
            { index: true, lazy: () => import('./routes/app/overview').then(lazy) },
            { path: paths.app.members.path, lazy: () => import('./routes/app/members').then(lazy) },
            { path: paths.app.usage.path, lazy: () => import('./routes/app/usage').then(lazy) },
            { path: paths.app.apiKeys.path, lazy: () => import('./routes/app/api-keys').then(lazy) },
            { path: paths.app.analyses.path, lazy: () => import('./routes/app/analyses').then(lazy) },
            { path: paths.app.analysis.path, lazy: () => import('./routes/app/analysis-detail').then(lazy) },
            { path: paths.app.compare.path, lazy: () => import('./routes/app/compare').then(lazy) },
            { path: paths.app.stimuli.path, lazy: () => import('./routes/app/stimuli').then(lazy) },
            { path: paths.app.production.path, lazy: () => import('./routes/app/production').then(lazy) },
            { path: paths.app.calibrations.path, lazy: () => import('./routes/app/calibrations').then(lazy) },
            { path: paths.app.masks.path, lazy: () => import('./routes/app/masks').then(lazy) },
            { path: paths.app.mask.path, lazy: () => import('./routes/app/mask-detail').then(lazy) },
            { path: paths.app.webhooks.path, lazy: () => import('./routes/app/webhooks').then(lazy) },
            { path: paths.app.webhook.path, lazy: () => import('./routes/app/webhook-detail').then(lazy) },
            { path: paths.app.developer.path, lazy: () => import('./routes/app/developer').then(lazy) },
            { path: paths.app.devOutbox.path, lazy: () => import('./routes/app/dev-outbox').then(lazy) },
          ],
        },
        { path: '*', lazy: () => import('./routes/not-found').then(lazy) },
      ],
    },
  ]);
}
