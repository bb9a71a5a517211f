import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { WebhookDelivery } from '@shared/schemas/webhooks';
import { webhookKeys } from './keys';

export const resendWebhookDelivery = ({ endpointId, deliveryId }: { endpointId: string; deliveryId: string }) =>
  apiClient.post<WebhookDelivery>(
    `/webhook-endpoints/${encodeURIComponent(endpointId)}/deliveries/${encodeURIComponent(deliveryId)}/resend`,
  );

export function useResendWebhookDelivery({ onSuccess }: { onSuccess?: (delivery: WebhookDelivery) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendWebhookDelivery,
    onSuccess: async (delivery) => {
      await queryClient.invalidateQueries({ queryKey: webhookKeys.deliveries(delivery.endpointId) });
      onSuccess?.(delivery);
    },
  });
}
