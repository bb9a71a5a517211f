import type Stripe from 'stripe';
import { callProvider } from './provider-errors';

export interface OpenPortalInput {
  customerId: string;
  /** Where the portal's "return" link and every finished change lead back to. */
  returnUrl: string;
}

/** A short-lived link to the provider's billing portal, where the plan is changed or cancelled. */
export async function openPortal(stripe: Stripe, input: OpenPortalInput): Promise<{ url: string }> {
  const session = await callProvider('opening the billing portal', () =>
    stripe.billingPortal.sessions.create({ customer: input.customerId, return_url: input.returnUrl }),
  );
  return { url: session.url };
}
