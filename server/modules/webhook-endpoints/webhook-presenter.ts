import type { WebhookDelivery, WebhookEndpoint } from '@shared/schemas/webhooks';
import type { WebhookAttemptRow, WebhookDeliveryRow } from './webhook-deliveries.repo';
import type { WebhookEndpointRow } from './webhook-endpoints.repo';

export function presentEndpoint(row: WebhookEndpointRow, now: Date): WebhookEndpoint {
  const graceActive = row.previousSecretExpiresAt !== null && row.previousSecretExpiresAt.getTime() > now.getTime();
  return {
    id: row.id,
    url: row.url,
    description: row.description,
    eventTypes: row.eventTypes as WebhookEndpoint['eventTypes'],
    enabled: row.enabled,
    disabledReason: row.disabledReason === 'gone' ? 'gone' : null,
    previousSecretExpiresAt: graceActive ? row.previousSecretExpiresAt!.toISOString() : null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

export function presentDelivery(row: WebhookDeliveryRow, eventType: string, attempts: WebhookAttemptRow[]): WebhookDelivery {
  return {
    id: row.id,
    endpointId: row.endpointId,
    eventId: row.eventId,
    eventType: eventType as WebhookDelivery['eventType'],
    status: row.status,
    attempts: row.attempts,
    nextAttemptAt: row.status === 'pending' ? (row.nextAttemptAt?.toISOString() ?? null) : null,
    lastAttemptAt: row.lastAttemptAt?.toISOString() ?? null,
    lastResponseStatus: row.lastResponseStatus,
    lastResponseExcerpt: row.lastResponseExcerpt,
    lastError: row.lastError,
    attemptLog: attempts
      .filter((attempt) => attempt.deliveryId === row.id)
      .map((attempt) => ({
        attemptNumber: attempt.attemptNumber,
        attemptedAt: attempt.attemptedAt.toISOString(),
        outcome: attempt.outcome,
        responseStatus: attempt.responseStatus,
        responseExcerpt: attempt.responseExcerpt,
        error: attempt.error ?? null,
        durationMs: attempt.durationMs,
      })),
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}
