import { healthSchema } from '@shared/schemas/health';
import { defineRoute } from '@server/http/define-route';
import { checkHealth } from './health.service';

export const healthRoutes = [
  defineRoute({
    method: 'get',
    path: '/health',
    operationId: 'getHealth',
    summary: 'Service health',
    description:
      'For load balancers and monitors. 200 with status ok when the database answers; 503 with the same body ' +
      'and status degraded when it does not. Needs no credentials.',
    tags: ['Service'],
    auth: 'public',
    responses: {
      200: { description: 'Healthy.', schema: healthSchema },
      503: { description: 'The database does not answer.', schema: healthSchema },
    },
    handler: async ({ deps }) => {
      const health = await checkHealth(deps);
      return health.status === 'ok' ? { status: 200, body: health } : { status: 503, body: health };
    },
  }),
];
