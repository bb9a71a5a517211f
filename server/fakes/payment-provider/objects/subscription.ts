import { addOneMonthSeconds, newObjectId, unixSeconds } from '../ids';
import type { FakePrice } from './catalogue';
import type { ListObject } from './list';

export interface FakeSubscriptionItem {
  id: string;
  object: 'subscription_item';
  created: number;
  current_period_start: number;
  current_period_end: number;
  discounts: string[];
  metadata: Record<string, string>;
  price: FakePrice;
  quantity: number;
  subscription: string;
  tax_rates: [];
}

export type FakeSubscriptionStatus = 'active' | 'canceled' | 'past_due' | 'unpaid' | 'incomplete' | 'incomplete_expired' | 'trialing';

export interface FakeSubscription {
  id: string;
  object: 'subscription';
  application: null;
  billing_cycle_anchor: number;
  cancel_at: number | null;
  cancel_at_period_end: boolean;
  canceled_at: number | null;
  cancellation_details: { comment: string | null; feedback: string | null; reason: string | null };
  collection_method: 'charge_automatically';
  created: number;
  currency: string;
  customer: string;
  default_payment_method: string | null;
  description: string | null;
  discounts: string[];
  ended_at: number | null;
  items: ListObject<FakeSubscriptionItem> & { total_count: number };
  latest_invoice: string | null;
  livemode: false;
  metadata: Record<string, string>;
  start_date: number;
  status: FakeSubscriptionStatus;
  trial_end: null;
  trial_start: null;
}

export interface SubscriptionLine {
  price: FakePrice;
  quantity: number;
}

export function buildSubscriptionItem(subscriptionId: string, line: SubscriptionLine, periodStart: number): FakeSubscriptionItem {
  return {
    id: newObjectId('si'),
    object: 'subscription_item',
    created: periodStart,
    current_period_start: periodStart,
    current_period_end: addOneMonthSeconds(periodStart),
    discounts: [],
    metadata: {},
    price: line.price,
    quantity: line.quantity,
    subscription: subscriptionId,
    tax_rates: [],
  };
}

export function buildSubscription(customerId: string, lines: readonly SubscriptionLine[], metadata: Record<string, string>): FakeSubscription {
  const id = newObjectId('sub');
  const now = unixSeconds();
  const items = lines.map((line) => buildSubscriptionItem(id, line, now));
  return {
    id,
    object: 'subscription',
    application: null,
    billing_cycle_anchor: now,
    cancel_at: null,
    cancel_at_period_end: false,
    canceled_at: null,
    cancellation_details: { comment: null, feedback: null, reason: null },
    collection_method: 'charge_automatically',
    created: now,
    currency: lines[0]?.price.currency ?? 'eur',
    customer: customerId,
    default_payment_method: newObjectId('pm'),
    description: null,
    discounts: [],
    ended_at: null,
    items: { object: 'list', data: items, has_more: false, total_count: items.length, url: `/v1/subscription_items?subscription=${id}` },
    latest_invoice: null,
    livemode: false,
    metadata,
    start_date: now,
    status: 'active',
    trial_end: null,
    trial_start: null,
  };
}
