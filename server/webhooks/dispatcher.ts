import type { AppDeps } from '@server/deps';
import { newId } from '@server/lib/ids';
import {
  claimDueDeliveries,
  countAttempts,
  insertAttempt,
  loadClaimedDelivery,
  updateDelivery,
} from '@server/modules/webhook-endpoints/webhook-deliveries.repo';
import { updateEndpoint } from '@server/modules/webhook-endpoints/webhook-endpoints.repo';
import { signingSecrets } from '@server/modules/webhook-endpoints/webhook-secrets';
import { deliverOnce, type DeliveryAttempt } from './deliver-once';
import { DELIVERY_TIMEOUT_MS, nextDeliveryStep, type DeliveryOutcome } from './delivery-policy';
import { egressPolicyFor, type HostResolver } from './egress-guard';
import { signWebhook } from './signature';

export interface DispatcherOptions {
  /** Pause between polls when nothing was due, ms (default 1000). */
  pollIntervalMs?: number;
  /** Deliveries claimed and sent concurrently per round (default 10). */
  batchSize?: number;
  /** Replaceable for tests: DNS, randomness of the back-off jitter, attempt timeout. */
  resolveHost?: HostResolver;
  random?: () => number;
  timeoutMs?: number;
}

/** How long a claimed delivery stays ours: longer than one attempt may take, so no one else sends it meanwhile. */
const claimLeaseMs = (timeoutMs: number) => timeoutMs * 2 + 30_000;
/** A delivery whose endpoint is paused is looked at again this much later (re-enabling brings it forward). */
const PAUSED_RECHECK_MS = 3600_000;

function outcomeLabel(outcome: DeliveryOutcome): string {
  return outcome.kind === 'retry' ? `retry:${outcome.reason}` : outcome.kind;
}

async function sendClaimed(deps: AppDeps, deliveryId: string, options: DispatcherOptions): Promise<void> {
  const loaded = await loadClaimedDelivery(deps.db, deliveryId);
  if (!loaded || loaded.delivery.status !== 'pending') return;
  const { delivery, event, endpoint } = loaded;
  const orgId = delivery.organisationId;
  const now = deps.clock.now();
  if (!endpoint.enabled) {
    await updateDelivery(deps.db, orgId, delivery.id, { nextAttemptAt: new Date(now.getTime() + PAUSED_RECHECK_MS), lockedUntil: null });
    return;
  }
  const headers = signWebhook({
    messageId: event.id,
    timestampSeconds: Math.floor(now.getTime() / 1000),
    body: event.body,
    secrets: signingSecrets(deps, endpoint, now),
  });
  const attempt: DeliveryAttempt = await deliverOnce({
    url: endpoint.url,
    headers: { ...headers },
    body: event.body,
    policy: egressPolicyFor(deps.config.nodeEnv),
    resolveHost: options.resolveHost,
    timeoutMs: options.timeoutMs ?? DELIVERY_TIMEOUT_MS,
    now: () => deps.clock.now(),
  });
  const attemptsMade = delivery.attempts + 1;
  const finishedAt = deps.clock.now();
  const step = nextDeliveryStep({ outcome: attempt.outcome, attemptsMade, now: finishedAt, random: options.random });
  const attemptNumber = (await countAttempts(deps.db, orgId, delivery.id)) + 1;
  await insertAttempt(deps.db, orgId, {
    id: newId('webhookAttempt'),
    deliveryId: delivery.id,
    attemptNumber,
    outcome: outcomeLabel(attempt.outcome),
    responseStatus: attempt.statusCode,
    responseExcerpt: attempt.responseExcerpt.slice(0, 1024),
    error: attempt.error,
    durationMs: attempt.durationMs,
    attemptedAt: attempt.attemptedAt,
  });
  const base = {
    attempts: attemptsMade,
    lastAttemptAt: attempt.attemptedAt,
    lastResponseStatus: attempt.statusCode,
    lastResponseExcerpt: attempt.responseExcerpt.slice(0, 1024),
    lastError: attempt.error ? `${attempt.error.code}: ${attempt.error.message}`.slice(0, 500) : null,
    lockedUntil: null,
    updatedAt: finishedAt,
  };
  switch (step.action) {
    case 'done':
      await updateDelivery(deps.db, orgId, delivery.id, { ...base, status: 'succeeded', nextAttemptAt: null });
      break;
    case 'retry':
      await updateDelivery(deps.db, orgId, delivery.id, { ...base, status: 'pending', nextAttemptAt: step.notBefore });
      break;
    case 'give_up':
      await updateDelivery(deps.db, orgId, delivery.id, { ...base, status: 'failed', nextAttemptAt: null });
      break;
    case 'disable_endpoint':
      // 410 Gone: the receiver wants no more events (Standard Webhooks v1.0.0).
      await updateDelivery(deps.db, orgId, delivery.id, { ...base, status: 'failed', nextAttemptAt: null });
      await updateEndpoint(deps.db, orgId, endpoint.id, { enabled: false, disabledReason: 'gone', updatedAt: finishedAt });
      break;
  }
}

/** One round: claim what is due (FOR UPDATE SKIP LOCKED, so several processes share the work) and send it. */
export async function dispatchDueDeliveries(deps: AppDeps, options: DispatcherOptions = {}): Promise<number> {
  const now = deps.clock.now();
  const timeoutMs = options.timeoutMs ?? DELIVERY_TIMEOUT_MS;
  const ids = await claimDueDeliveries(deps.db, now, new Date(now.getTime() + claimLeaseMs(timeoutMs)), options.batchSize ?? 10);
  await Promise.all(
    ids.map((id) =>
      sendClaimed(deps, id, options).catch((error: unknown) => deps.logger.error({ err: error, deliveryId: id }, 'webhook delivery failed')),
    ),
  );
  return ids.length;
}

export interface WebhookDispatcher {
  /** Runs a round now (tests), waiting for any round in progress first. */
  runOnce(): Promise<number>;
  /** Stops polling and waits for the round in progress. */
  stop(): Promise<void>;
}

/** The delivery loop: polls for due deliveries until stopped. */
export function startWebhookDispatcher(deps: AppDeps, options: DispatcherOptions = {}): WebhookDispatcher {
  const pollIntervalMs = options.pollIntervalMs ?? 1000;
  let stopped = false;
  let timer: NodeJS.Timeout | null = null;
  let current: Promise<number> = Promise.resolve(0);

  const round = (): Promise<number> => {
    current = current
      .catch(() => 0)
      .then(() => dispatchDueDeliveries(deps, options))
      .catch((error: unknown) => {
        deps.logger.error({ err: error }, 'webhook dispatcher round failed');
        return 0;
      });
    return current;
  };
  const schedule = (delayMs: number) => {
    if (stopped) return;
    timer = setTimeout(async () => {
      const sent = await round();
      // A full batch means more may be waiting: go again at once.
      schedule(sent >= (options.batchSize ?? 10) ? 0 : pollIntervalMs);
    }, delayMs);
    timer.unref();
  };
  schedule(0);

  return {
    runOnce: round,
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      await current.catch(() => 0);
    },
  };
}
