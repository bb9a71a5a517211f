import { z } from 'zod';
import {
  apiKeyListQuerySchema,
  apiKeyPageSchema,
  apiKeyParamsSchema,
  apiKeySchema,
  createApiKeyRequestSchema,
  createdApiKeySchema,
  currentApiKeySchema,
} from '@shared/schemas/api-keys';
import { defineRoute } from '@server/http/define-route';
import { createApiKey, describeCallingKey, getApiKey, listApiKeysPage, revokeApiKey } from './api-keys.service';

// /api-keys/current comes first so that a later /api-keys/{keyId} cannot capture it.
export const apiKeyRoutes = [
  defineRoute({
    method: 'get',
    path: '/api-keys/current',
    operationId: 'getCurrentApiKey',
    summary: 'Describe the calling API key',
    description: 'Lets a rig check its key: name, scopes, expiry and organisation. Needs no scope.',
    tags: ['API keys'],
    auth: 'api_key',
    responses: { 200: { description: 'The key that authenticated this request.', schema: currentApiKeySchema } },
    handler: async ({ deps, principal }) => ({ status: 200, body: await describeCallingKey(deps, principal) }),
  }),
  defineRoute({
    method: 'get',
    path: '/api-keys',
    operationId: 'listApiKeys',
    summary: 'List API keys',
    description: 'Every key of the active organisation, active, expired and revoked, newest first. Secrets are never returned.',
    tags: ['API keys'],
    permission: 'keys:manage',
    request: { query: apiKeyListQuerySchema },
    responses: { 200: { description: 'A page of API keys.', schema: apiKeyPageSchema } },
    problems: ['invalid_cursor'],
    handler: async ({ deps, principal, query }) => ({
      status: 200,
      body: await listApiKeysPage(deps, principal.organisationId, query),
    }),
  }),
  defineRoute({
    method: 'post',
    path: '/api-keys',
    operationId: 'createApiKey',
    summary: 'Create an API key',
    description:
      'Creates a key with the given scopes (none beyond your own permissions) and optional expiry. The response ' +
      'is the only time the secret is shown: only its SHA-256 hash is stored.',
    tags: ['API keys'],
    permission: 'keys:manage',
    idempotency: 'optional',
    request: { body: createApiKeyRequestSchema },
    responses: {
      201: { description: 'The key and its secret, shown once.', schema: createdApiKeySchema, headers: { location: { description: 'URL of the key (without its secret).', schema: z.string() } } },
    },
    problems: ['scope_not_held'],
    handler: async ({ deps, principal, body }) => {
      const created = await createApiKey(deps, principal, body);
      return { status: 201, body: created, headers: { Location: `/v1/api-keys/${created.apiKey.id}` } };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api-keys/{keyId}',
    operationId: 'getApiKey',
    summary: 'Get an API key',
    description: 'Name, scopes, prefix, last use, expiry and status of one key. The secret is never returned.',
    tags: ['API keys'],
    permission: 'keys:manage',
    request: { params: apiKeyParamsSchema },
    responses: { 200: { description: 'The key.', schema: apiKeySchema } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params }) => ({ status: 200, body: await getApiKey(deps, principal.organisationId, params.keyId) }),
  }),
  defineRoute({
    method: 'post',
    path: '/api-keys/{keyId}/revoke',
    operationId: 'revokeApiKey',
    summary: 'Revoke an API key',
    description: 'The key is refused from the next request on (401 api_key_revoked). Revoking a revoked key changes nothing.',
    tags: ['API keys'],
    permission: 'keys:manage',
    request: { params: apiKeyParamsSchema },
    responses: { 200: { description: 'The revoked key.', schema: apiKeySchema } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params }) => ({ status: 200, body: await revokeApiKey(deps, principal, params.keyId) }),
  }),
];
