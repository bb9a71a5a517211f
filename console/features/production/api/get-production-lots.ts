import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { ProductionLotList } from '@shared/schemas/production';
import { productionKeys } from './keys';

/** The models and lots the organisation has measured: the choices of the production screen. */
export const getProductionLots = () => apiClient.get<ProductionLotList>('/production-lots');

export const getProductionLotsQueryOptions = () => queryOptions({ queryKey: productionKeys.lots(), queryFn: getProductionLots });

export const useProductionLots = () => useQuery(getProductionLotsQueryOptions());
