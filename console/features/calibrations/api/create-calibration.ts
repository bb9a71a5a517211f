import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Calibration } from '@shared/schemas/calibrations';
import type { z } from 'zod';
import type { createCalibrationRequestSchema } from '@shared/schemas/calibrations';
import { calibrationKeys } from './keys';

export type CreateCalibrationInput = z.input<typeof createCalibrationRequestSchema>;
export type CreateCalibrationCall = { input: CreateCalibrationInput; idempotencyKey: string };

// The API requires an Idempotency-Key here: a retried submit after a lost answer must not store a second calibration.
export const createCalibration = ({ input, idempotencyKey }: CreateCalibrationCall) =>
  apiClient.post<Calibration>('/calibrations', input, { headers: { 'Idempotency-Key': idempotencyKey } });

export function useCreateCalibration({ onSuccess }: { onSuccess?: (created: Calibration) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCalibration,
    onSuccess: async (created) => {
      onSuccess?.(created);
      await queryClient.invalidateQueries({ queryKey: calibrationKeys.lists() });
    },
  });
}
