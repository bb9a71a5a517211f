import { PLANS } from '@server/billing/plans';
import { newObjectId, unixSeconds } from '../ids';

export interface FakeProduct {
  id: string;
  object: 'product';
  active: boolean;
  created: number;
  updated: number;
  default_price: string | null;
  description: string | null;
  images: string[];
  livemode: false;
  marketing_features: { name: string }[];
  metadata: Record<string, string>;
  name: string;
  package_dimensions: null;
  shippable: null;
  tax_code: null;
  type: 'service';
  url: null;
}

export interface FakePrice {
  id: string;
  object: 'price';
  active: boolean;
  billing_scheme: 'per_unit';
  created: number;
  currency: string;
  custom_unit_amount: null;
  livemode: false;
  lookup_key: string | null;
  metadata: Record<string, string>;
  nickname: string | null;
  product: string;
  recurring: { interval: 'month'; interval_count: 1; meter: null; trial_period_days: null; usage_type: 'licensed' };
  tax_behavior: 'unspecified';
  tiers_mode: null;
  transform_quantity: null;
  type: 'recurring';
  unit_amount: number;
  unit_amount_decimal: string;
}

export interface CatalogueEntry {
  productName: string;
  description: string;
  lookupKey: string;
  unitAmountMinor: number;
  currency: string;
}

/** Our plans as a provider account would hold them: one product and one monthly price each. */
export function catalogueFromPlans(): CatalogueEntry[] {
  return Object.values(PLANS).map((plan) => ({
    productName: `Sweepline ${plan.name}`,
    description: plan.summary,
    lookupKey: plan.priceLookupKey,
    unitAmountMinor: plan.monthlyPriceMinor,
    currency: plan.currency,
  }));
}

export function buildProductAndPrice(entry: CatalogueEntry): { product: FakeProduct; price: FakePrice } {
  const created = unixSeconds();
  const productId = newObjectId('prod');
  const price: FakePrice = {
    id: newObjectId('price'),
    object: 'price',
    active: true,
    billing_scheme: 'per_unit',
    created,
    currency: entry.currency,
    custom_unit_amount: null,
    livemode: false,
    lookup_key: entry.lookupKey,
    metadata: {},
    nickname: `${entry.productName} monthly`,
    product: productId,
    recurring: { interval: 'month', interval_count: 1, meter: null, trial_period_days: null, usage_type: 'licensed' },
    tax_behavior: 'unspecified',
    tiers_mode: null,
    transform_quantity: null,
    type: 'recurring',
    unit_amount: entry.unitAmountMinor,
    unit_amount_decimal: String(entry.unitAmountMinor),
  };
  const product: FakeProduct = {
    id: productId,
    object: 'product',
    active: true,
    created,
    updated: created,
    default_price: price.id,
    description: entry.description,
    images: [],
    livemode: false,
    marketing_features: [],
    metadata: {},
    name: entry.productName,
    package_dimensions: null,
    shippable: null,
    tax_code: null,
    type: 'service',
    url: null,
  };
  return { product, price };
}
