import type { WavLimits } from '@shared/dsp';
import type { PlanLimits } from '@server/billing/plans';
import type { AppDeps } from '@server/deps';
import { cachedPlanLimits } from '@server/modules/usage/organisation-plan.service';

export type UploadLimits = Required<Pick<WavLimits, 'maxBytes' | 'maxChannels' | 'maxDurationSeconds' | 'maxSampleRateHz'>>;

export function uploadLimitsFromPlan(limits: PlanLimits): UploadLimits {
  return {
    maxBytes: limits.maxUploadBytes,
    maxChannels: limits.maxUploadChannels,
    maxDurationSeconds: limits.maxUploadDurationSeconds,
    maxSampleRateHz: limits.maxUploadSampleRateHz,
  };
}

/**
 * The upload limits of the organisation's plan, from the per-process plan cache the rate limit also reads (a plan
 * change made in this process applies at once, one made elsewhere within the cache's 10 s): an upload then costs
 * no extra database round trip before its bytes are read.
 */
export async function uploadLimitsFor(deps: AppDeps, organisationId: string): Promise<UploadLimits> {
  return uploadLimitsFromPlan(await cachedPlanLimits(deps, organisationId));
}
