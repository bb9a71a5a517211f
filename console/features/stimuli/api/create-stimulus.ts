import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { CreateStimulusRequest, Stimulus } from '@shared/schemas/stimuli';
import { stimulusKeys } from './keys';

export type CreateStimulusCall = { input: CreateStimulusRequest; idempotencyKey: string };

// The API requires an Idempotency-Key here; the form keeps one until its values change.
export const createStimulus = ({ input, idempotencyKey }: CreateStimulusCall) =>
  apiClient.post<Stimulus>('/stimuli', input, { headers: { 'Idempotency-Key': idempotencyKey } });

export function useCreateStimulus({ onSuccess }: { onSuccess?: (stimulus: Stimulus) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createStimulus,
    onSuccess: async (stimulus) => {
      onSuccess?.(stimulus);
      await queryClient.invalidateQueries({ queryKey: stimulusKeys.lists() });
    },
  });
}
