import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Analysis } from '@shared/schemas/analyses';
import type { z } from 'zod';
import type { rerunAnalysisRequestSchema } from '@shared/schemas/analyses';
import { analysisKeys } from './keys';

export type RerunAnalysisInput = z.input<typeof rerunAnalysisRequestSchema>;
export type RerunAnalysisCall = { analysisId: string; input: RerunAnalysisInput; idempotencyKey: string };

/** Queues a new analysis of the same capture with the given members replaced; the original stays as it is. */
export const rerunAnalysis = ({ analysisId, input, idempotencyKey }: RerunAnalysisCall) =>
  apiClient.post<Analysis>(`/analyses/${encodeURIComponent(analysisId)}/rerun`, input, { headers: { 'Idempotency-Key': idempotencyKey } });

export function useRerunAnalysis({ onSuccess }: { onSuccess?: (created: Analysis) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: rerunAnalysis,
    onSuccess: async (created) => {
      queryClient.setQueryData(analysisKeys.detail(created.id), created);
      onSuccess?.(created);
      await queryClient.invalidateQueries({ queryKey: analysisKeys.lists() });
    },
  });
}
