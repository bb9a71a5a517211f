import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Analysis } from '@shared/schemas/analyses';
import { analysisKeys } from './keys';

export const cancelAnalysis = (analysisId: string) => apiClient.post<Analysis>(`/analyses/${encodeURIComponent(analysisId)}/cancel`);

export function useCancelAnalysis() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelAnalysis,
    onSuccess: async (analysis) => {
      queryClient.setQueryData(analysisKeys.detail(analysis.id), analysis);
      await queryClient.invalidateQueries({ queryKey: analysisKeys.lists() });
    },
  });
}
