import type { Request, Response } from 'express';
import { z } from 'zod';
import type { ProblemCode } from '@shared/problems';
import type { Permission } from '@shared/schemas/permissions';
import type { AppDeps } from '@server/deps';
import { idempotencySettingOf, type IdempotencyHandle, type IdempotencyOption, type IdempotencySetting } from './idempotency';
import type { Principal, SignedInUser } from './principal';

/**
 * Documentation of a body the handler reads itself (multipart uploads, or JSON-or-multipart), by media type.
 * Without `body`, the router does not parse it: the handler validates what it reads.
 */
export type BodyContent = Record<string, z.ZodType>;

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

/**
 * Who may call a route that names no permission:
 * - public: anyone, credentials are not even looked at;
 * - session: a signed-in console user (the session endpoints themselves);
 * - api_key: the calling API key (e.g. a rig checking its own key);
 * - principal: any member session or API key of the organisation, whatever its permissions.
 */
export type AuthKind = 'public' | 'session' | 'api_key' | 'principal';

export interface ResponseSpec {
  description: string;
  schema?: z.ZodType;
  /** Media type of a non-JSON body the handler writes itself (e.g. audio/wav, text/csv); documented as binary. */
  contentType?: string;
  headers?: Record<string, { description: string; schema: z.ZodType }>;
}
export type ResponseSpecs = Record<number, ResponseSpec>;

type Parsed<T> = T extends z.ZodType ? z.output<T> : undefined;

/** What a handler returns: one of the documented statuses with a body of that status's schema. */
export type Reply<R extends ResponseSpecs> = {
  [S in keyof R & number]: {
    status: S;
    headers?: Record<string, string>;
    /**
     * Store this reference instead of the body in the idempotency record; the route's `resolveReplay` turns it back
     * into the same body. Only for bodies that can no longer change (a finished analysis), so the replay is exact.
     */
    replayFrom?: string;
  } & (R[S]['schema'] extends z.ZodType ? { body: z.input<R[S]['schema']> } : { body?: undefined });
}[keyof R & number];

export interface HandlerContext<P, Q, B, A extends AuthKind | undefined> {
  params: P;
  query: Q;
  body: B;
  /** Set for permission, principal and api_key routes. */
  principal: A extends 'public' | 'session' ? undefined : Principal;
  /** Set for session routes. */
  user: A extends 'session' ? SignedInUser : undefined;
  deps: AppDeps;
  req: Request;
  res: Response;
  /** Idempotency-Key state; routes with fingerprint 'handler' call `idempotency.claim(fingerprint)`. */
  idempotency: IdempotencyHandle;
}

export interface RouteSpec<
  P extends z.ZodType | undefined,
  Q extends z.ZodType | undefined,
  B extends z.ZodType | undefined,
  A extends AuthKind | undefined,
  R extends ResponseSpecs,
> {
  method: HttpMethod;
  /** OpenAPI-style path below /v1, e.g. "/members/{memberId}". */
  path: string;
  operationId: string;
  summary: string;
  description?: string;
  tags: string[];
  /** The permission the route needs (role permission for sessions, scope for API keys). Omit only with `auth`. */
  permission?: Permission;
  /** For routes that need no permission; exclusive with `permission`. */
  auth?: A;
  /** `headers` must be a non-strict z.object with lower-case names; it is validated and documented. */
  request?: { params?: P; query?: Q; body?: B; headers?: z.ZodObject; bodyContent?: BodyContent };
  responses: R;
  /** Problem codes this route can answer with beyond the ones implied by its inputs and access. */
  problems?: ProblemCode[];
  /** Idempotency-Key handling (server/http/idempotency.ts): 'required' on every POST that creates. */
  idempotency?: IdempotencyOption;
  /** Rebuilds a body stored by reference (`replayFrom` on a reply) for an idempotent replay; null when it is gone. */
  resolveReplay?: (deps: AppDeps, organisationId: string, reference: string) => Promise<unknown>;
  /** Count the request against the caller's per-minute rate limit (server/http/rate-limit.ts). Default: true for routes with a principal. */
  rateLimit?: boolean;
  handler(context: HandlerContext<Parsed<P>, Parsed<Q>, Parsed<B>, A>): Promise<Reply<NoInfer<R>>>;
}

export type RouteAccess = { kind: 'permission'; permission: Permission } | { kind: AuthKind };

export interface RouteDefinition {
  method: HttpMethod;
  path: string;
  expressPath: string;
  access: RouteAccess;
  operationId: string;
  summary: string;
  description?: string;
  tags: string[];
  request: { params?: z.ZodType; query?: z.ZodType; body?: z.ZodType; headers?: z.ZodObject; bodyContent?: BodyContent };
  responses: ResponseSpecs;
  problems: ProblemCode[];
  idempotency: IdempotencySetting | null;
  resolveReplay: ((deps: AppDeps, organisationId: string, reference: string) => Promise<unknown>) | null;
  rateLimit: boolean;
  handler(context: HandlerContext<unknown, unknown, unknown, AuthKind | undefined>): Promise<{
    status: number;
    body?: unknown;
    headers?: Record<string, string>;
    replayFrom?: string;
  }>;
}

/**
 * Declares one /v1 endpoint: its documentation (schemas, security, permission), its access rule and its
 * handler, in one place. The same definition is mounted on the Express router (server/http/mount-routes.ts)
 * and registered in the OpenAPI document (server/contract/), so docs and behaviour cannot drift apart.
 */
export function defineRoute<
  P extends z.ZodType | undefined = undefined,
  Q extends z.ZodType | undefined = undefined,
  B extends z.ZodType | undefined = undefined,
  A extends AuthKind | undefined = undefined,
  R extends ResponseSpecs = ResponseSpecs,
>(spec: RouteSpec<P, Q, B, A, R>): RouteDefinition {
  if ((spec.permission === undefined) === (spec.auth === undefined)) {
    throw new Error(`Route ${spec.method.toUpperCase()} ${spec.path} must name exactly one of permission or auth`);
  }
  const access: RouteAccess = spec.permission ? { kind: 'permission', permission: spec.permission } : { kind: spec.auth as AuthKind };
  const idempotency = idempotencySettingOf(spec.idempotency);
  const rateLimit = spec.rateLimit ?? (access.kind !== 'public' && access.kind !== 'session');
  const request = { ...(spec.request ?? {}) };
  const problems = [...(spec.problems ?? [])];
  if (idempotency) {
    request.headers = withIdempotencyKeyHeader(request.headers, idempotency);
    problems.push('idempotency_key_invalid', 'idempotency_key_reused', 'idempotency_request_in_progress');
    if (idempotency.mode === 'required') problems.push('idempotency_key_missing');
  }
  if (rateLimit) problems.push('quota_exceeded');
  return {
    method: spec.method,
    path: spec.path,
    expressPath: spec.path.replace(/\{([A-Za-z0-9_]+)\}/g, ':$1'),
    access,
    operationId: spec.operationId,
    summary: spec.summary,
    description: spec.description,
    tags: spec.tags,
    request,
    responses: spec.responses,
    problems: [...new Set(problems)],
    idempotency,
    resolveReplay: spec.resolveReplay ?? null,
    rateLimit,
    handler: spec.handler as RouteDefinition['handler'],
  };
}

/** Documents the Idempotency-Key header; its rules are checked by server/http/idempotency.ts, not by the schema. */
function withIdempotencyKeyHeader(headers: z.ZodObject | undefined, setting: IdempotencySetting): z.ZodObject {
  const description =
    (setting.mode === 'required' ? '**Required.** ' : 'Optional. ') +
    'Client-chosen key (1–255 visible ASCII characters; a UUID v4 is recommended) naming this request: a retry with the ' +
    'same key and the same body replays the first response (header `Idempotent-Replayed: true`) instead of creating ' +
    'a second object. Same key with another body: 422 `idempotency_key_reused`; while the first is still running: 409 ' +
    '`idempotency_request_in_progress`. Keys are kept 24 h per organisation and endpoint.';
  const header = z.string().optional().meta({ description, example: '6f1d2c3a-8b4e-4f5a-9c7d-1e2f3a4b5c6d' });
  return headers ? headers.extend({ 'idempotency-key': header }) : z.object({ 'idempotency-key': header });
}
