import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { WebhookEndpoint } from '@shared/schemas/webhooks';
import { webhookKeys } from './keys';

export const getWebhookEndpoint = (endpointId: string) =>
  apiClient.get<WebhookEndpoint>(`/webhook-endpoints/${encodeURIComponent(endpointId)}`);

export const getWebhookEndpointQueryOptions = (endpointId: string) =>
  queryOptions({ queryKey: webhookKeys.detail(endpointId), queryFn: () => getWebhookEndpoint(endpointId) });

export const useWebhookEndpoint = (endpointId: string) => useQuery(getWebhookEndpointQueryOptions(endpointId));
