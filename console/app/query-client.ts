import { createQueryClient } from '@console/lib/query-client';
import { authKeys } from '@console/features/auth/api/keys';

// One client for the whole console. A 401 from any request means the session is gone: forgetting it sends
// the app shell back to sign-in.
export const queryClient = createQueryClient({
  onUnauthenticated: () => queryClient.setQueryData(authKeys.session(), null),
});
