import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { z } from 'zod';
import type { deriveMaskRequestSchema, Mask } from '@shared/schemas/masks';
import { maskKeys } from './keys';

export type DeriveMaskInput = z.input<typeof deriveMaskRequestSchema>;

/** Limits at mean ± max(k·σ, minimum half-width) of the golden units' curves; a new mask or a new version of `maskId`. */
export const deriveMask = ({ input, idempotencyKey }: { input: DeriveMaskInput; idempotencyKey: string }) =>
  apiClient.post<Mask>('/masks/derive', input, { headers: { 'Idempotency-Key': idempotencyKey } });

export function useDeriveMask({ onSuccess }: { onSuccess?: (mask: Mask) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deriveMask,
    onSuccess: async (mask) => {
      queryClient.setQueryData(maskKeys.detail(mask.id), mask);
      onSuccess?.(mask);
      await Promise.all([queryClient.invalidateQueries({ queryKey: maskKeys.lists() }), queryClient.invalidateQueries({ queryKey: maskKeys.versions(mask.id) })]);
    },
  });
}
