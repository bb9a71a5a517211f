import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Analysis } from '@shared/schemas/analyses';
import type { Page } from '@shared/schemas/pagination';
import { TERMINAL_STATUSES } from '@shared/schemas/analyses';
import { overviewKeys } from './keys';

export type RecentAnalysis = Omit<Analysis, 'result'>;

export const RECENT_ANALYSES_LIMIT = 7;

export const getRecentAnalysesQueryOptions = (limit = RECENT_ANALYSES_LIMIT) =>
  queryOptions({
    queryKey: overviewKeys.recentAnalyses(limit),
    queryFn: () => apiClient.get<Page<RecentAnalysis>>('/analyses', { query: { limit } }),
    // While one of the rows is still queued or running, look again every few seconds.
    refetchInterval: (query) => (query.state.data?.data.some((row) => !TERMINAL_STATUSES.includes(row.status)) ? 4000 : false),
  });

export const useRecentAnalyses = (enabled: boolean) => useQuery({ ...getRecentAnalysesQueryOptions(), enabled });
