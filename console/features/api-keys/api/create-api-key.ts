import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { CreateApiKeyRequest, CreatedApiKey } from '@shared/schemas/api-keys';
import { apiKeyKeys } from './keys';

export { createApiKeyRequestSchema as createApiKeyInputSchema } from '@shared/schemas/api-keys';

export type CreateApiKeyCall = { input: CreateApiKeyRequest; idempotencyKey: string };

// The form keeps one Idempotency-Key until its values change, so resubmitting after a lost answer replays
// the first creation instead of minting a second key.
export const createApiKey = ({ input, idempotencyKey }: CreateApiKeyCall) =>
  apiClient.post<CreatedApiKey>('/api-keys', input, { headers: { 'Idempotency-Key': idempotencyKey } });

export function useCreateApiKey({ onSuccess }: { onSuccess?: (created: CreatedApiKey) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createApiKey,
    onSuccess: async (created) => {
      onSuccess?.(created);
      await queryClient.invalidateQueries({ queryKey: apiKeyKeys.lists() });
    },
  });
}
