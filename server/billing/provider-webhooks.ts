import Stripe from 'stripe';
import { BillingError } from './billing-error';
import type { BillingStore, PlanChange } from './billing-store';
import { currentPeriodEnd, customerIdOf, ORGANISATION_ID_METADATA_KEY, planFromSubscription } from './plan-from-subscription';
import { callProvider } from './provider-errors';

/** The provider events that can change an organisation's plan. Others are acknowledged and ignored. */
export const PLAN_EVENT_TYPES = [
  'checkout.session.completed',
  'customer.subscription.created',
  'customer.subscription.updated',
  'customer.subscription.deleted',
  'invoice.paid',
] as const;

/** Refuse deliveries signed more than this long ago (replayed or badly delayed). */
export const WEBHOOK_TOLERANCE_SECONDS = 300;

/**
 * Checks the provider's signature over the exact raw body (never a re-serialised JSON object) with the SDK
 * and returns the typed event.
 */
export function verifyProviderWebhook(
  stripe: Stripe,
  webhookSecret: string,
  rawBody: string | Buffer,
  signatureHeader: string | string[] | undefined,
): Stripe.Event {
  if (typeof signatureHeader !== 'string' || signatureHeader === '') {
    throw new BillingError('webhook_signature_missing', 'The provider webhook carries no Stripe-Signature header.', { status: 400 });
  }
  try {
    return stripe.webhooks.constructEvent(rawBody, signatureHeader, webhookSecret, WEBHOOK_TOLERANCE_SECONDS);
  } catch (cause) {
    if (cause instanceof Stripe.errors.StripeSignatureVerificationError) {
      throw new BillingError('webhook_signature_invalid', `The provider webhook signature does not verify: ${cause.message}`, { status: 400, cause });
    }
    throw new BillingError('webhook_payload_invalid', 'The provider webhook body is not a valid event.', { status: 400, cause });
  }
}

/** The subscription an event is about, for the event types that can change a plan. */
export function subscriptionIdOfEvent(event: Stripe.Event): string | null {
  const idOf = (value: string | { id: string } | null | undefined) => (value == null ? null : typeof value === 'string' ? value : value.id);
  switch (event.type) {
    case 'checkout.session.completed':
      return event.data.object.mode === 'subscription' ? idOf(event.data.object.subscription) : null;
    case 'customer.subscription.created':
    case 'customer.subscription.updated':
    case 'customer.subscription.deleted':
      return event.data.object.id;
    case 'invoice.paid':
      return idOf(event.data.object.parent?.subscription_details?.subscription);
    default:
      return null;
  }
}

export type HandledWebhook =
  | { outcome: 'applied'; event: Stripe.Event; change: PlanChange }
  | { outcome: 'ignored'; event: Stripe.Event; reason: string };

/**
 * Verifies a delivery and applies the plan it implies. The subscription is fetched fresh rather than read
 * from the event, because deliveries can arrive late, twice or out of order.
 */
export async function handleProviderWebhook(
  stripe: Stripe,
  webhookSecret: string,
  store: BillingStore,
  rawBody: string | Buffer,
  signatureHeader: string | string[] | undefined,
): Promise<HandledWebhook> {
  const event = verifyProviderWebhook(stripe, webhookSecret, rawBody, signatureHeader);
  if (!(PLAN_EVENT_TYPES as readonly string[]).includes(event.type)) {
    return { outcome: 'ignored', event, reason: `event type ${event.type} does not change plans` };
  }
  const subscriptionId = subscriptionIdOfEvent(event);
  if (!subscriptionId) return { outcome: 'ignored', event, reason: 'the event names no subscription' };

  const subscription = await callProvider('reading the subscription', () => stripe.subscriptions.retrieve(subscriptionId));
  const customerId = customerIdOf(subscription);
  const organisationId =
    subscription.metadata[ORGANISATION_ID_METADATA_KEY] || (await store.findOrganisationIdByCustomerId(customerId));
  if (!organisationId) return { outcome: 'ignored', event, reason: `no organisation is linked to customer ${customerId}` };

  const change: PlanChange = {
    organisationId,
    customerId,
    subscriptionId: subscription.status === 'canceled' ? null : subscription.id,
    planId: planFromSubscription(subscription),
    subscriptionStatus: subscription.status,
    currentPeriodEndsAt: subscription.status === 'canceled' ? null : currentPeriodEnd(subscription),
    providerEventId: event.id,
  };
  await store.applyPlanChange(change);
  return { outcome: 'applied', event, change };
}
