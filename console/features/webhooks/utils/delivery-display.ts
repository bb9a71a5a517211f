import type { BadgeTone } from '@console/components/ui/badge';
import type { WebhookDelivery, WebhookEndpoint } from '@shared/schemas/webhooks';

type Shown = { label: string; tone: BadgeTone };

/** A delivery's state in words; "Retrying" once an attempt failed and another is scheduled. */
export function deliveryStatus(delivery: Pick<WebhookDelivery, 'status' | 'attempts'>): Shown {
  if (delivery.status === 'succeeded') return { label: 'Delivered', tone: 'ok' };
  if (delivery.status === 'failed') return { label: 'Failed', tone: 'danger' };
  return delivery.attempts > 0 ? { label: 'Retrying', tone: 'warning' } : { label: 'Pending', tone: 'neutral' };
}

/** An endpoint's state: enabled, paused by a person, or switched off by the service after a 410 Gone. */
export function endpointStatus(endpoint: Pick<WebhookEndpoint, 'enabled' | 'disabledReason'>): Shown {
  if (endpoint.enabled) return { label: 'Enabled', tone: 'ok' };
  if (endpoint.disabledReason === 'gone') return { label: 'Disabled after 410', tone: 'danger' };
  return { label: 'Paused', tone: 'neutral' };
}

const retryReasons: Record<string, string> = {
  server_error: 'server error',
  client_error: 'refused by the receiver',
  timeout: 'no answer in time',
  network_error: 'receiver unreachable',
  redirect: 'redirect not followed',
  rate_limited: 'receiver asked to slow down',
  unexpected_status: 'unexpected status',
  egress_refused: 'address not allowed',
};

/** The stored outcome codes (succeeded, disable_endpoint, retry:<reason>) as words for the attempt log. */
export function attemptOutcomeText(outcome: string): string {
  if (outcome === 'succeeded') return 'Delivered';
  if (outcome === 'disable_endpoint') return 'Receiver answered 410 Gone: endpoint disabled';
  if (outcome.startsWith('retry:')) {
    const reason = outcome.slice('retry:'.length);
    return `Failed, will retry (${retryReasons[reason] ?? reason.replace(/_/g, ' ')})`;
  }
  return outcome.replace(/_/g, ' ');
}

/** What the response-code column shows: the HTTP status, or why there is none. */
export function responseCodeText(delivery: Pick<WebhookDelivery, 'attempts' | 'lastResponseStatus'>): string {
  if (delivery.lastResponseStatus !== null) return String(delivery.lastResponseStatus);
  return delivery.attempts === 0 ? 'Not sent yet' : 'No answer';
}

const PENDING_POLL_MS = 3000;
const IDLE_POLL_MS = 15_000;

/** Polls briskly while a delivery is on its way, slowly otherwise (new events arrive without a reload). */
export function deliveriesPollIntervalMs(statuses: readonly WebhookDelivery['status'][]): number {
  return statuses.includes('pending') ? PENDING_POLL_MS : IDLE_POLL_MS;
}
