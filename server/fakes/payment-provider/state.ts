import { buildProductAndPrice, type CatalogueEntry, type FakePrice, type FakeProduct } from './objects/catalogue';
import type { FakeCustomer } from './objects/customer';
import type { FakeInvoice } from './objects/invoice';
import type { FakeCheckoutSession, FakePortalSession } from './objects/sessions';
import type { FakeSubscription } from './objects/subscription';
import type { FakeEvent, WebhookDelivery } from './webhooks/events';

export interface StoredResponse {
  fingerprint: string;
  status: number;
  body: unknown;
}

/** Everything the fake provider knows, in memory; tests may read it directly. */
export interface ProviderState {
  /** Origin of the fake, e.g. http://127.0.0.1:41234 (set once it listens). */
  baseUrl: string;
  apiKey: string;
  webhook: { url: string | null; secret: string };
  products: Map<string, FakeProduct>;
  prices: Map<string, FakePrice>;
  customers: Map<string, FakeCustomer>;
  subscriptions: Map<string, FakeSubscription>;
  invoices: Map<string, FakeInvoice>;
  checkoutSessions: Map<string, FakeCheckoutSession>;
  portalSessions: Map<string, FakePortalSession>;
  events: FakeEvent[];
  deliveries: WebhookDelivery[];
  /** Responses to POSTs by Idempotency-Key, so a retried request is answered, not repeated. */
  idempotentResponses: Map<string, StoredResponse>;
}

export function createProviderState(options: { apiKey: string; webhookUrl: string | null; webhookSecret: string; catalogue: readonly CatalogueEntry[] }): ProviderState {
  const state: ProviderState = {
    baseUrl: '',
    apiKey: options.apiKey,
    webhook: { url: options.webhookUrl, secret: options.webhookSecret },
    products: new Map(),
    prices: new Map(),
    customers: new Map(),
    subscriptions: new Map(),
    invoices: new Map(),
    checkoutSessions: new Map(),
    portalSessions: new Map(),
    events: [],
    deliveries: [],
    idempotentResponses: new Map(),
  };
  for (const entry of options.catalogue) {
    const { product, price } = buildProductAndPrice(entry);
    state.products.set(product.id, product);
    state.prices.set(price.id, price);
  }
  return state;
}

export function productNameOf(state: ProviderState, productId: string): string {
  return state.products.get(productId)?.name ?? productId;
}
