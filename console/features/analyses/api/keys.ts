import type { AnalysisSort } from '@shared/schemas/analyses';
import type { AnalysisFilters } from '../utils/filters';

export const analysisKeys = {
  all: ['analyses'] as const,
  lists: () => [...analysisKeys.all, 'list'] as const,
  list: (filters: AnalysisFilters & { sort?: AnalysisSort; limit: number }) => [...analysisKeys.lists(), filters] as const,
  details: () => [...analysisKeys.all, 'detail'] as const,
  detail: (analysisId: string) => [...analysisKeys.details(), analysisId] as const,
  maskVersion: (maskId: string, version: number | null) => [...analysisKeys.all, 'mask', maskId, version] as const,
};
