import { z } from 'zod';
import { WebhookError } from './webhook-error';

/** Standard Webhooks v1.0.0 "Payload size": keep payloads small, usually under 20 kB. We enforce it. */
export const WEBHOOK_PAYLOAD_MAX_BYTES = 20_000;

const analysisId = z.string().regex(/^ana_[A-Za-z0-9]+$/).describe('Analysis id (ana_…).');
const dutSummary = z
  .object({ model: z.string(), serial: z.string(), lot: z.string().optional() })
  .describe('Device under test, as given when the analysis was created.');

// Thin payloads: identifiers plus the few fields a rig acts on; the full result is one GET away.
const analysisSucceededData = z.object({
  id: analysisId,
  kind: z.string().describe('Analysis kind, e.g. response_and_distortion.'),
  status: z.literal('succeeded'),
  captureId: z.string().optional(),
  dut: dutSummary.optional(),
  verdict: z
    .enum(['pass', 'fail', 'incomplete'])
    .nullable()
    .optional()
    .describe('Mask verdict: incomplete when the curve does not cover the whole mask; null when no tolerance mask was applied.'),
  url: z.string().describe('Path of the analysis resource, e.g. /v1/analyses/ana_…'),
});

const analysisFailedData = z.object({
  id: analysisId,
  kind: z.string(),
  status: z.literal('failed'),
  captureId: z.string().optional(),
  dut: dutSummary.optional(),
  error: z.object({ code: z.string(), title: z.string() }).describe('Stable code and short title of the failure.'),
  url: z.string(),
});

const quotaThresholdData = z.object({
  quota: z.enum(['analyses', 'audio_minutes', 'storage_bytes']).describe('Which plan quota crossed a threshold.'),
  thresholdPercent: z.number().int().min(1).max(100).describe('The threshold crossed, e.g. 80 or 100.'),
  used: z.number().nonnegative(),
  limit: z.number().positive(),
  periodEndsAt: z.iso.datetime().describe('When the quota resets (RFC 3339).'),
});

export const webhookEventDataSchemas = {
  'analysis.succeeded': analysisSucceededData,
  'analysis.failed': analysisFailedData,
  'quota.threshold': quotaThresholdData,
} as const;

export type WebhookEventType = keyof typeof webhookEventDataSchemas;
export const WEBHOOK_EVENT_TYPES = Object.keys(webhookEventDataSchemas) as WebhookEventType[];
export type WebhookEventData<T extends WebhookEventType> = z.infer<(typeof webhookEventDataSchemas)[T]>;

/** The envelope sent as the body: dotted `type`, RFC 3339 `timestamp` of the event (not of the attempt), `data`. */
export interface WebhookEvent<T extends WebhookEventType = WebhookEventType> {
  type: T;
  timestamp: string;
  data: WebhookEventData<T>;
}

export interface BuiltWebhookEvent<T extends WebhookEventType = WebhookEventType> {
  event: WebhookEvent<T>;
  /** Minified JSON; sign and send exactly these bytes (store them, so every retry sends the same body). */
  body: string;
}

export function isWebhookEventType(value: string): value is WebhookEventType {
  return Object.hasOwn(webhookEventDataSchemas, value);
}

/** Validates `data` against its event type and serialises the envelope, refusing anything over 20 kB. */
export function buildWebhookEvent<T extends WebhookEventType>(
  type: T,
  data: WebhookEventData<T>,
  occurredAt: Date,
): BuiltWebhookEvent<T> {
  if (!isWebhookEventType(type)) {
    throw new WebhookError('unknown_event_type', `Unknown webhook event type "${String(type)}".`);
  }
  const result = webhookEventDataSchemas[type].safeParse(data);
  if (!result.success) {
    const firstIssue = result.error.issues[0];
    throw new WebhookError('invalid_event_data', `Invalid ${type} data at "${firstIssue?.path.join('.') ?? ''}": ${firstIssue?.message}`);
  }
  const parsed = result.data as WebhookEventData<T>;
  const event: WebhookEvent<T> = { type, timestamp: occurredAt.toISOString(), data: parsed };
  const body = JSON.stringify(event);
  const bodyBytes = Buffer.byteLength(body, 'utf8');
  if (bodyBytes > WEBHOOK_PAYLOAD_MAX_BYTES) {
    throw new WebhookError('payload_too_large', `Webhook payload is ${bodyBytes} bytes; the limit is ${WEBHOOK_PAYLOAD_MAX_BYTES}.`, {
      bodyBytes,
      limitBytes: WEBHOOK_PAYLOAD_MAX_BYTES,
    });
  }
  return { event, body };
}
