import { newObjectId, unixSeconds } from '../ids';

const CHECKOUT_LIFETIME_SECONDS = 24 * 60 * 60;

export interface FakeCheckoutLineItem {
  price: string;
  quantity: number;
}

export interface FakeCheckoutSession {
  id: string;
  object: 'checkout.session';
  after_expiration: null;
  allow_promotion_codes: null;
  amount_subtotal: number;
  amount_total: number;
  automatic_tax: { enabled: false; liability: null; status: null };
  billing_address_collection: null;
  cancel_url: string | null;
  client_reference_id: string | null;
  client_secret: null;
  created: number;
  currency: string;
  customer: string | null;
  customer_creation: 'always' | null;
  customer_details: { email: string | null; name: string | null; address: null; phone: null; tax_exempt: 'none'; tax_ids: [] } | null;
  customer_email: string | null;
  expires_at: number;
  invoice: string | null;
  livemode: false;
  locale: null;
  metadata: Record<string, string>;
  mode: 'subscription';
  payment_intent: null;
  payment_method_types: string[];
  payment_status: 'paid' | 'unpaid' | 'no_payment_required';
  status: 'open' | 'complete' | 'expired';
  subscription: string | null;
  success_url: string;
  total_details: { amount_discount: number; amount_shipping: number; amount_tax: number };
  ui_mode: 'hosted';
  url: string | null;
  /** Kept beside the public shape (never sent): what the customer is buying and for which subscription. */
  _lineItems: FakeCheckoutLineItem[];
  _subscriptionMetadata: Record<string, string>;
}

export interface CheckoutSessionFields {
  baseUrl: string;
  customer: string | null;
  customerEmail: string | null;
  clientReferenceId: string | null;
  successUrl: string;
  cancelUrl: string | null;
  lineItems: FakeCheckoutLineItem[];
  amountTotal: number;
  currency: string;
  metadata: Record<string, string>;
  subscriptionMetadata: Record<string, string>;
}

export function buildCheckoutSession(fields: CheckoutSessionFields): FakeCheckoutSession {
  const id = newObjectId('cs_test');
  const created = unixSeconds();
  return {
    id,
    object: 'checkout.session',
    after_expiration: null,
    allow_promotion_codes: null,
    amount_subtotal: fields.amountTotal,
    amount_total: fields.amountTotal,
    automatic_tax: { enabled: false, liability: null, status: null },
    billing_address_collection: null,
    cancel_url: fields.cancelUrl,
    client_reference_id: fields.clientReferenceId,
    client_secret: null,
    created,
    currency: fields.currency,
    customer: fields.customer,
    customer_creation: fields.customer ? null : 'always',
    customer_details: null,
    customer_email: fields.customerEmail,
    expires_at: created + CHECKOUT_LIFETIME_SECONDS,
    invoice: null,
    livemode: false,
    locale: null,
    metadata: fields.metadata,
    mode: 'subscription',
    payment_intent: null,
    payment_method_types: ['card'],
    payment_status: 'unpaid',
    status: 'open',
    subscription: null,
    success_url: fields.successUrl,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: 'hosted',
    url: `${fields.baseUrl}/checkout/${id}`,
    _lineItems: fields.lineItems,
    _subscriptionMetadata: fields.subscriptionMetadata,
  };
}

/** The session as the API returns it: without the fake's private fields. */
export function publicCheckoutSession(session: FakeCheckoutSession): Omit<FakeCheckoutSession, '_lineItems' | '_subscriptionMetadata'> {
  const { _lineItems: _ignoredLines, _subscriptionMetadata: _ignoredMetadata, ...visible } = session;
  return visible;
}

const PORTAL_LIFETIME_SECONDS = 60 * 60;

export interface FakePortalSession {
  id: string;
  object: 'billing_portal.session';
  configuration: string;
  created: number;
  customer: string;
  flow: null;
  livemode: false;
  locale: null;
  on_behalf_of: null;
  return_url: string | null;
  url: string;
  _expiresAt: number;
}

export function buildPortalSession(baseUrl: string, customer: string, returnUrl: string | null): FakePortalSession {
  const id = newObjectId('bps');
  const created = unixSeconds();
  return {
    id,
    object: 'billing_portal.session',
    configuration: 'bpc_local_fake',
    created,
    customer,
    flow: null,
    livemode: false,
    locale: null,
    on_behalf_of: null,
    return_url: returnUrl,
    url: `${baseUrl}/portal/${id}`,
    _expiresAt: created + PORTAL_LIFETIME_SECONDS,
  };
}

export function publicPortalSession(session: FakePortalSession): Omit<FakePortalSession, '_expiresAt'> {
  const { _expiresAt: _ignored, ...visible } = session;
  return visible;
}
