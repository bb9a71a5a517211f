import type Stripe from 'stripe';
import { PLANS, planByPriceLookupKey, type PlanId } from './plans';
import { callProvider } from './provider-errors';

/** An invoice as the console lists it. Amounts in minor units (cents) of `currency`. */
export interface InvoiceSummary {
  id: string;
  number: string | null;
  status: string | null;
  currency: string;
  amountDueMinor: number;
  amountPaidMinor: number;
  /** The period the invoice pays for (from its lines; the invoice's own period is when items were added). */
  periodStart: Date;
  periodEnd: Date;
  createdAt: Date;
  /** The provider's page for the invoice (view, download); null when it has none. */
  hostedInvoiceUrl: string | null;
  /** Our plan, when a line of the invoice is one of our plan prices. */
  planId: PlanId | null;
}

const DEFAULT_INVOICE_COUNT = 24;
const MAX_INVOICE_COUNT = 100;

/** Newest first, as the provider lists them. */
export async function listInvoices(stripe: Stripe, customerId: string, options: { limit?: number } = {}): Promise<InvoiceSummary[]> {
  const limit = Math.min(Math.max(1, options.limit ?? DEFAULT_INVOICE_COUNT), MAX_INVOICE_COUNT);
  const [page, planOfPriceId] = await Promise.all([
    callProvider('listing invoices', () => stripe.invoices.list({ customer: customerId, limit })),
    planPriceIds(stripe),
  ]);
  return page.data.map((invoice) => toInvoiceSummary(invoice, planOfPriceId));
}

/** Price id → our plan, for every plan price the provider knows (their ids differ per provider account). */
export async function planPriceIds(stripe: Stripe): Promise<Map<string, PlanId>> {
  const lookupKeys = Object.values(PLANS).map((plan) => plan.priceLookupKey);
  const prices = await callProvider('listing plan prices', () => stripe.prices.list({ lookup_keys: lookupKeys, limit: lookupKeys.length }));
  const planOfPriceId = new Map<string, PlanId>();
  for (const price of prices.data) {
    const plan = planByPriceLookupKey(price.lookup_key);
    if (plan) planOfPriceId.set(price.id, plan.id);
  }
  return planOfPriceId;
}

function toInvoiceSummary(invoice: Stripe.Invoice, planOfPriceId: ReadonlyMap<string, PlanId>): InvoiceSummary {
  return {
    id: invoice.id,
    number: invoice.number,
    status: invoice.status,
    currency: invoice.currency,
    amountDueMinor: invoice.amount_due,
    amountPaidMinor: invoice.amount_paid,
    ...servicePeriod(invoice),
    createdAt: new Date(invoice.created * 1000),
    hostedInvoiceUrl: invoice.hosted_invoice_url ?? null,
    planId: planOfInvoice(invoice, planOfPriceId),
  };
}

function planOfInvoice(invoice: Stripe.Invoice, planOfPriceId: ReadonlyMap<string, PlanId>): PlanId | null {
  for (const line of invoice.lines.data) {
    const price = line.pricing?.price_details?.price;
    const priceId = typeof price === 'string' ? price : price?.id;
    const planId = priceId ? planOfPriceId.get(priceId) : undefined;
    if (planId) return planId;
  }
  return null;
}

function servicePeriod(invoice: Stripe.Invoice): { periodStart: Date; periodEnd: Date } {
  const periods = invoice.lines.data.map((line) => line.period);
  const startSeconds = periods.length > 0 ? Math.min(...periods.map((period) => period.start)) : invoice.period_start;
  const endSeconds = periods.length > 0 ? Math.max(...periods.map((period) => period.end)) : invoice.period_end;
  return { periodStart: new Date(startSeconds * 1000), periodEnd: new Date(endSeconds * 1000) };
}
