import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { CreateInvitationRequest, Invitation } from '@shared/schemas/invitations';
import { invitationKeys } from './keys';

export { createInvitationRequestSchema as createInvitationInputSchema } from '@shared/schemas/invitations';

export type CreateInvitationCall = { input: CreateInvitationRequest; idempotencyKey: string };

// One Idempotency-Key per filled-in form: resubmitting after a lost answer replays it instead of a 409.
export const createInvitation = ({ input, idempotencyKey }: CreateInvitationCall) =>
  apiClient.post<Invitation>('/invitations', input, { headers: { 'Idempotency-Key': idempotencyKey } });

export function useCreateInvitation({ onSuccess }: { onSuccess?: (invitation: Invitation) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: async (invitation) => {
      onSuccess?.(invitation);
      await queryClient.invalidateQueries({ queryKey: invitationKeys.lists() });
    },
  });
}
