import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Analysis, AnalysisSort } from '@shared/schemas/analyses';
import type { Page } from '@shared/schemas/pagination';
import { toListQuery, type AnalysisFilters } from '../utils/filters';
import { pollIntervalMs } from '../utils/polling';
import { DEFAULT_ANALYSIS_SORT } from '../utils/sort';
import { analysisKeys } from './keys';

/** A row of the history: the list endpoint leaves the (large) result out. */
export type AnalysisSummary = Omit<Analysis, 'result'>;

export const ANALYSES_PAGE_SIZE = 25;

export const getAnalyses = ({ filters, sort, limit, cursor }: { filters: AnalysisFilters; sort: AnalysisSort; limit: number; cursor?: string }) =>
  apiClient.get<Page<AnalysisSummary>>('/analyses', { query: { ...toListQuery(filters), sort: sort === DEFAULT_ANALYSIS_SORT ? undefined : sort, limit, cursor } });

// While any loaded job is still queued or running, all loaded pages are refetched every couple of seconds; the
// polling stops by itself once every visible job has finished.
// The server sorts (GET /v1/analyses?sort=…); each sort is its own list, since a cursor belongs to one order.
export const getAnalysesQueryOptions = (filters: AnalysisFilters, sort: AnalysisSort = DEFAULT_ANALYSIS_SORT, limit = ANALYSES_PAGE_SIZE) =>
  infiniteQueryOptions({
    queryKey: analysisKeys.list({ ...filters, sort, limit }),
    queryFn: ({ pageParam }) => getAnalyses({ filters, sort, limit, cursor: pageParam }),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (lastPage) => (lastPage.hasMore ? lastPage.nextCursor : undefined),
    refetchInterval: (query) => pollIntervalMs(query.state.data?.pages.flatMap((page) => page.data.map((row) => row.status)) ?? []),
  });

export const useAnalyses = (filters: AnalysisFilters, sort: AnalysisSort = DEFAULT_ANALYSIS_SORT) => useInfiniteQuery(getAnalysesQueryOptions(filters, sort));
