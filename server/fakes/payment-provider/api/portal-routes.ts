import { Router } from 'express';
import { buildPortalSession, publicPortalSession } from '../objects/sessions';
import type { ProviderState } from '../state';
import { onlyParams, optionalString, requiredString, requireHttpUrl } from './params';
import { missingObject } from './provider-request-error';
import { paramsOf } from './route-helpers';

export function portalRoutes(state: ProviderState): Router {
  const router = Router();

  router.post('/v1/billing_portal/sessions', (request, response) => {
    const params = paramsOf(request);
    onlyParams(params, ['customer', 'return_url', 'configuration', 'locale']);
    const customer = requiredString(params, 'customer');
    if (!state.customers.has(customer)) throw missingObject('customer', customer, 'customer');
    const returnUrl = optionalString(params, 'return_url');
    const session = buildPortalSession(state.baseUrl, customer, returnUrl === undefined ? null : requireHttpUrl(returnUrl, 'return_url'));
    state.portalSessions.set(session.id, session);
    response.json(publicPortalSession(session));
  });

  return router;
}
