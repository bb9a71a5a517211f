import { newObjectId, unixSeconds } from '../ids';
import { formatMoney } from '../money';
import type { FakeCustomer } from './customer';
import type { ListObject } from './list';
import type { FakeSubscription } from './subscription';

export interface FakeInvoiceLine {
  id: string;
  object: 'line_item';
  amount: number;
  currency: string;
  description: string;
  discount_amounts: [];
  discountable: boolean;
  discounts: [];
  invoice: string;
  livemode: false;
  metadata: Record<string, string>;
  parent: {
    type: 'subscription_item_details';
    invoice_item_details: null;
    subscription_item_details: { invoice_item: null; proration: false; proration_details: { credited_items: null }; subscription: string; subscription_item: string };
  };
  period: { start: number; end: number };
  pretax_credit_amounts: [];
  pricing: { type: 'price_details'; price_details: { price: string; product: string }; unit_amount_decimal: string };
  quantity: number;
  subtotal: number;
  taxes: [];
}

export interface FakeInvoice {
  id: string;
  object: 'invoice';
  account_country: string | null;
  account_name: string | null;
  amount_due: number;
  amount_overpaid: number;
  amount_paid: number;
  amount_remaining: number;
  amount_shipping: number;
  attempt_count: number;
  attempted: boolean;
  billing_reason: 'subscription_create' | 'subscription_cycle' | 'subscription_update';
  collection_method: 'charge_automatically';
  created: number;
  currency: string;
  customer: string;
  customer_email: string | null;
  customer_name: string | null;
  description: string | null;
  hosted_invoice_url: string;
  invoice_pdf: null;
  lines: ListObject<FakeInvoiceLine> & { total_count: number };
  livemode: false;
  metadata: Record<string, string>;
  number: string;
  parent: {
    type: 'subscription_details';
    quote_details: null;
    subscription_details: { metadata: Record<string, string>; subscription: string };
  };
  period_end: number;
  period_start: number;
  status: 'draft' | 'open' | 'paid' | 'uncollectible' | 'void';
  status_transitions: { finalized_at: number | null; marked_uncollectible_at: null; paid_at: number | null; voided_at: null };
  subtotal: number;
  total: number;
}

/** A paid invoice for the subscription's current period, as after a successful automatic charge. */
export interface PaidInvoiceInput {
  customer: FakeCustomer;
  subscription: FakeSubscription;
  billingReason: FakeInvoice['billing_reason'];
  /** The fake's own origin, for the hosted invoice page. */
  baseUrl: string;
  productNameOf: (productId: string) => string;
}

export function buildPaidInvoice(input: PaidInvoiceInput): FakeInvoice {
  const { customer, subscription, billingReason, baseUrl, productNameOf } = input;
  const id = newObjectId('in');
  const now = unixSeconds();
  const lines: FakeInvoiceLine[] = subscription.items.data.map((item) => {
    const amount = item.price.unit_amount * item.quantity;
    return {
      id: newObjectId('il'),
      object: 'line_item',
      amount,
      currency: item.price.currency,
      description: `${item.quantity} × ${productNameOf(item.price.product)} (at ${formatMoney(item.price.unit_amount, item.price.currency)} / month)`,
      discount_amounts: [],
      discountable: true,
      discounts: [],
      invoice: id,
      livemode: false,
      metadata: {},
      parent: {
        type: 'subscription_item_details',
        invoice_item_details: null,
        subscription_item_details: {
          invoice_item: null,
          proration: false,
          proration_details: { credited_items: null },
          subscription: subscription.id,
          subscription_item: item.id,
        },
      },
      period: { start: item.current_period_start, end: item.current_period_end },
      pretax_credit_amounts: [],
      pricing: { type: 'price_details', price_details: { price: item.price.id, product: item.price.product }, unit_amount_decimal: item.price.unit_amount_decimal },
      quantity: item.quantity,
      subtotal: amount,
      taxes: [],
    };
  });
  const total = lines.reduce((sum, line) => sum + line.amount, 0);
  const sequence = customer.next_invoice_sequence++;
  return {
    id,
    object: 'invoice',
    account_country: null,
    account_name: 'Sweepline (local payment fake)',
    amount_due: total,
    amount_overpaid: 0,
    amount_paid: total,
    amount_remaining: 0,
    amount_shipping: 0,
    attempt_count: 1,
    attempted: true,
    billing_reason: billingReason,
    collection_method: 'charge_automatically',
    created: now,
    currency: subscription.currency,
    customer: customer.id,
    customer_email: customer.email,
    customer_name: customer.name,
    description: null,
    hosted_invoice_url: `${baseUrl}/invoices/${id}`,
    invoice_pdf: null,
    lines: { object: 'list', data: lines, has_more: false, total_count: lines.length, url: `/v1/invoices/${id}/lines` },
    livemode: false,
    metadata: {},
    number: `${customer.invoice_prefix}-${String(sequence).padStart(4, '0')}`,
    parent: { type: 'subscription_details', quote_details: null, subscription_details: { metadata: { ...subscription.metadata }, subscription: subscription.id } },
    // The provider stamps a subscription's first invoice with a zero-length period at creation; the service
    // period is on the lines.
    period_end: now,
    period_start: now,
    status: 'paid',
    status_transitions: { finalized_at: now, marked_uncollectible_at: null, paid_at: now, voided_at: null },
    subtotal: total,
    total,
  };
}
