import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Analysis } from '@shared/schemas/analyses';
import type { Page } from '@shared/schemas/pagination';
import { maskKeys } from './keys';

export type CandidateAnalysis = Omit<Analysis, 'result'>;

export const GOLDEN_CANDIDATES_LIMIT = 100;

/** Succeeded analyses from the history (newest first) that could serve as golden units. */
export const getGoldenCandidates = (filters: { model?: string; lot?: string }) =>
  apiClient.get<Page<CandidateAnalysis>>('/analyses', { query: { status: 'succeeded', limit: GOLDEN_CANDIDATES_LIMIT, ...filters } });

export const getGoldenCandidatesQueryOptions = (filters: { model?: string; lot?: string }) =>
  queryOptions({ queryKey: maskKeys.goldenCandidates(filters), queryFn: () => getGoldenCandidates(filters) });

export const useGoldenCandidates = (filters: { model?: string; lot?: string }) => useQuery(getGoldenCandidatesQueryOptions(filters));
