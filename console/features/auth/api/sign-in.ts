import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Session, SignInRequest } from '@shared/schemas/auth';
import { authKeys } from './keys';

export { signInRequestSchema as signInInputSchema } from '@shared/schemas/auth';

export const signIn = (input: SignInRequest) => apiClient.post<Session>('/auth/sign-in', input);

export function useSignIn({ onSuccess }: { onSuccess?: (session: Session) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (session) => {
      // Nothing cached for an earlier visitor may show through to this one.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.session(), session);
      onSuccess?.(session);
    },
  });
}
