import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import { pinoHttp } from 'pino-http';
import { buildOpenApiDocument } from './contract/document';
import type { AppDeps } from './deps';
import { ApiProblem } from './http/api-problem';
import { apiFallback } from './http/api-fallback';
import { csrfOriginCheck } from './http/csrf';
import { errorHandler } from './http/error-handler';
import { PROVIDER_WEBHOOK_PATH } from './hosted/hosted-services';
import { recordRawBodyFingerprint } from './http/idempotency';
import { redactUrlSecrets } from './http/redact-url';
import { mountRoutes } from './http/mount-routes';
import { requestId, requestIdOf } from './http/request-id';
import { securityHeaders } from './http/security-headers';
import { v1Routes } from './modules/routes';
import { consoleRouter } from './web/console-static';
import { docsRouter } from './web/docs';

export interface CreateAppOptions {
  /** Folder of the built console (dist/console); null serves a short page that says it is not built. */
  consoleDir?: string | null;
}

/** The whole HTTP service: API under /v1, docs under /docs, the console everywhere else. Never listens. */
export function createApp(deps: AppDeps, options: CreateAppOptions = {}): Express {
  const { config } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);

  app.use(requestId());
  app.use(
    pinoHttp({
      logger: deps.logger,
      genReqId: (req) => requestIdOf(req as express.Request),
      customLogLevel: (_req, res, error) => (error || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
      // One short line per request; headers (credentials among them) stay out of the log.
      serializers: {
        req: (req: { id: string; method: string; url: string }) => ({ id: req.id, method: req.method, url: redactUrlSecrets(req.url) }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
    }),
  );
  app.use(securityHeaders({ https: config.publicOrigin.startsWith('https:') }));
  app.use(cookieParser());
  // The payment provider signs the exact bytes it sends: keep them raw here, before the JSON parser below sees them.
  app.use(PROVIDER_WEBHOOK_PATH, express.raw({ type: () => true, limit: config.jsonBodyLimitBytes }));

  const v1 = express.Router();
  v1.use((_req, res, next) => {
    // Responses carry sessions and one-time secrets: never cache them.
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  // verify keeps the SHA-256 of the raw bytes: the Idempotency-Key fingerprint (server/http/idempotency.ts).
  v1.use(express.json({ limit: config.jsonBodyLimitBytes, type: ['application/json', 'application/*+json'], verify: recordRawBodyFingerprint }));
  v1.use(csrfOriginCheck(config.publicOrigin));
  mountRoutes(v1, v1Routes, deps);
  v1.use(apiFallback(v1Routes));
  app.use('/v1', v1);

  app.use('/docs', docsRouter(buildOpenApiDocument({ version: config.version })));
  app.use(consoleRouter(options.consoleDir ?? null));
  app.use((req, _res, next) => next(new ApiProblem('route_not_found', `Nothing is served at ${req.method} ${req.path}.`)));
  app.use(errorHandler({ logger: deps.logger, jsonBodyLimitBytes: config.jsonBodyLimitBytes }));
  return app;
}
