import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { DailyUsage } from '@shared/schemas/usage';
import { usageKeys } from './keys';

export const getDailyUsage = () => apiClient.get<DailyUsage>('/usage/daily');

export const getDailyUsageQueryOptions = () => queryOptions({ queryKey: usageKeys.daily(), queryFn: getDailyUsage });

export const useDailyUsage = () => useQuery(getDailyUsageQueryOptions());
