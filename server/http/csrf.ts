import type { NextFunction, Request, Response } from 'express';
import { SESSION_COOKIE } from '@server/modules/auth/session-token';
import { ApiProblem } from './api-problem';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function requestOrigin(req: Request): string | undefined {
  const origin = req.get('origin');
  if (origin && origin !== 'null') return origin;
  if (origin === 'null') return 'null';
  const referer = req.get('referer');
  if (!referer) return undefined;
  try {
    return new URL(referer).origin;
  } catch {
    return 'null';
  }
}

/**
 * CSRF defence for cookie-authenticated writes. An unsafe request without an Authorization header must come
 * from the console's own origin (PUBLIC_ORIGIN, or the origin the request was addressed to). Browsers add
 * Origin to every cross-site write, so a foreign page is always caught; a request with neither Origin nor
 * Referer is refused only when it carries a session cookie (scripts without a cookie cannot ride a session).
 * Bearer-key requests are exempt: browsers never attach those by themselves.
 */
export function csrfOriginCheck(publicOrigin: string) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE_METHODS.has(req.method) || req.get('authorization')) return next();
    const origin = requestOrigin(req);
    const hasSessionCookie = Boolean((req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE]);
    if (origin === undefined) {
      if (!hasSessionCookie) return next();
      return next(new ApiProblem('csrf_origin_mismatch', 'A cookie-authenticated write must carry an Origin header of the console.'));
    }
    const servedOrigin = `${req.protocol}://${req.get('host')}`;
    if (origin === publicOrigin || origin === servedOrigin) return next();
    next(new ApiProblem('csrf_origin_mismatch', `Requests from ${origin} may not act with a Sweepline session.`));
  };
}
