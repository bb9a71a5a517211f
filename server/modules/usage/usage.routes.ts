import { usageSchema, type Usage } from '@shared/schemas/usage';
import { defineRoute } from '@server/http/define-route';
import { getUsageSummary } from './usage.service';

function meter(used: number, limit: number) {
  return {
    used,
    limit,
    remaining: Math.max(0, limit - used),
    percentUsed: limit > 0 ? Math.round((1000 * used) / limit) / 10 : 0,
  };
}

export const usageRoutes = [
  defineRoute({
    method: 'get',
    path: '/usage',
    operationId: 'getUsage',
    summary: 'Usage of the current period',
    description:
      'Analyses, audio minutes and storage used against the plan\'s limits, with the period\'s start and end. An analysis ' +
      'is charged when it is accepted (202) and refunded if it is canceled before it starts; requests refused with 4xx are ' +
      'never charged. Over a monthly quota, new analyses get 429 `quota_exceeded` with `limit` and `resetsAt`.',
    tags: ['Usage'],
    permission: 'usage:read',
    responses: { 200: { description: 'Usage and limits.', schema: usageSchema } },
    handler: async ({ deps, principal }) => {
      const summary = await getUsageSummary(deps, principal.organisationId);
      const { limits } = summary;
      const body: Usage = {
        planId: summary.planId,
        period: { start: summary.period.start.toISOString(), end: summary.period.end.toISOString() },
        analyses: meter(summary.analysesUsed, limits.analysesPerMonth),
        audioMinutes: meter(Math.round((summary.audioSecondsUsed / 60) * 1000) / 1000, limits.audioMinutesPerMonth),
        storageBytes: meter(summary.storageBytes, limits.storageBytes),
        requestsPerMinute: { limit: limits.requestsPerMinute },
        uploadLimits: {
          maxUploadBytes: limits.maxUploadBytes,
          maxUploadDurationSeconds: limits.maxUploadDurationSeconds,
          maxUploadChannels: limits.maxUploadChannels,
          maxUploadSampleRateHz: limits.maxUploadSampleRateHz,
        },
      };
      return { status: 200, body };
    },
  }),
];
