import { unixSeconds } from './ids';
import { buildCustomer } from './objects/customer';
import { buildPaidInvoice } from './objects/invoice';
import { publicCheckoutSession, type FakeCheckoutSession } from './objects/sessions';
import { buildSubscription, type FakeSubscription, type SubscriptionLine } from './objects/subscription';
import type { FakePrice } from './objects/catalogue';
import { productNameOf, type ProviderState } from './state';
import { recordEvent, type FakeEvent } from './webhooks/events';

export class FlowError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
    this.name = 'FlowError';
  }
}

export function isCheckoutExpired(session: FakeCheckoutSession): boolean {
  return session.status === 'expired' || (session.status === 'open' && unixSeconds() > session.expires_at);
}

/**
 * What happens when the customer confirms the hosted checkout: the subscription starts, its first invoice is
 * charged, the session completes. Returns the events in the order the provider emits them.
 */
export function completeCheckout(state: ProviderState, session: FakeCheckoutSession): FakeEvent[] {
  if (session.status === 'complete') return [];
  if (isCheckoutExpired(session)) {
    session.status = 'expired';
    throw new FlowError(410, 'This checkout has expired.');
  }
  const customer = session.customer
    ? state.customers.get(session.customer)
    : buildCustomer({ email: session.customer_email, metadata: {} });
  if (!customer) throw new FlowError(409, 'The customer of this checkout no longer exists.');
  state.customers.set(customer.id, customer);

  const lines: SubscriptionLine[] = session._lineItems.map((line) => {
    const price = state.prices.get(line.price);
    if (!price) throw new FlowError(409, `The price ${line.price} no longer exists.`);
    return { price, quantity: line.quantity };
  });
  const subscription = buildSubscription(customer.id, lines, { ...session._subscriptionMetadata });
  const invoice = buildPaidInvoice({
    customer,
    subscription,
    billingReason: 'subscription_create',
    baseUrl: state.baseUrl,
    productNameOf: (productId) => productNameOf(state, productId),
  });
  subscription.latest_invoice = invoice.id;
  state.subscriptions.set(subscription.id, subscription);
  state.invoices.set(invoice.id, invoice);

  Object.assign(session, {
    status: 'complete',
    payment_status: 'paid',
    customer: customer.id,
    customer_details: { email: customer.email, name: customer.name, address: null, phone: null, tax_exempt: 'none', tax_ids: [] },
    subscription: subscription.id,
    invoice: invoice.id,
    // A completed session can no longer be visited.
    url: null,
  } satisfies Partial<FakeCheckoutSession>);

  return [
    recordEvent(state, 'customer.subscription.created', subscription),
    recordEvent(state, 'invoice.paid', invoice),
    recordEvent(state, 'checkout.session.completed', publicCheckoutSession(session)),
  ];
}

/** Portal plan change: the item's price is swapped in place and the period kept (the difference is prorated onto the next invoice). */
export function changeSubscriptionPrice(state: ProviderState, subscription: FakeSubscription, price: FakePrice): FakeEvent[] {
  if (subscription.status === 'canceled') throw new FlowError(409, 'A canceled subscription cannot change plan.');
  const [item] = subscription.items.data;
  if (!item || item.price.id === price.id) return [];
  const previousItems = structuredClone(subscription.items);
  item.price = price;
  return [recordEvent(state, 'customer.subscription.updated', subscription, { items: previousItems })];
}

/** Portal cancellation, configured here to end the subscription at once rather than at period end. */
export function cancelSubscriptionNow(state: ProviderState, subscription: FakeSubscription): FakeEvent[] {
  if (subscription.status === 'canceled') return [];
  const now = unixSeconds();
  Object.assign(subscription, {
    status: 'canceled',
    canceled_at: now,
    ended_at: now,
    cancellation_details: { comment: null, feedback: null, reason: 'cancellation_requested' },
  } satisfies Partial<FakeSubscription>);
  return [recordEvent(state, 'customer.subscription.deleted', subscription)];
}
