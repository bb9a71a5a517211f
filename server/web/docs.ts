import express, { type Router } from 'express';
import swaggerUi from 'swagger-ui-express';

/**
 * /docs: Swagger UI over the generated document, and the document itself at /docs/openapi.json. Swagger UI's
 * start-up script is served as a file (swagger-ui-init.js), so the page runs under `script-src 'self'`.
 */
export function docsRouter(document: object): Router {
  const router = express.Router();
  const options = {
    customSiteTitle: 'Sweepline API',
    // The library's own top bar (its logo and a URL box) is not part of our docs.
    customCss: '.swagger-ui .topbar { display: none }',
    swaggerOptions: { validatorUrl: null, withCredentials: true, displayRequestDuration: true },
  };
  router.use((req, res, next) => {
    // The page loads its assets by relative URL, which only resolve below /docs/.
    if (req.originalUrl === '/docs' || req.originalUrl.startsWith('/docs?')) return res.redirect(301, '/docs/');
    next();
  });
  router.get('/openapi.json', (_req, res) => {
    res.json(document);
  });
  router.use('/', swaggerUi.serveFiles(document as swaggerUi.JsonObject, options), swaggerUi.setup(document as swaggerUi.JsonObject, options));
  return router;
}
