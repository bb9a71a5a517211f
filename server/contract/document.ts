import { OpenAPIRegistry, OpenApiGeneratorV31, type RouteConfig } from '@asteasolutions/zod-to-openapi';
import { PROBLEMS, type ProblemCode } from '@shared/problems';
import { problemSchema } from '@shared/schemas/problem';
import { ROLE_PERMISSIONS, ROLES, type Permission } from '@shared/schemas/permissions';
import type { RouteDefinition } from '@server/http/define-route';
import { v1Routes } from '@server/modules/routes';
import { acceptsKey, acceptsSession, problemCodesOf } from './problem-codes';
import { openApiHeaders, responseHeadersOf } from './response-headers';

export { problemCodesOf } from './problem-codes';

const API_DESCRIPTION = `Sweepline analyses acoustic measurements for loudspeaker, microphone and headphone test rigs.

**Authentication.** Rigs send an API key as \`Authorization: Bearer swl_live_…\`; its scopes decide what it may do.
The console uses the \`swl_session\` cookie from \`POST /v1/auth/sign-in\`; cookie-authenticated writes must carry
the console's \`Origin\`. Each operation names the permission it needs.

**Errors.** Every error is \`application/problem+json\` (RFC 9457) with a stable \`code\` and a \`requestId\`.

**Lists.** Paginated lists take \`limit\` (default 20, max 100) and \`cursor\` and answer
\`{ data, hasMore, nextCursor? }\`, newest first unless the list takes a \`sort\` (analyses do).

**Response headers.** Creates answer with \`Location\`; authenticated responses carry \`RateLimit-Policy\` and
\`RateLimit\` (IETF draft-ietf-httpapi-ratelimit-headers); every 429 carries \`Retry-After\` (obey it over
\`RateLimit\`); a replay under the same \`Idempotency-Key\` carries \`Idempotent-Replayed: true\`.`;

const TAGS = [
  { name: 'Service', description: 'Health of the service.' },
  { name: 'Sign-in', description: 'Console accounts and sessions.' },
  { name: 'Members', description: 'Members of an organisation, their roles and permissions.' },
  { name: 'API keys', description: 'Keys for rigs and scripts.' },
  { name: 'Audit', description: 'The organisation\'s audit log.' },
  { name: 'Stimuli', description: 'Test signals defined by parameters, regenerated deterministically. Mind the safety cautions.' },
  { name: 'Captures', description: 'Uploaded WAV captures, validated on arrival and stored by content hash.' },
  { name: 'Analyses', description: 'Asynchronous analysis jobs and their results, with every convention stated.' },
  { name: 'Calibrations', description: 'Chain sensitivity per rig input (dBFS at 1 Pa), from a calibrator capture or entered values, with a validity period.' },
  { name: 'Tolerance masks', description: 'Upper and lower limits against frequency, versioned; derived from golden units or entered.' },
  { name: 'Production', description: 'Yield and unit-to-unit statistics for a model and lot.' },
  { name: 'Usage', description: 'Usage against the plan\'s monthly quotas and rate limit.' },
  { name: 'Billing', description: 'Plans, checkout and billing portal at the payment provider, invoices, and the provider\'s signed events.' },
  { name: 'Webhooks', description: 'Signed event notifications (Standard Webhooks v1.0.0) with retries and a delivery log.' },
  { name: 'Development', description: 'Helpers that exist only on development and test servers (the local mail catcher\'s outbox).' },
];

const SECURITY_SCHEMES = {
  apiKey: {
    type: 'http',
    scheme: 'bearer',
    bearerFormat: 'swl_live_…',
    description: 'An API key created under API keys; its scopes are the permissions it grants.',
  },
  sessionCookie: {
    type: 'apiKey',
    in: 'cookie',
    name: 'swl_session',
    description: 'Console session from POST /v1/auth/sign-in. Writes must carry the console\'s Origin header.',
  },
} as const;

function security(route: RouteDefinition): RouteConfig['security'] {
  const schemes: Array<Record<string, string[]>> = [];
  if (acceptsKey(route)) schemes.push({ apiKey: [] });
  if (acceptsSession(route)) schemes.push({ sessionCookie: [] });
  return schemes;
}

function rolesHolding(permission: Permission): string {
  return ROLES.filter((role) => ROLE_PERMISSIONS[role].includes(permission)).join(', ');
}

function accessNote(route: RouteDefinition): string {
  switch (route.access.kind) {
    case 'permission':
      return `**Permission:** \`${route.access.permission}\` — held by the roles ${rolesHolding(route.access.permission)}; an API key needs the scope \`${route.access.permission}\`.`;
    case 'principal':
      return '**Access:** any member session or API key of the organisation.';
    case 'session':
      return '**Access:** a signed-in console session (API keys are not accepted).';
    case 'api_key':
      return '**Access:** an API key (any scope).';
    case 'public':
      return '**Access:** public, no credentials.';
  }
}

function responsesOf(route: RouteDefinition): RouteConfig['responses'] {
  const responses: RouteConfig['responses'] = {};
  for (const [status, spec] of Object.entries(route.responses)) {
    const headers = openApiHeaders(responseHeadersOf(route, Number(status), spec.headers));
    responses[status] = {
      description: spec.description,
      ...(headers ? { headers } : {}),
      ...(spec.schema ? { content: { 'application/json': { schema: spec.schema } } } : {}),
      ...(spec.contentType && !spec.schema ? { content: { [spec.contentType]: { schema: { type: 'string', format: 'binary' } } } } : {}),
    };
  }
  const byStatus = new Map<number, ProblemCode[]>();
  for (const code of problemCodesOf(route)) {
    const status = PROBLEMS[code].status;
    if (route.responses[status]) continue;
    byStatus.set(status, [...(byStatus.get(status) ?? []), code]);
  }
  for (const [status, codes] of [...byStatus.entries()].sort(([a], [b]) => a - b)) {
    const headers = openApiHeaders(responseHeadersOf(route, status, undefined));
    responses[String(status)] = {
      description: `Problem: ${codes.map((code) => `\`${code}\``).join(', ')}.`,
      ...(headers ? { headers } : {}),
      content: { 'application/problem+json': { schema: problemSchema } },
    };
  }
  return responses;
}

function registerRoute(registry: OpenAPIRegistry, route: RouteDefinition) {
  const { params, query, body, headers, bodyContent } = route.request;
  const documentedBody = body
    ? { required: true, content: { 'application/json': { schema: body } } }
    : bodyContent
      ? { required: true, content: Object.fromEntries(Object.entries(bodyContent).map(([type, schema]) => [type, { schema }])) }
      : null;
  registry.registerPath({
    method: route.method,
    path: `/v1${route.path}`,
    operationId: route.operationId,
    summary: route.summary,
    description: [route.description, accessNote(route)].filter(Boolean).join('\n\n'),
    tags: route.tags,
    security: security(route),
    ...(route.access.kind === 'permission' ? { 'x-required-permission': route.access.permission } : {}),
    request: {
      ...(params ? { params: params as never } : {}),
      ...(query ? { query: query as never } : {}),
      ...(headers ? { headers } : {}),
      ...(documentedBody ? { body: documentedBody as never } : {}),
    },
    responses: responsesOf(route),
  });
}

/** The OpenAPI 3.1 document of every /v1 route; `npm run openapi` writes it to openapi/openapi.json. */
export function buildOpenApiDocument(options: { version: string; routes?: RouteDefinition[] }) {
  const registry = new OpenAPIRegistry();
  for (const [name, scheme] of Object.entries(SECURITY_SCHEMES)) registry.registerComponent('securitySchemes', name, scheme);
  for (const route of options.routes ?? v1Routes) registerRoute(registry, route);
  const generator = new OpenApiGeneratorV31(registry.definitions, { sortComponents: 'alphabetically' });
  return generator.generateDocument({
    openapi: '3.1.0',
    info: { title: 'Sweepline API', version: options.version, description: API_DESCRIPTION },
    tags: TAGS,
  });
}
