import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Page } from '@shared/schemas/pagination';
import type { WebhookEndpoint } from '@shared/schemas/webhooks';
import { webhookKeys } from './keys';

export const WEBHOOK_ENDPOINTS_PAGE_SIZE = 20;

export const getWebhookEndpoints = ({ limit, cursor }: { limit: number; cursor?: string }) =>
  apiClient.get<Page<WebhookEndpoint>>('/webhook-endpoints', { query: { limit, cursor } });

export const getWebhookEndpointsQueryOptions = (limit = WEBHOOK_ENDPOINTS_PAGE_SIZE) =>
  infiniteQueryOptions({
    queryKey: webhookKeys.list({ limit }),
    queryFn: ({ pageParam }) => getWebhookEndpoints({ limit, cursor: pageParam }),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (lastPage) => (lastPage.hasMore ? lastPage.nextCursor : undefined),
  });

export const useWebhookEndpoints = (limit?: number) => useInfiniteQuery(getWebhookEndpointsQueryOptions(limit));
