import type Stripe from 'stripe';
import { createBillingClient } from './billing-client';
import type { BillingConfig } from './billing-config';
import type { BillingStore } from './billing-store';
import { startCheckout, type StartCheckoutInput, type StartedCheckout } from './checkout';
import { listInvoices, type InvoiceSummary } from './invoices';
import { openPortal, type OpenPortalInput } from './portal';
import { handleProviderWebhook, verifyProviderWebhook, type HandledWebhook } from './provider-webhooks';

/** The billing use cases our API calls, bound to one provider client, signing secret and store. */
export interface BillingService {
  readonly stripe: Stripe;
  startCheckout(input: StartCheckoutInput): Promise<StartedCheckout>;
  openPortal(input: OpenPortalInput): Promise<{ url: string }>;
  listInvoices(customerId: string, options?: { limit?: number }): Promise<InvoiceSummary[]>;
  verifyProviderWebhook(rawBody: string | Buffer, signatureHeader: string | string[] | undefined): Stripe.Event;
  handleProviderWebhook(rawBody: string | Buffer, signatureHeader: string | string[] | undefined): Promise<HandledWebhook>;
}

export function createBillingService(config: BillingConfig, store: BillingStore): BillingService {
  const stripe = createBillingClient(config);
  return {
    stripe,
    startCheckout: (input) => startCheckout(stripe, input),
    openPortal: (input) => openPortal(stripe, input),
    listInvoices: (customerId, options) => listInvoices(stripe, customerId, options),
    verifyProviderWebhook: (rawBody, signatureHeader) => verifyProviderWebhook(stripe, config.webhookSecret, rawBody, signatureHeader),
    handleProviderWebhook: (rawBody, signatureHeader) => handleProviderWebhook(stripe, config.webhookSecret, store, rawBody, signatureHeader),
  };
}
