import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Usage } from '@shared/schemas/usage';
import { overviewKeys } from './keys';

export const getUsageQueryOptions = () =>
  queryOptions({ queryKey: overviewKeys.usage(), queryFn: () => apiClient.get<Usage>('/usage'), staleTime: 60_000 });

export const useUsage = (enabled: boolean) => useQuery({ ...getUsageQueryOptions(), enabled });
