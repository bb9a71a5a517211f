import type { Request, Response, Router } from 'express';
import type { AppDeps } from '@server/deps';
import { authenticate } from '@server/modules/auth/authenticate';
import { ApiProblem } from './api-problem';
import { IdempotencyRequest, IdempotentReplay, NO_IDEMPOTENCY, rawBodyFingerprint, sendReplay } from './idempotency';
import { problemBody } from './problem-response';
import { chargeRequest, isUnchargedStatus } from './rate-limit';
import type { RouteDefinition } from './define-route';
import { parseRequestPart } from './validation';

function hasBody(req: Request): boolean {
  const length = req.headers['content-length'];
  return (length !== undefined && length !== '0') || req.headers['transfer-encoding'] !== undefined;
}

function readBody(req: Request): unknown {
  if (hasBody(req) && !req.is(['application/json', 'application/*+json'])) {
    throw new ApiProblem('unsupported_media_type', 'Send the body as JSON with "Content-Type: application/json".');
  }
  // A missing body is read as {} so the validation errors name the missing fields.
  return req.body ?? {};
}

/** Checks a reply against its documented schema, so a handler cannot silently break the published contract. */
function checkReply(route: RouteDefinition, status: number, body: unknown) {
  const spec = route.responses[status];
  if (!spec) throw new Error(`${route.operationId} replied ${status}, which is not documented`);
  if (!spec.schema) return;
  const result = spec.schema.safeParse(body);
  if (!result.success) throw new Error(`${route.operationId} ${status} reply does not match its schema: ${result.error.message}`);
}

function handle(route: RouteDefinition, deps: AppDeps) {
  return async (req: Request, res: Response) => {
    // Access before validation: an anonymous caller learns nothing about the input rules.
    const { principal, user } = await authenticate(deps, req, res, route.access);
    // Counted only once the caller is known and allowed (401/403 are never charged); refunded below when refused.
    const charge = route.rateLimit && principal ? await chargeRequest(deps, principal, res) : null;
    let idempotency: IdempotencyRequest | null = null;
    try {
      const params = route.request.params ? parseRequestPart(route.request.params, req.params, 'path') : {};
      const query = route.request.query ? parseRequestPart(route.request.query, req.query, 'query') : {};
      if (route.request.headers) parseRequestPart(route.request.headers, req.headers, 'header');
      const body = route.request.body ? parseRequestPart(route.request.body, readBody(req), 'body') : undefined;
      // Later middleware and the handler see only parsed values (Express 5 exposes req.query as a getter).
      Object.defineProperty(req, 'query', { value: query, writable: true, configurable: true });
      req.params = params as Request['params'];
      // Routes that read their own body (bodyContent) keep it as parsed by express.json.
      if (route.request.body) req.body = body;

      // After validation: a request refused by its schema or by access stores no idempotency record.
      if (route.idempotency && principal) {
        idempotency = IdempotencyRequest.begin(deps, req, route.idempotency, principal.organisationId, route.method, route.path);
        if (route.idempotency.fingerprint === 'body') await idempotency.claim(rawBodyFingerprint(req));
      }

      const reply = await route.handler({ params, query, body, principal, user, deps, req, res, idempotency: idempotency ?? NO_IDEMPOTENCY } as never);
      if (idempotency?.key && !idempotency.claimed && deps.config.nodeEnv !== 'production') {
        throw new Error(`${route.operationId} received an Idempotency-Key but its handler never claimed it`);
      }
      // A handler that streamed its own body (downloads) has already answered.
      if (res.headersSent) return;
      if (deps.config.validateResponses) checkReply(route, reply.status, reply.body);
      // Serialised once, for the stored idempotent response and for the answer (results run to hundreds of kB).
      const text = reply.body === undefined ? undefined : JSON.stringify(reply.body);
      await idempotency?.complete(reply.status, reply.headers ?? {}, reply.body, text, reply.replayFrom);
      for (const [name, value] of Object.entries(reply.headers ?? {})) res.setHeader(name, value);
      if (text === undefined) res.status(reply.status).end();
      else {
        // As res.json would: a content type the handler set stays.
        if (!res.get('Content-Type')) res.type('application/json');
        res.status(reply.status).send(text);
      }
    } catch (error) {
      if (error instanceof IdempotentReplay) {
        const { resolveReplay } = route;
        const organisationId = error.record.organisationId;
        return sendReplay(res, error.record, resolveReplay ? (reference) => resolveReplay(deps, organisationId, reference) : null);
      }
      const status = error instanceof ApiProblem ? error.status : 500;
      if (charge && isUnchargedStatus(status)) await charge.refund();
      if (idempotency) {
        const problem = error instanceof ApiProblem ? error : new ApiProblem('internal_error', 'An unexpected error occurred. Quote the request id when reporting it.');
        await idempotency.fail(status, problemBody(req, problem));
      }
      throw error;
    }
  };
}

export function mountRoutes(router: Router, routes: RouteDefinition[], deps: AppDeps): void {
  for (const route of routes) router[route.method](route.expressPath, handle(route, deps));
}
