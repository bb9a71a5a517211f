import type { WavLimits } from '@shared/dsp';
import type { PlanLimits } from '@server/billing/plans';
import type { AppDeps } from '@server/deps';
import { getPlanLimits } from '@server/modules/usage/usage.service';

export type UploadLimits = Required<Pick<WavLimits, 'maxBytes' | 'maxChannels' | 'maxDurationSeconds' | 'maxSampleRateHz'>>;

export function uploadLimitsFromPlan(limits: PlanLimits): UploadLimits {
  return {
    maxBytes: limits.maxUploadBytes,
    maxChannels: limits.maxUploadChannels,
    maxDurationSeconds: limits.maxUploadDurationSeconds,
    maxSampleRateHz: limits.maxUploadSampleRateHz,
  };
}

/** The upload limits of the organisation's plan. */
export async function uploadLimitsFor(deps: AppDeps, organisationId: string): Promise<UploadLimits> {
  return uploadLimitsFromPlan(await getPlanLimits(deps, organisationId));
}
