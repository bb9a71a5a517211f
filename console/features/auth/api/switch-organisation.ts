import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Session } from '@shared/schemas/auth';
import { authKeys } from './keys';

export const switchOrganisation = (organisationId: string) =>
  apiClient.post<Session>('/auth/active-organisation', { organisationId });

export function useSwitchOrganisation({ onSuccess }: { onSuccess?: (session: Session) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: switchOrganisation,
    onSuccess: async (session) => {
      queryClient.setQueryData(authKeys.session(), session);
      // Every other cached answer belonged to the previous organisation: drop it, refetch what is on screen.
      await queryClient.resetQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      onSuccess?.(session);
    },
  });
}
