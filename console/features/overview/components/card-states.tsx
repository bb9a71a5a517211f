import type { UseQueryResult } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { ErrorState, LoadingState } from '@console/components/ui/states';

/** Loading and problem+json error states of one overview card; the card's own content once the data is in. */
export function CardQuery<T>({ query, loadingLabel, children }: { query: UseQueryResult<T>; loadingLabel: string; children: (data: T) => ReactNode }) {
  if (query.isPending) return <LoadingState label={loadingLabel} />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  return <>{children(query.data)}</>;
}

/** A card body for a role that may not read what the card shows. */
export function NotForRole({ children }: { children: ReactNode }) {
  return <p className="px-5 py-5 text-sm text-ink-600">{children}</p>;
}
