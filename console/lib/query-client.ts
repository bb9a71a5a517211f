import { MutationCache, QueryCache, QueryClient, type DefaultOptions } from '@tanstack/react-query';
import { isApiProblem } from './api-problem';

const MAX_RETRIES = 2;

/** A client mistake (4xx) will not fix itself on retry; network and server trouble might. */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (failureCount >= MAX_RETRIES) return false;
  if (isApiProblem(error) && error.status >= 400 && error.status < 500) return false;
  return true;
}

export const queryDefaults: DefaultOptions = {
  queries: { staleTime: 30_000, retry: shouldRetry },
  mutations: { retry: false },
};

type QueryClientHooks = {
  /** Called when any request is answered 401: the session ended (expired, signed out elsewhere). */
  onUnauthenticated?: () => void;
};

export function createQueryClient(hooks: QueryClientHooks = {}): QueryClient {
  const notice = (error: unknown) => {
    if (isApiProblem(error) && error.status === 401) hooks.onUnauthenticated?.();
  };
  return new QueryClient({
    defaultOptions: queryDefaults,
    queryCache: new QueryCache({ onError: notice }),
    mutationCache: new MutationCache({ onError: notice }),
  });
}
