import type { NextFunction, Request, Response } from 'express';
import { ApiProblem } from './api-problem';
import type { RouteDefinition } from './define-route';

function pathPattern(path: string): RegExp {
  const PARAM = '\u0000';
  const escaped = path
    .replace(/\{[A-Za-z0-9_]+\}/g, PARAM)
    .replace(/[.*+?^$(){}|[\]\\]/g, '\\$&')
    .replaceAll(PARAM, '[^/]+');
  return new RegExp(`^${escaped}/?$`);
}

/**
 * After the /v1 routes: 405 with Allow when the path exists under other methods, else 404, both as problems.
 * `req.path` here is relative to /v1.
 */
export function apiFallback(routes: RouteDefinition[]) {
  const patterns = routes.map((route) => ({ method: route.method.toUpperCase(), pattern: pathPattern(route.path) }));
  return (req: Request, _res: Response, next: NextFunction) => {
    const allowed = new Set(patterns.filter((entry) => entry.pattern.test(req.path)).map((entry) => entry.method));
    if (allowed.size > 0) {
      if (allowed.has('GET')) allowed.add('HEAD');
      const allow = [...allowed].sort().join(', ');
      return next(new ApiProblem('method_not_allowed', `${req.method} is not supported here; use ${allow}.`, { headers: { Allow: allow } }));
    }
    next(new ApiProblem('route_not_found', `There is no endpoint ${req.method} /v1${req.path}. See /docs for the API.`));
  };
}
