import fs from 'node:fs';
import path from 'node:path';
import express, { type Request, type Response, type NextFunction, type Router } from 'express';

const NOT_BUILT_PAGE = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Sweepline</title></head>
<body><main><h1>Sweepline</h1><p>The console has not been built. The API is at <a href="/v1/health">/v1</a>
and its documentation at <a href="/docs/">/docs</a>.</p></main></body></html>`;

/**
 * Serves the built console: hashed assets with a long cache life, and index.html for every other GET that
 * asks for HTML (client-side routes). Paths under /v1 and /docs never reach this router.
 */
export function consoleRouter(consoleDir: string | null): Router {
  const router = express.Router();
  const indexFile = consoleDir ? path.join(consoleDir, 'index.html') : null;
  if (consoleDir && indexFile && fs.existsSync(indexFile)) {
    router.use(
      '/assets',
      express.static(path.join(consoleDir, 'assets'), { immutable: true, maxAge: '365d', index: false, fallthrough: true }),
    );
    router.use(express.static(consoleDir, { index: false, maxAge: 0 }));
  }
  router.get('/{*splat}', (req: Request, res: Response, next: NextFunction) => {
    // Client-side routes look like /api-keys; a missing file (/assets/x.js, /logo.svg) stays a 404.
    const lastSegment = req.path.split('/').pop() ?? '';
    if (req.path.startsWith('/assets/') || lastSegment.includes('.') || !req.accepts('html')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    if (indexFile && fs.existsSync(indexFile)) return res.sendFile(indexFile);
    res.type('html').send(NOT_BUILT_PAGE);
  });
  return router;
}
