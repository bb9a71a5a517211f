import type { Request } from 'express';
import type { Params } from './params';

/** GET parameters come in the query string, POST parameters in the form body. */
export function paramsOf(request: Request): Params {
  const source = request.method === 'GET' || request.method === 'DELETE' ? request.query : request.body;
  return (source ?? {}) as Params;
}

export function idParam(request: Request): string {
  return String(request.params.id);
}
