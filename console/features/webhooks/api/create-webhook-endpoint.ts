import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { CreatedWebhookEndpoint, CreateWebhookEndpointRequest } from '@shared/schemas/webhooks';
import { webhookKeys } from './keys';

export { createWebhookEndpointRequestSchema as createWebhookEndpointInputSchema } from '@shared/schemas/webhooks';

export type CreateWebhookEndpointCall = { input: CreateWebhookEndpointRequest; idempotencyKey: string };

// One Idempotency-Key per set of form values: resubmitting after a lost answer replays the first creation
// (and its secret) instead of registering the receiver twice.
export const createWebhookEndpoint = ({ input, idempotencyKey }: CreateWebhookEndpointCall) =>
  apiClient.post<CreatedWebhookEndpoint>('/webhook-endpoints', input, { headers: { 'Idempotency-Key': idempotencyKey } });

export function useCreateWebhookEndpoint({ onSuccess }: { onSuccess?: (created: CreatedWebhookEndpoint) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createWebhookEndpoint,
    onSuccess: async (created) => {
      onSuccess?.(created);
      await queryClient.invalidateQueries({ queryKey: webhookKeys.lists() });
    },
  });
}
