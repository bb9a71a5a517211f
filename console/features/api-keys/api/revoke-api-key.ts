import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { ApiKey } from '@shared/schemas/api-keys';
import { apiKeyKeys } from './keys';

export const revokeApiKey = (keyId: string) => apiClient.post<ApiKey>(`/api-keys/${encodeURIComponent(keyId)}/revoke`);

export function useRevokeApiKey({ onSuccess }: { onSuccess?: (apiKey: ApiKey) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeApiKey,
    onSuccess: async (apiKey) => {
      await queryClient.invalidateQueries({ queryKey: apiKeyKeys.lists() });
      onSuccess?.(apiKey);
    },
  });
}
