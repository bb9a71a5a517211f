import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Member } from '@shared/schemas/members';
import { memberKeys } from './keys';

export const getMembers = async (): Promise<Member[]> =>
  (await apiClient.get<{ data: Member[] }>('/members')).data;

export const getMembersQueryOptions = () => queryOptions({ queryKey: memberKeys.list(), queryFn: getMembers });

export const useMembers = () => useQuery(getMembersQueryOptions());
