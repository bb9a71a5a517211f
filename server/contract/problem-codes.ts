import type { ProblemCode } from '@shared/problems';
import type { RouteDefinition } from '@server/http/define-route';

export const acceptsSession = (route: RouteDefinition) => route.access.kind !== 'public' && route.access.kind !== 'api_key';
export const acceptsKey = (route: RouteDefinition) => route.access.kind !== 'public' && route.access.kind !== 'session';
export const isWrite = (route: RouteDefinition) => route.method !== 'get';

/** The problems a route can answer with: implied by its inputs and access, plus the ones it lists. */
export function problemCodesOf(route: RouteDefinition): ProblemCode[] {
  const codes = new Set<ProblemCode>();
  const { params, query, body, headers } = route.request;
  if (params || query || body || headers) codes.add('validation_failed');
  if (body || route.request.bodyContent) ['malformed_json', 'payload_too_large', 'unsupported_media_type'].forEach((code) => codes.add(code as ProblemCode));
  if (route.request.bodyContent) codes.add('validation_failed');
  if (acceptsSession(route) || acceptsKey(route)) codes.add('not_authenticated');
  if (acceptsSession(route)) codes.add('session_expired');
  if (acceptsKey(route)) ['invalid_api_key', 'api_key_expired', 'api_key_revoked'].forEach((code) => codes.add(code as ProblemCode));
  if (route.access.kind === 'permission') {
    codes.add('insufficient_permission');
    codes.add('insufficient_scope');
  }
  if (acceptsSession(route) && isWrite(route)) codes.add('csrf_origin_mismatch');
  route.problems.forEach((code) => codes.add(code));
  codes.add('internal_error');
  return [...codes];
}

