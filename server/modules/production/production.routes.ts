import { productionSummaryQuerySchema, productionSummarySchema } from '@shared/schemas/production';
import { defineRoute } from '@server/http/define-route';
import { productionSummary } from './production.service';

export const productionRoutes = [
  defineRoute({
    method: 'get',
    path: '/production-summary',
    operationId: 'getProductionSummary',
    summary: 'Production summary for a model and lot',
    description:
      'Counts by status and verdict, the pass/fail yield, and the unit-to-unit distribution (mean, sample σ, p5/p50/p95) of ' +
      'sensitivity, THD_F at 1 kHz and the band limits, read from the stored results of the model\'s analyses (optionally ' +
      'one lot and a time range). Sensitivity comes from `figures.sensitivity` (band mean first, then 1 kHz); THD from the ' +
      'distortion summary\'s value at a 1 kHz reference; band limits from `figures.bandLimits`.',
    tags: ['Production'],
    permission: 'analyses:read',
    request: { query: productionSummaryQuerySchema },
    responses: { 200: { description: 'The summary.', schema: productionSummarySchema } },
    handler: async ({ deps, principal, query }) => ({ status: 200, body: await productionSummary(deps, principal.organisationId, query) }),
  }),
];
