import { useMutation } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Session } from '@shared/schemas/auth';
import type { AcceptInvitationRequest } from '@shared/schemas/invitations';

export { acceptInvitationRequestSchema as acceptInvitationInputSchema } from '@shared/schemas/invitations';

export const acceptInvitation = (input: AcceptInvitationRequest) => apiClient.post<Session>('/invitations/accept', input);

/** The caller replaces the cached session with the answer (the app layer owns the session cache). */
export function useAcceptInvitation({ onSuccess }: { onSuccess?: (session: Session) => void } = {}) {
  return useMutation({ mutationFn: acceptInvitation, onSuccess });
}
