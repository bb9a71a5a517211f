import {
  productionLotListSchema,
  productionLotsQuerySchema,
  productionSummaryQuerySchema,
  productionSummarySchema,
  productionUnitListSchema,
} from '@shared/schemas/production';
import { defineRoute } from '@server/http/define-route';
import { productionLots, productionUnits } from './production-listings.service';
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
  defineRoute({
    method: 'get',
    path: '/production-lots',
    operationId: 'listProductionLots',
    summary: 'Models and lots measured',
    description:
      'The distinct DUT model and lot pairs the organisation\'s analyses name (analyses without a model are left out), with ' +
      'how many analyses each has and when the first and last were created, most recently measured first.',
    tags: ['Production'],
    permission: 'analyses:read',
    request: { query: productionLotsQuerySchema },
    responses: { 200: { description: 'The pairs.', schema: productionLotListSchema } },
    handler: async ({ deps, principal, query }) => ({ status: 200, body: await productionLots(deps, principal.organisationId, query) }),
  }),
  defineRoute({
    method: 'get',
    path: '/production-units',
    operationId: 'listProductionUnits',
    summary: 'Per-unit figures for a model and lot',
    description:
      'Each succeeded analysis of the model (optionally one lot and a time range), newest first, with its verdict and the ' +
      'headline figures the production summary aggregates (read from the stored result the same way), for histograms and ' +
      'trends over time.',
    tags: ['Production'],
    permission: 'analyses:read',
    request: { query: productionSummaryQuerySchema },
    responses: { 200: { description: 'The units.', schema: productionUnitListSchema } },
    handler: async ({ deps, principal, query }) => ({ status: 200, body: await productionUnits(deps, principal.organisationId, query) }),
  }),
];
