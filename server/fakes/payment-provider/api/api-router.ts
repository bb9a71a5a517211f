import { timingSafeEqual } from 'node:crypto';
import express, { Router, type NextFunction, type Request, type Response } from 'express';
import { newObjectId } from '../ids';
import type { ProviderState } from '../state';
import { billingRoutes } from './billing-routes';
import { catalogueRoutes } from './catalogue-routes';
import { checkoutRoutes } from './checkout-routes';
import { customersRoutes } from './customers-routes';
import { portalRoutes } from './portal-routes';
import { ProviderRequestError, sendProviderError } from './provider-request-error';

const MAX_FORM_BYTES = '100kb';

function sameSecret(given: string, expected: string): boolean {
  const a = Buffer.from(given);
  const b = Buffer.from(expected);
  return a.length === b.length && timingSafeEqual(a, b);
}

function requireApiKey(state: ProviderState) {
  return (request: Request, _response: Response, next: NextFunction) => {
    const match = /^Bearer (.+)$/.exec(request.get('authorization') ?? '');
    if (!match || !sameSecret(match[1], state.apiKey)) {
      throw new ProviderRequestError(401, 'invalid_request_error', 'Invalid API Key provided. The local payment fake accepts only its own test key.');
    }
    next();
  };
}

/** A POST retried with the same Idempotency-Key gets the first answer again instead of acting twice. */
function replayIdempotentPosts(state: ProviderState) {
  return (request: Request, response: Response, next: NextFunction) => {
    const key = request.get('idempotency-key');
    if (request.method !== 'POST' || !key) return next();
    const fingerprint = `${request.path} ${JSON.stringify(request.body ?? {})}`;
    const stored = state.idempotentResponses.get(key);
    if (stored) {
      if (stored.fingerprint !== fingerprint) {
        throw new ProviderRequestError(
          400,
          'idempotency_error',
          'Keys for idempotent requests can only be used with the same parameters they were first used with.',
        );
      }
      response.set('Idempotent-Replayed', 'true').status(stored.status).json(stored.body);
      return;
    }
    const sendJson = response.json.bind(response);
    response.json = (body: unknown) => {
      // Server faults are not stored, so a retry can still succeed (the provider does the same).
      if (response.statusCode < 500) state.idempotentResponses.set(key, { fingerprint, status: response.statusCode, body });
      return sendJson(body);
    };
    next();
  };
}

/** The provider's REST API, the subset our billing flows use. */
export function apiRouter(state: ProviderState): Router {
  const router = Router();
  router.use('/v1', (request, response, next) => {
    response.set('Request-Id', newObjectId('req'));
    next();
  });
  router.use('/v1', express.urlencoded({ extended: true, limit: MAX_FORM_BYTES, parameterLimit: 1000 }));
  router.use('/v1', requireApiKey(state));
  router.use('/v1', replayIdempotentPosts(state));
  router.use(customersRoutes(state));
  router.use(catalogueRoutes(state));
  router.use(checkoutRoutes(state));
  router.use(portalRoutes(state));
  router.use(billingRoutes(state));
  router.use('/v1', (request) => {
    throw new ProviderRequestError(404, 'invalid_request_error', `Unrecognized request URL (${request.method}: ${request.originalUrl}).`);
  });
  router.use('/v1', (error: unknown, _request: Request, response: Response, next: NextFunction) => {
    if (error instanceof ProviderRequestError) return sendProviderError(response, error);
    const status = typeof (error as { status?: unknown })?.status === 'number' ? (error as { status: number }).status : 500;
    if (status < 500) {
      // Body-parser failures: too large, malformed form.
      return sendProviderError(response, new ProviderRequestError(status, 'invalid_request_error', (error as Error).message));
    }
    next(error);
  });
  return router;
}
