import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import { authKeys } from './keys';

export const signOut = () => apiClient.post<void>('/auth/sign-out');

export function useSignOut({ onSettled }: { onSettled?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      // Even if the request failed, this browser should forget what it showed.
      queryClient.clear();
      queryClient.setQueryData(authKeys.session(), null);
      onSettled?.();
    },
  });
}
