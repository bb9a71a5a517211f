import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Member } from '@shared/schemas/members';
import type { Role } from '@shared/schemas/permissions';
import { memberKeys } from './keys';

export type UpdateMemberRoleInput = { memberId: string; role: Role };

export const updateMemberRole = ({ memberId, role }: UpdateMemberRoleInput) =>
  apiClient.patch<Member>(`/members/${encodeURIComponent(memberId)}`, { role });

export function useUpdateMemberRole({ onSuccess }: { onSuccess?: (member: Member) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMemberRole,
    onSuccess: async (member) => {
      await queryClient.invalidateQueries({ queryKey: memberKeys.lists() });
      onSuccess?.(member);
    },
  });
}
