import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import { isApiProblem } from '@console/lib/api-problem';
import type { Session } from '@shared/schemas/auth';
import { authKeys } from './keys';

/** The signed-in session, or null when there is none; "not signed in" is a state here, not an error. */
export async function getSession(): Promise<Session | null> {
  try {
    return await apiClient.get<Session>('/auth/session');
  } catch (error) {
    if (isApiProblem(error) && error.status === 401) return null;
    throw error;
  }
}

export const getSessionQueryOptions = () =>
  queryOptions({ queryKey: authKeys.session(), queryFn: getSession, staleTime: 60_000 });

export const useSession = () => useQuery(getSessionQueryOptions());
