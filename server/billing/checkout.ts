import type Stripe from 'stripe';
import { BillingError } from './billing-error';
import { ORGANISATION_ID_METADATA_KEY } from './plan-from-subscription';
import { isPaidPlanId, PLANS, type PlanId } from './plans';
import { callProvider } from './provider-errors';

export interface StartCheckoutInput {
  organisationId: string;
  /** The organisation's customer at the provider; created (and returned) when absent. */
  customerId?: string | null;
  /** Used only when a customer is created. */
  organisationName?: string;
  billingEmail?: string;
  planId: PlanId;
  /** Where the provider sends the browser after payment; `{CHECKOUT_SESSION_ID}` is filled in by the provider. */
  successUrl: string;
  cancelUrl: string;
}

export interface StartedCheckout {
  url: string;
  sessionId: string;
  /** Store it with the organisation when it differs from the one passed in (it was just created). */
  customerId: string;
}

/** Looks a plan's monthly price up by its lookup key, so no price ids need configuring. */
export async function priceIdForPlan(stripe: Stripe, planId: PlanId): Promise<string> {
  const lookupKey = PLANS[planId].priceLookupKey;
  const prices = await callProvider('the plan price lookup', () => stripe.prices.list({ lookup_keys: [lookupKey], active: true, limit: 1 }));
  const price = prices.data[0];
  if (!price) {
    throw new BillingError('plan_price_missing', `The payment provider has no active price with lookup key "${lookupKey}".`, { status: 502 });
  }
  return price.id;
}

/**
 * Opens a hosted checkout for a first paid subscription. An organisation that already pays changes plan
 * in the portal instead, so it never ends up with two subscriptions.
 */
export async function startCheckout(stripe: Stripe, input: StartCheckoutInput): Promise<StartedCheckout> {
  if (!isPaidPlanId(input.planId)) {
    throw new BillingError('plan_not_purchasable', `The ${PLANS[input.planId]?.name ?? input.planId} plan is free and needs no checkout.`, { status: 422 });
  }
  // The plan id on the session is for support only; the plan itself always follows the subscription's price.
  const metadata = { [ORGANISATION_ID_METADATA_KEY]: input.organisationId, plan_id: input.planId };
  const customerId = (input.customerId && (await existingCustomerWithoutSubscription(stripe, input.customerId))) || (await createCustomer(stripe, input));

  const price = await priceIdForPlan(stripe, input.planId);
  const session = await callProvider('creating the checkout session', () =>
    stripe.checkout.sessions.create({
      mode: 'subscription',
      customer: customerId,
      client_reference_id: input.organisationId,
      line_items: [{ price, quantity: 1 }],
      success_url: input.successUrl,
      cancel_url: input.cancelUrl,
      metadata,
      subscription_data: { metadata: { [ORGANISATION_ID_METADATA_KEY]: input.organisationId } },
    }),
  );
  if (!session.url) {
    throw new BillingError('payment_provider_error', 'The payment provider returned a checkout session without a URL.', { status: 502 });
  }
  return { url: session.url, sessionId: session.id, customerId };
}

/**
 * The stored customer, unless it already pays (then the portal is the way) or the provider no longer knows it
 * (deleted there, or a local fake restarted without its state): then null, and a new customer is made.
 */
async function existingCustomerWithoutSubscription(stripe: Stripe, customerId: string): Promise<string | null> {
  try {
    const current = await callProvider('listing subscriptions', () => stripe.subscriptions.list({ customer: customerId, status: 'active', limit: 1 }));
    if (current.data.length > 0) {
      throw new BillingError('subscription_exists', 'This organisation already has a paid plan; change it in the billing portal.', { status: 409 });
    }
    return customerId;
  } catch (error) {
    if (error instanceof BillingError && error.code === 'billing_object_missing') return null;
    throw error;
  }
}

async function createCustomer(stripe: Stripe, input: StartCheckoutInput): Promise<string> {
  const customer = await callProvider('creating the customer', () =>
    stripe.customers.create({
      name: input.organisationName,
      email: input.billingEmail,
      metadata: { [ORGANISATION_ID_METADATA_KEY]: input.organisationId },
    }),
  );
  return customer.id;
}
