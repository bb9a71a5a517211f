import helmet from 'helmet';

/**
 * helmet with a CSP that the console and Swagger UI both work under: scripts only from our origin (no inline
 * scripts, no eval: Swagger UI's start-up code is served as a file), inline style attributes allowed because
 * Swagger UI and chart libraries set them, nothing loaded from other hosts. HSTS and upgrade-insecure-requests
 * only when served over https, since on http://127.0.0.1 they would break the local set-up.
 */
export function securityHeaders(options: { https: boolean }) {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        'default-src': ["'self'"],
        'script-src': ["'self'"],
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'"],
        'object-src': ["'none'"],
        'base-uri': ["'self'"],
        'form-action': ["'self'"],
        'frame-ancestors': ["'none'"],
        'worker-src': ["'self'", 'blob:'],
        ...(options.https ? { 'upgrade-insecure-requests': [] } : {}),
      },
    },
    strictTransportSecurity: options.https ? { maxAge: 15_552_000, includeSubDomains: true } : false,
    crossOriginEmbedderPolicy: false,
  });
}
