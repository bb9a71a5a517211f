import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { ProductionUnitList } from '@shared/schemas/production';
import type { ProductionQuery } from '../utils/production-filter';
import { productionKeys } from './keys';

/** Each succeeded unit's figures, for the histograms, the daily trend and the failing-units list. */
export const getProductionUnits = (query: ProductionQuery) => apiClient.get<ProductionUnitList>('/production-units', { query });

export const getProductionUnitsQueryOptions = (query: ProductionQuery) =>
  queryOptions({ queryKey: productionKeys.units(query), queryFn: () => getProductionUnits(query) });

export const useProductionUnits = (query: ProductionQuery | null) =>
  useQuery({ ...getProductionUnitsQueryOptions(query ?? { model: '' }), enabled: query !== null });
