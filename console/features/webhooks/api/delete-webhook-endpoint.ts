import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import { webhookKeys } from './keys';

export const deleteWebhookEndpoint = (endpointId: string) =>
  apiClient.delete<void>(`/webhook-endpoints/${encodeURIComponent(endpointId)}`);

export function useDeleteWebhookEndpoint({ onSuccess }: { onSuccess?: (endpointId: string) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteWebhookEndpoint,
    // Leave the endpoint's screen first, so nothing asks for the endpoint once it is gone.
    onSuccess: async (_nothing, endpointId) => {
      onSuccess?.(endpointId);
      queryClient.removeQueries({ queryKey: webhookKeys.detail(endpointId) });
      await queryClient.invalidateQueries({ queryKey: webhookKeys.lists() });
    },
  });
}
