import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { InvitationLookup } from '@shared/schemas/invitations';
import { invitationKeys } from './keys';

export const lookUpInvitation = (token: string) => apiClient.get<InvitationLookup>('/invitations/lookup', { query: { token } });

// A 404/410 answer is the page's content ("this link expired"), not something to retry.
export const lookUpInvitationQueryOptions = (token: string) =>
  queryOptions({ queryKey: invitationKeys.lookup(token), queryFn: () => lookUpInvitation(token), retry: false, staleTime: 30_000 });

export const useInvitationLookup = (token: string) => useQuery(lookUpInvitationQueryOptions(token));
