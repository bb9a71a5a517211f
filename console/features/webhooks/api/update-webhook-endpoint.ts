import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { UpdateWebhookEndpointRequest, WebhookEndpoint } from '@shared/schemas/webhooks';
import { webhookKeys } from './keys';

export const updateWebhookEndpoint = ({ endpointId, changes }: { endpointId: string; changes: UpdateWebhookEndpointRequest }) =>
  apiClient.patch<WebhookEndpoint>(`/webhook-endpoints/${encodeURIComponent(endpointId)}`, changes);

export function useUpdateWebhookEndpoint({ onSuccess }: { onSuccess?: (endpoint: WebhookEndpoint) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateWebhookEndpoint,
    onSuccess: async (endpoint) => {
      queryClient.setQueryData(webhookKeys.detail(endpoint.id), endpoint);
      await queryClient.invalidateQueries({ queryKey: webhookKeys.lists() });
      onSuccess?.(endpoint);
    },
  });
}
