import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import { memberKeys } from './keys';

export const removeMember = (memberId: string) => apiClient.delete<void>(`/members/${encodeURIComponent(memberId)}`);

export function useRemoveMember({ onSuccess }: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: memberKeys.lists() });
      onSuccess?.();
    },
  });
}
