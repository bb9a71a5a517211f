import type Stripe from 'stripe';
import { FREE_PLAN_ID, planByPriceLookupKey, type PlanId } from './plans';

// Statuses under which the customer keeps what they pay for; past_due is the provider's retry window.
const ENTITLED_STATUSES = new Set<Stripe.Subscription.Status>(['active', 'trialing', 'past_due']);

/** Metadata key set on every customer and subscription we create. */
export const ORGANISATION_ID_METADATA_KEY = 'organisation_id';

/**
 * Our plan for a provider subscription: the plan whose price lookup key the subscription's item carries,
 * while the subscription is in good standing; the free plan otherwise (canceled, unpaid, never paid).
 */
export function planFromSubscription(subscription: Stripe.Subscription): PlanId {
  if (!ENTITLED_STATUSES.has(subscription.status)) return FREE_PLAN_ID;
  for (const item of subscription.items.data) {
    const plan = planByPriceLookupKey(item.price.lookup_key);
    if (plan) return plan.id;
  }
  return FREE_PLAN_ID;
}

/** End of the current paid period, read from the subscription's items (where the provider keeps it). */
export function currentPeriodEnd(subscription: Stripe.Subscription): Date | null {
  const ends = subscription.items.data.map((item) => item.current_period_end).filter((end) => Number.isFinite(end));
  return ends.length > 0 ? new Date(Math.max(...ends) * 1000) : null;
}

export function customerIdOf(subscription: Stripe.Subscription): string {
  return typeof subscription.customer === 'string' ? subscription.customer : subscription.customer.id;
}
