import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { CreatedWebhookEndpoint } from '@shared/schemas/webhooks';
import { webhookKeys } from './keys';

/** The old secret keeps signing beside the new one for `graceHours` (the API's default when absent). */
export const rotateWebhookSecret = ({ endpointId, graceHours }: { endpointId: string; graceHours?: number }) =>
  apiClient.post<CreatedWebhookEndpoint>(
    `/webhook-endpoints/${encodeURIComponent(endpointId)}/rotate-secret`,
    graceHours === undefined ? {} : { graceHours },
  );

export function useRotateWebhookSecret({ onSuccess }: { onSuccess?: (rotated: CreatedWebhookEndpoint) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: rotateWebhookSecret,
    onSuccess: async (rotated) => {
      queryClient.setQueryData(webhookKeys.detail(rotated.endpoint.id), rotated.endpoint);
      onSuccess?.(rotated);
      await queryClient.invalidateQueries({ queryKey: webhookKeys.lists() });
    },
  });
}
