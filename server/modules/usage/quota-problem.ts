import { ApiProblem } from '@server/http/api-problem';

export type QuotaName = 'analyses' | 'audio_minutes' | 'storage_bytes';

/** Policy names as they appear in `violated-policies` (and in RateLimit-Policy for the request rate). */
export const QUOTA_POLICY_NAMES: Record<QuotaName, string> = {
  analyses: 'monthly-analyses',
  audio_minutes: 'monthly-audio-minutes',
  storage_bytes: 'storage-bytes',
};

export interface QuotaExceededDetails {
  quota: QuotaName;
  limit: number;
  used: number;
  /** What this request would have added. */
  requested: number;
  unit: string;
  /** When the monthly counter starts again from zero; null for storage, which only frees up by deleting. */
  resetsAt: Date | null;
  /** The time of the refusal; with resetsAt it sets Retry-After (seconds until the reset). */
  now?: Date;
}

/**
 * 429 quota_exceeded with the limit and when it resets. `violated-policies` is the member the IETF RateLimit
 * fields draft (draft-ietf-httpapi-ratelimit-headers) defines for its quota-exceeded problem type.
 */
export function quotaExceeded(details: QuotaExceededDetails): ApiProblem {
  const retryAfterSeconds = details.resetsAt && details.now ? Math.max(1, Math.ceil((details.resetsAt.getTime() - details.now.getTime()) / 1000)) : null;
  const resets = details.resetsAt ? ` It resets at ${details.resetsAt.toISOString()}.` : ' Delete stored data or change the plan to free space.';
  return new ApiProblem(
    'quota_exceeded',
    `The plan allows ${details.limit} ${details.unit} (${details.used} used, this request needs ${details.requested}).${resets}`,
    {
      // Waiting frees a monthly quota, not storage: only the former gets Retry-After (RFC 9110 §10.2.3).
      ...(retryAfterSeconds !== null ? { headers: { 'Retry-After': String(retryAfterSeconds) } } : {}),
      extensions: {
        'violated-policies': [QUOTA_POLICY_NAMES[details.quota]],
        quota: details.quota,
        limit: details.limit,
        used: details.used,
        requested: details.requested,
        unit: details.unit,
        resetsAt: details.resetsAt?.toISOString() ?? null,
      },
    },
  );
}
