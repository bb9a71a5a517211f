import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { ApiKey } from '@shared/schemas/api-keys';
import type { Page } from '@shared/schemas/pagination';
import { apiKeyKeys } from './keys';

export const API_KEYS_PAGE_SIZE = 20;

export const getApiKeys = ({ limit, cursor }: { limit: number; cursor?: string }) =>
  apiClient.get<Page<ApiKey>>('/api-keys', { query: { limit, cursor } });

export const getApiKeysQueryOptions = (limit = API_KEYS_PAGE_SIZE) =>
  infiniteQueryOptions({
    queryKey: apiKeyKeys.list({ limit }),
    queryFn: ({ pageParam }) => getApiKeys({ limit, cursor: pageParam }),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (lastPage) => (lastPage.hasMore ? lastPage.nextCursor : undefined),
  });

export const useApiKeys = (limit?: number) => useInfiniteQuery(getApiKeysQueryOptions(limit));
