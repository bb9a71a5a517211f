import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Calibration } from '@shared/schemas/calibrations';
import type { Page } from '@shared/schemas/pagination';
import { calibrationKeys } from './keys';

export const CALIBRATIONS_PAGE_SIZE = 100;

export const getCalibrations = ({ limit, cursor }: { limit: number; cursor?: string }) =>
  apiClient.get<Page<Calibration>>('/calibrations', { query: { limit, cursor } });

export const getCalibrationsQueryOptions = (limit = CALIBRATIONS_PAGE_SIZE) =>
  infiniteQueryOptions({
    queryKey: calibrationKeys.list({ limit }),
    queryFn: ({ pageParam }) => getCalibrations({ limit, cursor: pageParam }),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (lastPage) => (lastPage.hasMore ? lastPage.nextCursor : undefined),
  });

export const useCalibrations = () => useInfiniteQuery(getCalibrationsQueryOptions());
