import Stripe from 'stripe';
import { newObjectId, unixSeconds } from '../ids';
import type { ProviderState } from '../state';
import { signatureHeader, SIGNATURE_HEADER } from './sign-payload';

export type FakeEventType =
  | 'checkout.session.completed'
  | 'customer.subscription.created'
  | 'customer.subscription.updated'
  | 'customer.subscription.deleted'
  | 'invoice.paid';

export interface FakeEvent {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: unknown; previous_attributes?: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: FakeEventType;
}

export interface WebhookDelivery {
  eventId: string;
  type: FakeEventType;
  url: string | null;
  attemptedAt: Date;
  /** HTTP status of our endpoint's answer; null when it could not be reached or no endpoint is set. */
  responseStatus: number | null;
  error: string | null;
}

const DELIVERY_TIMEOUT_MS = 10_000;

/** Records an event with a frozen copy of the object as it is now (later changes must not show in it). */
export function recordEvent(state: ProviderState, type: FakeEventType, object: unknown, previousAttributes?: Record<string, unknown>): FakeEvent {
  const event: FakeEvent = {
    id: newObjectId('evt'),
    object: 'event',
    api_version: Stripe.API_VERSION,
    created: unixSeconds(),
    data: previousAttributes ? { object: structuredClone(object), previous_attributes: structuredClone(previousAttributes) } : { object: structuredClone(object) },
    livemode: false,
    pending_webhooks: state.webhook.url ? 1 : 0,
    request: { id: null, idempotency_key: null },
    type,
  };
  state.events.push(event);
  return event;
}

/** Sends one event, signed, to the configured endpoint; one attempt, recorded in `state.deliveries`. */
export async function deliverEvent(state: ProviderState, event: FakeEvent): Promise<WebhookDelivery> {
  const url = state.webhook.url;
  const delivery: WebhookDelivery = { eventId: event.id, type: event.type, url, attemptedAt: new Date(), responseStatus: null, error: null };
  state.deliveries.push(delivery);
  if (!url) {
    delivery.error = 'no webhook endpoint is configured';
    return delivery;
  }
  // The provider sends pretty-printed JSON; receivers must verify these exact bytes, not a re-serialisation.
  const payload = JSON.stringify(event, null, 2);
  try {
    const response = await fetch(url, {
      method: 'POST',
      headers: {
        'Content-Type': 'application/json; charset=utf-8',
        [SIGNATURE_HEADER]: signatureHeader(payload, state.webhook.secret, unixSeconds()),
      },
      body: payload,
      signal: AbortSignal.timeout(DELIVERY_TIMEOUT_MS),
    });
    delivery.responseStatus = response.status;
    await response.body?.cancel();
    if (!response.ok) delivery.error = `the endpoint answered ${response.status}`;
  } catch (error) {
    delivery.error = error instanceof Error ? error.message : String(error);
  }
  return delivery;
}

/** In order, each awaited, so the endpoint has seen every event before the browser is redirected. */
export async function deliverEvents(state: ProviderState, events: readonly FakeEvent[]): Promise<WebhookDelivery[]> {
  const deliveries: WebhookDelivery[] = [];
  for (const event of events) deliveries.push(await deliverEvent(state, event));
  return deliveries;
}
