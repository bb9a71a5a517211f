import { z } from 'zod';
import {
  createdWebhookEndpointSchema,
  createWebhookEndpointRequestSchema,
  rotateWebhookSecretRequestSchema,
  updateWebhookEndpointRequestSchema,
  webhookDeliveryListQuerySchema,
  webhookDeliveryPageSchema,
  webhookDeliveryParamsSchema,
  webhookDeliverySchema,
  webhookEndpointListQuerySchema,
  webhookEndpointPageSchema,
  webhookEndpointParamsSchema,
  webhookEndpointSchema,
} from '@shared/schemas/webhooks';
import { defineRoute } from '@server/http/define-route';
import {
  createEndpoint,
  deleteEndpointById,
  getEndpoint,
  listDeliveriesPage,
  listEndpointsPage,
  resendDelivery,
  rotateEndpointSecret,
  updateEndpointSettings,
} from './webhooks.service';

const SIGNING =
  'Each delivery is a POST of `{ type, timestamp, data }` signed as Standard Webhooks v1.0.0: headers `webhook-id` ' +
  '(the event id, the same on every retry: deduplicate on it), `webhook-timestamp` (Unix seconds of the attempt) and ' +
  '`webhook-signature: v1,<base64 HMAC-SHA256 of "{id}.{timestamp}.{raw body}">` (space-separated when two secrets ' +
  'sign during a rotation). Verify in constant time and refuse timestamps more than 5 minutes off. Any 2xx is success; ' +
  'other answers are retried with back-off (5 s, 5 min, 30 min, 2 h, 5 h, 10 h, 14 h, 20 h, 24 h); 410 disables the endpoint.';

export const webhookRoutes = [
  defineRoute({
    method: 'post',
    path: '/webhook-endpoints',
    operationId: 'createWebhookEndpoint',
    summary: 'Create a webhook endpoint',
    description: `The response carries the signing secret (\`whsec_…\`), shown only this once. ${SIGNING}`,
    tags: ['Webhooks'],
    permission: 'webhooks:manage',
    idempotency: 'optional',
    request: { body: createWebhookEndpointRequestSchema },
    responses: {
      201: {
        description: 'The endpoint and its secret.',
        schema: createdWebhookEndpointSchema,
        headers: { location: { description: 'URL of the endpoint.', schema: z.string() } },
      },
    },
    problems: ['webhook_url_not_allowed'],
    handler: async ({ deps, principal, body }) => {
      const created = await createEndpoint(deps, principal.organisationId, body, principal.actor);
      return { status: 201, body: created, headers: { Location: `/v1/webhook-endpoints/${created.endpoint.id}` } };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/webhook-endpoints',
    operationId: 'listWebhookEndpoints',
    summary: 'List webhook endpoints',
    tags: ['Webhooks'],
    permission: 'webhooks:manage',
    request: { query: webhookEndpointListQuerySchema },
    responses: { 200: { description: 'A page of endpoints, newest first.', schema: webhookEndpointPageSchema } },
    problems: ['invalid_cursor'],
    handler: async ({ deps, principal, query }) => ({ status: 200, body: await listEndpointsPage(deps, principal.organisationId, query) }),
  }),
  defineRoute({
    method: 'get',
    path: '/webhook-endpoints/{endpointId}',
    operationId: 'getWebhookEndpoint',
    summary: 'Get a webhook endpoint',
    tags: ['Webhooks'],
    permission: 'webhooks:manage',
    request: { params: webhookEndpointParamsSchema },
    responses: { 200: { description: 'The endpoint (without its secret).', schema: webhookEndpointSchema } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params }) => ({ status: 200, body: await getEndpoint(deps, principal.organisationId, params.endpointId) }),
  }),
  defineRoute({
    method: 'patch',
    path: '/webhook-endpoints/{endpointId}',
    operationId: 'updateWebhookEndpoint',
    summary: 'Change a webhook endpoint',
    description: 'URL, event types, description, or enabled (false pauses deliveries; re-enabling an endpoint disabled after a 410 resumes them).',
    tags: ['Webhooks'],
    permission: 'webhooks:manage',
    request: { params: webhookEndpointParamsSchema, body: updateWebhookEndpointRequestSchema },
    responses: { 200: { description: 'The endpoint.', schema: webhookEndpointSchema } },
    problems: ['not_found', 'webhook_url_not_allowed'],
    handler: async ({ deps, principal, params, body }) => ({
      status: 200,
      body: await updateEndpointSettings(deps, principal.organisationId, params.endpointId, body, principal.actor),
    }),
  }),
  defineRoute({
    method: 'delete',
    path: '/webhook-endpoints/{endpointId}',
    operationId: 'deleteWebhookEndpoint',
    summary: 'Delete a webhook endpoint',
    description: 'Its pending deliveries and delivery log go with it.',
    tags: ['Webhooks'],
    permission: 'webhooks:manage',
    request: { params: webhookEndpointParamsSchema },
    responses: { 204: { description: 'Deleted.' } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params }) => {
      await deleteEndpointById(deps, principal.organisationId, params.endpointId, principal.actor);
      return { status: 204 };
    },
  }),
  defineRoute({
    method: 'post',
    path: '/webhook-endpoints/{endpointId}/rotate-secret',
    operationId: 'rotateWebhookSecret',
    summary: 'Rotate an endpoint\'s signing secret',
    description:
      'Returns the new secret (shown once). For `graceHours` (default 24) deliveries carry two signatures, one per secret, so ' +
      'the receiver can switch without losing events.',
    tags: ['Webhooks'],
    permission: 'webhooks:manage',
    request: { params: webhookEndpointParamsSchema, body: rotateWebhookSecretRequestSchema },
    responses: { 200: { description: 'The endpoint and its new secret.', schema: createdWebhookEndpointSchema } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params, body }) => ({
      status: 200,
      body: await rotateEndpointSecret(deps, principal.organisationId, params.endpointId, body.graceHours, principal.actor),
    }),
  }),
  defineRoute({
    method: 'get',
    path: '/webhook-endpoints/{endpointId}/deliveries',
    operationId: 'listWebhookDeliveries',
    summary: 'List deliveries of an endpoint',
    description: 'Newest first, each with its attempts (status code, first bytes of the reply, error, duration).',
    tags: ['Webhooks'],
    permission: 'webhooks:manage',
    request: { params: webhookEndpointParamsSchema, query: webhookDeliveryListQuerySchema },
    responses: { 200: { description: 'A page of deliveries.', schema: webhookDeliveryPageSchema } },
    problems: ['not_found', 'invalid_cursor'],
    handler: async ({ deps, principal, params, query }) => ({
      status: 200,
      body: await listDeliveriesPage(deps, principal.organisationId, params.endpointId, query),
    }),
  }),
  defineRoute({
    method: 'post',
    path: '/webhook-endpoints/{endpointId}/deliveries/{deliveryId}/resend',
    operationId: 'resendWebhookDelivery',
    summary: 'Send a delivery again',
    description: 'Queues the same event (same webhook-id and body, signed afresh) for immediate delivery, with a fresh retry schedule.',
    tags: ['Webhooks'],
    permission: 'webhooks:manage',
    request: { params: webhookDeliveryParamsSchema },
    responses: { 202: { description: 'The delivery, pending.', schema: webhookDeliverySchema } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params }) => ({
      status: 202,
      body: await resendDelivery(deps, principal.organisationId, params.endpointId, params.deliveryId),
    }),
  }),
];
