import { requireNumberInRange } from '../stimuli/parameter-checks';
import { resolveResponseCommonOptions, type ResolvedResponseCommonOptions, type ResponseCommonOptions } from './response-common-options';

/**
 * Options of the stepped-sine response analysis: the common response options (response-common-options.ts; any
 * latency beyond captureOffsetSeconds must stay below the settle time) and lowSnrThresholdDb (20; per-step
 * tone-to-residual ratio below which low_snr is raised).
 */
export interface SteppedResponseOptions extends ResponseCommonOptions {
  lowSnrThresholdDb?: number;
}

export interface ResolvedSteppedResponseOptions extends ResolvedResponseCommonOptions {
  lowSnrThresholdDb: number;
}

export function resolveSteppedResponseOptions(options: unknown, channelCount: number, field = 'options'): ResolvedSteppedResponseOptions {
  const { raw, common } = resolveResponseCommonOptions(options, channelCount, field, ['lowSnrThresholdDb']);
  return {
    ...common,
    lowSnrThresholdDb: requireNumberInRange(raw.lowSnrThresholdDb ?? 20, `${field}.lowSnrThresholdDb`, 0, 200, 'dB'),
  };
}
