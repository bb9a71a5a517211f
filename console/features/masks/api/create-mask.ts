import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { CreateMaskRequest, Mask, MaskVersion, MaskVersionContent } from '@shared/schemas/masks';
import { maskKeys } from './keys';

type WithKey<T> = { input: T; idempotencyKey: string };

export const createMask = ({ input, idempotencyKey }: WithKey<CreateMaskRequest>) =>
  apiClient.post<Mask>('/masks', input, { headers: { 'Idempotency-Key': idempotencyKey } });

export const addMaskVersion = ({ maskId, input, idempotencyKey }: WithKey<MaskVersionContent> & { maskId: string }) =>
  apiClient.post<MaskVersion>(`/masks/${encodeURIComponent(maskId)}/versions`, input, { headers: { 'Idempotency-Key': idempotencyKey } });

export function useCreateMask({ onSuccess }: { onSuccess?: (created: Mask) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createMask,
    onSuccess: async (created) => {
      queryClient.setQueryData(maskKeys.detail(created.id), created);
      onSuccess?.(created);
      await queryClient.invalidateQueries({ queryKey: maskKeys.lists() });
    },
  });
}

export function useAddMaskVersion(maskId: string, { onSuccess }: { onSuccess?: (created: MaskVersion) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (call: WithKey<MaskVersionContent>) => addMaskVersion({ ...call, maskId }),
    onSuccess: async (created) => {
      onSuccess?.(created);
      await Promise.all([queryClient.invalidateQueries({ queryKey: maskKeys.detail(maskId) }), queryClient.invalidateQueries({ queryKey: maskKeys.lists() })]);
    },
  });
}
