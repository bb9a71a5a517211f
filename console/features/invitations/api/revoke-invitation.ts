import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import { invitationKeys } from './keys';

export const revokeInvitation = (invitationId: string) => apiClient.delete<void>(`/invitations/${encodeURIComponent(invitationId)}`);

export function useRevokeInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationKeys.lists() }),
  });
}
