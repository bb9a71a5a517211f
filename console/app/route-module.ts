import type { QueryClient } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import type { LoaderFunction } from 'react-router';

/** What every screen module in app/routes exports: the screen, and optionally a loader that prefetches data. */
export type RouteModule = {
  default: ComponentType;
  clientLoader?: (queryClient: QueryClient) => LoaderFunction;
  ErrorBoundary?: ComponentType;
};

/** Adapts a lazily imported screen module to what React Router's `lazy` expects. */
export const toLazyRoute =
  (queryClient: QueryClient) =>
  ({ default: Component, clientLoader, ErrorBoundary }: RouteModule) => ({
    Component,
    ErrorBoundary,
    loader: clientLoader?.(queryClient),
  });
