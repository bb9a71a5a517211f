import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Session, SignUpRequest } from '@shared/schemas/auth';
import { authKeys } from './keys';

export { PASSWORD_MIN_LENGTH, signUpRequestSchema as signUpInputSchema } from '@shared/schemas/auth';

export const signUp = (input: SignUpRequest) => apiClient.post<Session>('/auth/sign-up', input);

export function useSignUp({ onSuccess }: { onSuccess?: (session: Session) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: (session) => {
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.session(), session);
      onSuccess?.(session);
    },
  });
}
