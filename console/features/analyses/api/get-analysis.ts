import { queryOptions, useQueries, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Analysis } from '@shared/schemas/analyses';
import { pollIntervalMs } from '../utils/polling';
import { analysisKeys } from './keys';

export const getAnalysis = (analysisId: string) => apiClient.get<Analysis>(`/analyses/${encodeURIComponent(analysisId)}`);

export const getAnalysisQueryOptions = (analysisId: string) =>
  queryOptions({
    queryKey: analysisKeys.detail(analysisId),
    queryFn: () => getAnalysis(analysisId),
    refetchInterval: (query) => pollIntervalMs(query.state.data ? [query.state.data.status] : []),
  });

export const useAnalysis = (analysisId: string) => useQuery(getAnalysisQueryOptions(analysisId));

/** Several analyses at once (the overlay), each cached under its own detail key. */
export const useAnalysesByIds = (analysisIds: readonly string[]) =>
  useQueries({ queries: analysisIds.map((analysisId) => getAnalysisQueryOptions(analysisId)) });
