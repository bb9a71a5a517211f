import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Calibration } from '@shared/schemas/calibrations';
import type { Page } from '@shared/schemas/pagination';
import { PAGE_LIMIT_MAX } from '@shared/schemas/pagination';
import { overviewKeys } from './keys';

// One full page (newest first) covers the calibrations a lab keeps in force; older ones were replaced long ago.
export const getCalibrationsQueryOptions = () =>
  queryOptions({
    queryKey: overviewKeys.calibrations(),
    queryFn: () => apiClient.get<Page<Calibration>>('/calibrations', { query: { limit: PAGE_LIMIT_MAX } }),
    staleTime: 60_000,
  });

export const useCalibrations = (enabled: boolean) => useQuery({ ...getCalibrationsQueryOptions(), enabled });
