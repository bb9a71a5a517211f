import type {
  CreatedWebhookEndpoint,
  CreateWebhookEndpointRequest,
  UpdateWebhookEndpointRequest,
  WebhookDelivery,
  WebhookEndpoint,
} from '@shared/schemas/webhooks';
import { WEBHOOK_EVENT_TYPE_NAMES } from '@shared/schemas/webhooks';
import type { Page } from '@shared/schemas/pagination';
import type { Executor } from '@server/db/client';
import type { AppDeps } from '@server/deps';
import { ApiProblem, notFound } from '@server/http/api-problem';
import { decodeCursor, toPage } from '@server/http/pagination';
import type { Actor } from '@server/http/principal';
import { newId } from '@server/lib/ids';
import { recordAuditEventBy } from '@server/modules/audit/audit.service';
import { checkWebhookUrl, egressPolicyFor } from '@server/webhooks/egress-guard';
import { buildWebhookEvent, WEBHOOK_EVENT_TYPES, type WebhookEventData, type WebhookEventType } from '@server/webhooks/events';
import { generateWebhookSecret } from '@server/webhooks/webhook-secret';
import { isWebhookError } from '@server/webhooks/webhook-error';
import {
  findDelivery,
  insertDeliveries,
  insertEvent,
  listAttempts,
  listDeliveries,
  updateDelivery,
  wakePendingDeliveries,
} from './webhook-deliveries.repo';
import { deleteEndpoint, findEndpoint, insertEndpoint, listEnabledEndpoints, listEndpoints, updateEndpoint } from './webhook-endpoints.repo';
import { presentDelivery, presentEndpoint } from './webhook-presenter';
import { sealEndpointSecret } from './webhook-secrets';

// The API's list (shared/schemas) and the sender's payload catalogue (server/webhooks/events.ts) must name the
// same events: `satisfies` checks one direction at compile time, the length the other at start-up.
WEBHOOK_EVENT_TYPE_NAMES satisfies readonly WebhookEventType[];
if (WEBHOOK_EVENT_TYPES.length !== WEBHOOK_EVENT_TYPE_NAMES.length) throw new Error('webhook event type lists differ');

/** Default time the previous secret keeps signing after a rotation. */
export const DEFAULT_ROTATION_GRACE_HOURS = 24;

export interface EmittedEvent {
  eventId: string;
  /** One per enabled endpoint subscribed to the type; empty when nobody listens. */
  deliveryIds: string[];
}

/**
 * Records an event and one pending delivery per enabled endpoint of the organisation subscribed to `type`.
 * Pass `tx` to write them in the same transaction as the change they announce (e.g. an analysis's final
 * status), so an event is sent exactly when the change commits. The dispatcher loop sends them.
 * Throws (a programming error, 500) if `data` does not match the event type's payload schema.
 */
export async function emitEvent<T extends WebhookEventType>(
  deps: AppDeps,
  orgId: string,
  type: T,
  data: WebhookEventData<T>,
  tx?: Executor,
): Promise<EmittedEvent> {
  const db = tx ?? deps.db;
  const now = deps.clock.now();
  const { body } = buildWebhookEvent(type, data, now);
  const endpoints = (await listEnabledEndpoints(db, orgId)).filter((endpoint) => endpoint.eventTypes.includes(type));
  const eventId = newId('webhookEvent');
  if (endpoints.length === 0) return { eventId, deliveryIds: [] };
  await insertEvent(db, orgId, { id: eventId, type, body, createdAt: now });
  const deliveries = endpoints.map((endpoint) => ({
    id: newId('webhookDelivery'),
    endpointId: endpoint.id,
    eventId,
    status: 'pending' as const,
    attempts: 0,
    nextAttemptAt: now,
    createdAt: now,
    updatedAt: now,
  }));
  await insertDeliveries(db, orgId, deliveries);
  return { eventId, deliveryIds: deliveries.map((delivery) => delivery.id) };
}

function checkedUrl(deps: AppDeps, url: string): string {
  try {
    return checkWebhookUrl(url, egressPolicyFor(deps.config.nodeEnv)).toString();
  } catch (error) {
    if (!isWebhookError(error)) throw error;
    throw new ApiProblem('webhook_url_not_allowed', error.message, {
      extensions: { reason: error.code },
      errors: [{ in: 'body', pointer: '#/url', detail: error.message }],
    });
  }
}

export async function createEndpoint(deps: AppDeps, orgId: string, input: CreateWebhookEndpointRequest, actor?: Actor): Promise<CreatedWebhookEndpoint> {
  const url = checkedUrl(deps, input.url);
  const id = newId('webhookEndpoint');
  const secret = generateWebhookSecret();
  const now = deps.clock.now();
  await deps.db.transaction(async (tx) => {
    await insertEndpoint(tx, orgId, {
      id,
      url,
      description: input.description ?? null,
      eventTypes: input.eventTypes,
      enabled: true,
      disabledReason: null,
      secretSealed: sealEndpointSecret(deps, id, secret),
      previousSecretSealed: null,
      previousSecretExpiresAt: null,
      createdAt: now,
      updatedAt: now,
    });
    await recordAuditEventBy(tx, orgId, actor, { action: 'webhook_endpoint.created', objectType: 'webhook_endpoint', objectId: id, details: { url: urlForAudit(url), eventTypes: input.eventTypes } }, now);
  });
  return { endpoint: await getEndpoint(deps, orgId, id), secret };
}

export async function getEndpoint(deps: AppDeps, orgId: string, endpointId: string): Promise<WebhookEndpoint> {
  const row = await findEndpoint(deps.db, orgId, endpointId);
  if (!row) throw notFound('webhook endpoint');
  return presentEndpoint(row, deps.clock.now());
}

export async function listEndpointsPage(deps: AppDeps, orgId: string, query: { limit: number; cursor?: string }): Promise<Page<WebhookEndpoint>> {
  const binding = { list: 'webhook-endpoints', organisationId: orgId };
  const rows = await listEndpoints(deps.db, orgId, { limit: query.limit, after: decodeCursor(deps, binding, query.cursor) });
  const now = deps.clock.now();
  return toPage(deps, binding, rows, query.limit, (row) => row, (row) => presentEndpoint(row, now));
}

/** A URL as the audit log keeps it: without query or fragment, which may carry a receiver's token. */
function urlForAudit(url: string): string {
  const parsed = new URL(url);
  return `${parsed.origin}${parsed.pathname}`;
}

/** The audit action of a settings change: enabling and disabling are their own actions (they start or stop deliveries). */
function settingsAuditAction(row: { enabled: boolean }, input: UpdateWebhookEndpointRequest) {
  if (input.enabled !== undefined && input.enabled !== row.enabled) return input.enabled ? 'webhook_endpoint.enabled' : 'webhook_endpoint.disabled';
  return 'webhook_endpoint.updated';
}

export async function updateEndpointSettings(
  deps: AppDeps,
  orgId: string,
  endpointId: string,
  input: UpdateWebhookEndpointRequest,
  actor?: Actor,
): Promise<WebhookEndpoint> {
  const row = await findEndpoint(deps.db, orgId, endpointId);
  if (!row) throw notFound('webhook endpoint');
  const now = deps.clock.now();
  const changes = {
    ...(input.url !== undefined ? { url: checkedUrl(deps, input.url) } : {}),
    ...(input.eventTypes !== undefined ? { eventTypes: input.eventTypes } : {}),
    ...(input.description !== undefined ? { description: input.description } : {}),
    ...(input.enabled !== undefined ? { enabled: input.enabled, disabledReason: null } : {}),
  };
  await deps.db.transaction(async (tx) => {
    await updateEndpoint(tx, orgId, endpointId, { ...changes, updatedAt: now });
    const { disabledReason: _reason, ...changed } = changes as typeof changes & { disabledReason?: null };
    if (changed.url !== undefined) changed.url = urlForAudit(changed.url);
    await recordAuditEventBy(tx, orgId, actor, { action: settingsAuditAction(row, input), objectType: 'webhook_endpoint', objectId: endpointId, details: { changed } }, now);
  });
  if (input.enabled === true && !row.enabled) await wakePendingDeliveries(deps.db, orgId, endpointId, deps.clock.now());
  return getEndpoint(deps, orgId, endpointId);
}

/** A new secret signs from now on; the old one keeps signing beside it for the grace period. */
export async function rotateEndpointSecret(
  deps: AppDeps,
  orgId: string,
  endpointId: string,
  graceHours: number = DEFAULT_ROTATION_GRACE_HOURS,
  actor?: Actor,
): Promise<CreatedWebhookEndpoint> {
  const row = await findEndpoint(deps.db, orgId, endpointId);
  if (!row) throw notFound('webhook endpoint');
  const now = deps.clock.now();
  const secret = generateWebhookSecret();
  const previousSecretExpiresAt = graceHours > 0 ? new Date(now.getTime() + graceHours * 3600_000) : null;
  await deps.db.transaction(async (tx) => {
    await updateEndpoint(tx, orgId, endpointId, {
      secretSealed: sealEndpointSecret(deps, endpointId, secret),
      previousSecretSealed: graceHours > 0 ? row.secretSealed : null,
      previousSecretExpiresAt,
      updatedAt: now,
    });
    // Never the secret itself: only how long the old one keeps signing.
    await recordAuditEventBy(tx, orgId, actor, {
      action: 'webhook_endpoint.secret_rotated',
      objectType: 'webhook_endpoint',
      objectId: endpointId,
      details: { graceHours, previousSecretExpiresAt: previousSecretExpiresAt?.toISOString() ?? null },
    }, now);
  });
  return { endpoint: await getEndpoint(deps, orgId, endpointId), secret };
}

export async function deleteEndpointById(deps: AppDeps, orgId: string, endpointId: string, actor?: Actor): Promise<void> {
  const row = await findEndpoint(deps.db, orgId, endpointId);
  if (!row) throw notFound('webhook endpoint');
  const now = deps.clock.now();
  await deps.db.transaction(async (tx) => {
    await deleteEndpoint(tx, orgId, endpointId);
    await recordAuditEventBy(tx, orgId, actor, { action: 'webhook_endpoint.deleted', objectType: 'webhook_endpoint', objectId: endpointId, details: { url: urlForAudit(row.url) } }, now);
  });
}

export async function listDeliveriesPage(
  deps: AppDeps,
  orgId: string,
  endpointId: string,
  query: { limit: number; cursor?: string },
): Promise<Page<WebhookDelivery>> {
  if (!(await findEndpoint(deps.db, orgId, endpointId))) throw notFound('webhook endpoint');
  const binding = { list: 'webhook-deliveries', organisationId: orgId, endpointId };
  const rows = await listDeliveries(deps.db, orgId, endpointId, { limit: query.limit, after: decodeCursor(deps, binding, query.cursor) });
  const attempts = await listAttempts(deps.db, orgId, rows.map((row) => row.delivery.id));
  return toPage(
    deps,
    binding,
    rows,
    query.limit,
    (row) => row.delivery,
    (row) => presentDelivery(row.delivery, row.eventType, attempts),
  );
}

/**
 * Sends a delivery again soon (the same event id and body, freshly signed), whatever its state: a resend of a
 * failed delivery starts a new retry schedule; a pending one is brought forward.
 */
export async function resendDelivery(deps: AppDeps, orgId: string, endpointId: string, deliveryId: string): Promise<WebhookDelivery> {
  const found = await findDelivery(deps.db, orgId, endpointId, deliveryId);
  if (!found) throw notFound('webhook delivery');
  const now = deps.clock.now();
  await updateDelivery(deps.db, orgId, deliveryId, { status: 'pending', attempts: 0, nextAttemptAt: now, lockedUntil: null, updatedAt: now });
  const again = await findDelivery(deps.db, orgId, endpointId, deliveryId);
  const attempts = await listAttempts(deps.db, orgId, [deliveryId]);
  return presentDelivery(again!.delivery, again!.event.type, attempts);
}
