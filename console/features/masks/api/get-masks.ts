import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Mask } from '@shared/schemas/masks';
import type { Page } from '@shared/schemas/pagination';
import { maskKeys } from './keys';

export type MaskSummary = Omit<Mask, 'current'>;

export const MASKS_PAGE_SIZE = 50;

export const getMasks = ({ limit, cursor }: { limit: number; cursor?: string }) => apiClient.get<Page<MaskSummary>>('/masks', { query: { limit, cursor } });

export const getMasksQueryOptions = (limit = MASKS_PAGE_SIZE) =>
  infiniteQueryOptions({
    queryKey: maskKeys.list({ limit }),
    queryFn: ({ pageParam }) => getMasks({ limit, cursor: pageParam }),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (lastPage) => (lastPage.hasMore ? lastPage.nextCursor : undefined),
  });

export const useMasks = () => useInfiniteQuery(getMasksQueryOptions());
