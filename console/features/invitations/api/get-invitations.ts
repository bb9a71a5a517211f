import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Invitation, InvitationList } from '@shared/schemas/invitations';
import { invitationKeys } from './keys';

export const getInvitations = async (): Promise<Invitation[]> => (await apiClient.get<InvitationList>('/invitations')).data;

export const getInvitationsQueryOptions = () => queryOptions({ queryKey: invitationKeys.list(), queryFn: getInvitations });

export const useInvitations = () => useQuery(getInvitationsQueryOptions());
