import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Usage } from '@shared/schemas/usage';
import { usageKeys } from './keys';

export const getUsage = () => apiClient.get<Usage>('/usage');

export const getUsageQueryOptions = () => queryOptions({ queryKey: usageKeys.summary(), queryFn: getUsage });

export const useUsage = () => useQuery(getUsageQueryOptions());
