import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Page } from '@shared/schemas/pagination';
import type { WebhookDelivery } from '@shared/schemas/webhooks';
import { deliveriesPollIntervalMs } from '../utils/delivery-display';
import { webhookKeys } from './keys';

export const WEBHOOK_DELIVERIES_PAGE_SIZE = 25;

export const getWebhookDeliveries = ({ endpointId, limit, cursor }: { endpointId: string; limit: number; cursor?: string }) =>
  apiClient.get<Page<WebhookDelivery>>(`/webhook-endpoints/${encodeURIComponent(endpointId)}/deliveries`, {
    query: { limit, cursor },
  });

export const getWebhookDeliveriesQueryOptions = (endpointId: string, limit = WEBHOOK_DELIVERIES_PAGE_SIZE) =>
  infiniteQueryOptions({
    queryKey: [...webhookKeys.deliveries(endpointId), { limit }],
    queryFn: ({ pageParam }) => getWebhookDeliveries({ endpointId, limit, cursor: pageParam }),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (lastPage) => (lastPage.hasMore ? lastPage.nextCursor : undefined),
    // Deliveries change on their own (the dispatcher sends them), so the log keeps itself current.
    refetchInterval: (query) =>
      deliveriesPollIntervalMs(query.state.data?.pages.flatMap((page) => page.data.map((delivery) => delivery.status)) ?? []),
  });

export const useWebhookDeliveries = (endpointId: string) => useInfiniteQuery(getWebhookDeliveriesQueryOptions(endpointId));
