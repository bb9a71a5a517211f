import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Invitation } from '@shared/schemas/invitations';
import { invitationKeys } from './keys';

export const resendInvitation = (invitationId: string) =>
  apiClient.post<Invitation>(`/invitations/${encodeURIComponent(invitationId)}/resend`);

export function useResendInvitation({ onSuccess }: { onSuccess?: (invitation: Invitation) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendInvitation,
    onSuccess: async (invitation) => {
      onSuccess?.(invitation);
      await queryClient.invalidateQueries({ queryKey: invitationKeys.lists() });
    },
  });
}
