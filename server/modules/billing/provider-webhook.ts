import type { Request } from 'express';
import type { ProviderWebhookAck } from '@shared/schemas/billing';
import type { AppDeps } from '@server/deps';
import { asProblem, requireBilling } from './billing-problem';

/** The provider's signature header (its SDK verifies it over the raw bytes). */
export const PROVIDER_SIGNATURE_HEADER = 'stripe-signature';

/** The exact bytes received; express.raw runs before the JSON parser on this path (server/app.ts). */
function rawBodyOf(req: Request): Buffer {
  return Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
}

/**
 * Verifies one provider delivery and applies the plan it implies. The subscription is re-read from the provider
 * and its whole state written, so a repeated, late or out-of-order delivery leaves the same result: replays are
 * harmless and need no event log. A bad signature is 400 (the provider shows it as failed); a provider or
 * database failure is 5xx, which the provider retries.
 */
export async function receiveProviderWebhook(deps: AppDeps, req: Request): Promise<ProviderWebhookAck> {
  const billing = requireBilling(deps);
  const handled = await asProblem(() => billing.handleProviderWebhook(rawBodyOf(req), req.headers[PROVIDER_SIGNATURE_HEADER]));
  if (handled.outcome === 'applied') {
    const { change } = handled;
    deps.logger.info(
      { eventId: handled.event.id, type: handled.event.type, organisationId: change.organisationId, planId: change.planId, status: change.subscriptionStatus },
      'provider event applied',
    );
  } else {
    deps.logger.info({ eventId: handled.event.id, type: handled.event.type, reason: handled.reason }, 'provider event ignored');
  }
  return { received: true, outcome: handled.outcome, eventId: handled.event.id };
}
