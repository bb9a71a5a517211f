import { dailyUsageSchema } from '@shared/schemas/usage';
import { defineRoute } from '@server/http/define-route';
import { getDailyUsage } from './daily-usage';

export const dailyUsageRoutes = [
  defineRoute({
    method: 'get',
    path: '/usage/daily',
    operationId: 'getDailyUsage',
    summary: 'Usage of the current period per day',
    description:
      'Analyses and audio minutes charged per UTC day, from the first day of the current period to today; the days add up to ' +
      'the `used` figures of `GET /v1/usage`. Storage is a running total and has no daily series.',
    tags: ['Usage'],
    permission: 'usage:read',
    responses: { 200: { description: 'One entry per day.', schema: dailyUsageSchema } },
    handler: async ({ deps, principal }) => ({ status: 200, body: await getDailyUsage(deps, principal.organisationId) }),
  }),
];
