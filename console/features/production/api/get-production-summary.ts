import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { ProductionSummary } from '@shared/schemas/production';
import type { ProductionQuery } from '../utils/production-filter';
import { productionKeys } from './keys';

export const getProductionSummary = (query: ProductionQuery) => apiClient.get<ProductionSummary>('/production-summary', { query });

export const getProductionSummaryQueryOptions = (query: ProductionQuery) =>
  queryOptions({ queryKey: productionKeys.summary(query), queryFn: () => getProductionSummary(query) });

export const useProductionSummary = (query: ProductionQuery | null) =>
  useQuery({ ...getProductionSummaryQueryOptions(query ?? { model: '' }), enabled: query !== null });
