import { z } from 'zod';
import { prefixedIdSchema, timestampSchema } from './common';
import { pageQueryShape, pageSchema } from './pagination';

/** Event types an endpoint can subscribe to (the payload schemas live with the sender). */
export const WEBHOOK_EVENT_TYPE_NAMES = ['analysis.succeeded', 'analysis.failed', 'quota.threshold'] as const;
export const webhookEventTypeSchema = z.enum(WEBHOOK_EVENT_TYPE_NAMES).meta({
  id: 'WebhookEventType',
  description:
    'analysis.succeeded and analysis.failed when an analysis finishes; quota.threshold when a monthly quota reaches 80 % ' +
    'and 100 % (once per period each).',
});

export const webhookEndpointIdSchema = prefixedIdSchema('whe', 'whe_7Lp2Qx9Kd4Zt1Wm6Nv3B');
export const webhookDeliveryIdSchema = prefixedIdSchema('whd', 'whd_3Nx8Rk1Vq6Lz9Tb2Pw5C');

const eventTypesSchema = z
  .array(webhookEventTypeSchema)
  .min(1)
  .refine((types) => new Set(types).size === types.length, { message: 'Each event type may appear only once.' })
  .meta({ example: ['analysis.succeeded', 'analysis.failed'] });

export const webhookEndpointSchema = z
  .object({
    id: webhookEndpointIdSchema,
    url: z.string().meta({ example: 'https://rigs.kestrelbay.example/sweepline/events' }),
    description: z.string().nullable().meta({ example: 'Line 2 MES bridge' }),
    eventTypes: z.array(webhookEventTypeSchema),
    enabled: z.boolean(),
    disabledReason: z
      .enum(['gone'])
      .nullable()
      .meta({ description: '`gone` when the service disabled the endpoint because the receiver answered 410; null otherwise.' }),
    previousSecretExpiresAt: timestampSchema
      .nullable()
      .meta({ description: 'After a rotation, the old secret still signs (beside the new one) until this time.' }),
    createdAt: timestampSchema,
    updatedAt: timestampSchema,
  })
  .meta({ id: 'WebhookEndpoint', description: 'A receiver of signed event notifications. The signing secret is never shown again after creation or rotation.' });
export type WebhookEndpoint = z.infer<typeof webhookEndpointSchema>;

export const webhookSecretSchema = z.string().meta({
  description: 'Signing secret `whsec_<base64>`, shown only in this response: store it in the receiver now.',
  example: 'whsec_MfKQ9r8GKYqrTwjUPD8ILPZIo2LaLaSw',
});

export const createdWebhookEndpointSchema = z
  .object({ endpoint: webhookEndpointSchema, secret: webhookSecretSchema })
  .meta({ id: 'CreatedWebhookEndpoint' });
export type CreatedWebhookEndpoint = z.infer<typeof createdWebhookEndpointSchema>;

export const createWebhookEndpointRequestSchema = z
  .strictObject({
    url: z.string().min(1).max(2048).meta({
      description: 'https URL of the receiver (http and local addresses only in development and test). Private, loopback and link-local targets are refused in production.',
      example: 'https://rigs.kestrelbay.example/sweepline/events',
    }),
    eventTypes: eventTypesSchema,
    description: z.string().trim().max(200).optional().meta({ example: 'Line 2 MES bridge' }),
  })
  .meta({ id: 'CreateWebhookEndpointRequest' });
export type CreateWebhookEndpointRequest = z.infer<typeof createWebhookEndpointRequestSchema>;

export const updateWebhookEndpointRequestSchema = z
  .strictObject({
    url: createWebhookEndpointRequestSchema.shape.url.optional(),
    eventTypes: eventTypesSchema.optional(),
    description: z.string().trim().max(200).nullable().optional(),
    enabled: z.boolean().optional().meta({ description: 'false pauses deliveries (they stay pending); true resumes them.' }),
  })
  .meta({ id: 'UpdateWebhookEndpointRequest', description: 'Members given replace the current values.' });
export type UpdateWebhookEndpointRequest = z.infer<typeof updateWebhookEndpointRequestSchema>;

export const rotateWebhookSecretRequestSchema = z
  .strictObject({
    graceHours: z.number().min(0).max(168).optional().meta({
      description: 'How long the old secret keeps signing beside the new one, hours (default 24; 0 drops it at once).',
      example: 24,
    }),
  })
  .meta({ id: 'RotateWebhookSecretRequest' });

export const webhookEndpointParamsSchema = z.strictObject({ endpointId: webhookEndpointIdSchema });
export const webhookDeliveryParamsSchema = z.strictObject({ endpointId: webhookEndpointIdSchema, deliveryId: webhookDeliveryIdSchema });
export const webhookEndpointListQuerySchema = z.strictObject({ ...pageQueryShape });
export const webhookEndpointPageSchema = pageSchema(webhookEndpointSchema, 'WebhookEndpointPage');

export const webhookDeliveryAttemptSchema = z
  .object({
    attemptNumber: z.number().int(),
    attemptedAt: timestampSchema,
    outcome: z.string().meta({ description: 'succeeded, disable_endpoint, or retry:<reason> (server_error, timeout, network_error, …).', example: 'retry:server_error' }),
    responseStatus: z.number().int().nullable(),
    responseExcerpt: z.string().nullable().meta({ description: 'First bytes (at most 1 kB) of the receiver\'s reply.' }),
    error: z.object({ code: z.string(), message: z.string() }).nullable(),
    durationMs: z.number().int(),
  })
  .meta({ id: 'WebhookDeliveryAttempt' });

export const webhookDeliverySchema = z
  .object({
    id: webhookDeliveryIdSchema,
    endpointId: webhookEndpointIdSchema,
    eventId: prefixedIdSchema('evt', 'evt_9Qm4Tz2Lx7Kb1Wp5Nd8R').meta({ description: 'Sent as webhook-id; the same on every attempt and resend, so receivers can deduplicate.' }),
    eventType: webhookEventTypeSchema,
    status: z.enum(['pending', 'succeeded', 'failed']).meta({ description: 'pending while attempts remain; failed once the retry schedule is used up or the endpoint answered 410.' }),
    attempts: z.number().int(),
    nextAttemptAt: timestampSchema.nullable(),
    lastAttemptAt: timestampSchema.nullable(),
    lastResponseStatus: z.number().int().nullable(),
    lastResponseExcerpt: z.string().nullable(),
    lastError: z.string().nullable(),
    attemptLog: z.array(webhookDeliveryAttemptSchema),
    createdAt: timestampSchema,
    updatedAt: timestampSchema,
  })
  .meta({ id: 'WebhookDelivery', description: 'One event to one endpoint, with its attempts.' });
export type WebhookDelivery = z.infer<typeof webhookDeliverySchema>;

export const webhookDeliveryListQuerySchema = z.strictObject({ ...pageQueryShape });
export const webhookDeliveryPageSchema = pageSchema(webhookDeliverySchema, 'WebhookDeliveryPage');
