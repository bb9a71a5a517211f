import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Health } from '@shared/schemas/health';
import { healthKeys } from './keys';

const HEALTH_POLL_MS = 30_000;

// A degraded service still answers with its report (HTTP 503); the overview shows it rather than an error.
export const getHealth = () => apiClient.get<Health>('/health', { acceptStatuses: [503] });

export const getHealthQueryOptions = () =>
  queryOptions({
    queryKey: healthKeys.status(),
    queryFn: getHealth,
    staleTime: HEALTH_POLL_MS,
    refetchInterval: HEALTH_POLL_MS,
  });

export const useHealth = () => useQuery(getHealthQueryOptions());
