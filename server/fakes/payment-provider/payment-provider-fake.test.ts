import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createBillingClient } from '@server/billing/billing-client';
import { PLANS } from '@server/billing/plans';
import { signatureHeader } from './webhooks/sign-payload';
import { startPaymentProviderFake, type PaymentProviderFake } from './start-payment-provider-fake';

const WEBHOOK_SECRET = 'whsec_fake_provider_test';
let fake: PaymentProviderFake;
let stripe: Stripe;

beforeAll(async () => {
  fake = await startPaymentProviderFake({ webhookSecret: WEBHOOK_SECRET, port: 0 });
  stripe = createBillingClient({ webhookSecret: WEBHOOK_SECRET, apiBaseUrl: fake.baseUrl });
});

afterAll(async () => {
  await fake.stop();
});

describe('payment provider fake, driven by the official SDK', () => {
  it('listens on loopback', () => {
    expect(fake.baseUrl).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
  });

  it('signs webhooks exactly as the SDK expects', () => {
    // The SDK's own test-header generator is the reference for the signature scheme.
    const payload = JSON.stringify({ id: 'evt_1', object: 'event', type: 'invoice.paid' }, null, 2);
    const timestamp = 1_767_225_600;
    expect(signatureHeader(payload, WEBHOOK_SECRET, timestamp)).toBe(
      stripe.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET, timestamp }),
    );
  });

  it('serves our plans as monthly prices found by lookup key', async () => {
    const lookupKeys = Object.values(PLANS).map((plan) => plan.priceLookupKey);
    const prices = await stripe.prices.list({ lookup_keys: lookupKeys, active: true, limit: 10 });
    expect(prices.data).toHaveLength(3);
    for (const plan of Object.values(PLANS)) {
      const price = prices.data.find((candidate) => candidate.lookup_key === plan.priceLookupKey);
      expect(price).toMatchObject({ object: 'price', unit_amount: plan.monthlyPriceMinor, currency: 'eur', type: 'recurring' });
      expect(price?.recurring).toMatchObject({ interval: 'month', interval_count: 1 });
      const product = await stripe.products.retrieve(String(price?.product));
      expect(product.name).toBe(`Sweepline ${plan.name}`);
    }
  });

  it('creates and retrieves customers with nested metadata from form-encoded bodies', async () => {
    const created = await stripe.customers.create({
      name: 'Kestrel Bay Acoustics',
      email: 'billing@kestrelbay.example',
      metadata: { organisation_id: 'org_kestrel', site: 'Harbour Road lab' },
    });
    expect(created.id).toMatch(/^cus_/);
    const retrieved = await stripe.customers.retrieve(created.id);
    expect(retrieved).toMatchObject({ id: created.id, object: 'customer', email: 'billing@kestrelbay.example' });
    expect((retrieved as Stripe.Customer).metadata).toEqual({ organisation_id: 'org_kestrel', site: 'Harbour Road lab' });
  });

  it('answers a missing object with the provider error shape the SDK maps', async () => {
    const attempt = stripe.customers.retrieve('cus_doesnotexist');
    await expect(attempt).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    await expect(attempt).rejects.toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });

  it('refuses unknown parameters instead of ignoring them', async () => {
    const attempt = stripe.customers.create({ nickname: 'typo' } as Stripe.CustomerCreateParams);
    await expect(attempt).rejects.toMatchObject({ statusCode: 400, code: 'parameter_unknown', param: 'nickname' });
  });

  it('refuses any key but its own', async () => {
    const stranger = new Stripe('sk_test_someone_else', { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
    await expect(stranger.customers.list()).rejects.toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
  });

  it('replays a POST retried with the same idempotency key and refuses the key with other parameters', async () => {
    const before = fake.state.customers.size;
    const first = await stripe.customers.create({ name: 'KB line 2' }, { idempotencyKey: 'kb-line-2' });
    const again = await stripe.customers.create({ name: 'KB line 2' }, { idempotencyKey: 'kb-line-2' });
    expect(again.id).toBe(first.id);
    expect(fake.state.customers.size).toBe(before + 1);
    await expect(stripe.customers.create({ name: 'KB line 3' }, { idempotencyKey: 'kb-line-2' })).rejects.toBeInstanceOf(
      Stripe.errors.StripeIdempotencyError,
    );
  });

  it('creates a subscription checkout session whose URL is a page on the fake', async () => {
    const customer = await stripe.customers.create({ name: 'Kestrel Bay Acoustics' });
    const [price] = (await stripe.prices.list({ lookup_keys: [PLANS.line.priceLookupKey] })).data;
    const session = await stripe.checkout.sessions.create({
      mode: 'subscription',
      customer: customer.id,
      line_items: [{ price: price.id, quantity: 1 }],
      success_url: 'http://127.0.0.1:5173/settings/plan?session={CHECKOUT_SESSION_ID}',
      cancel_url: 'http://127.0.0.1:5173/settings/plan',
    });
    expect(session).toMatchObject({ object: 'checkout.session', mode: 'subscription', status: 'open', amount_total: 29_000 });
    expect(session.url).toBe(`${fake.baseUrl}/checkout/${session.id}`);
    expect((await stripe.checkout.sessions.retrieve(session.id)).id).toBe(session.id);

    const page = await fetch(String(session.url));
    expect(page.status).toBe(200);
    expect(page.headers.get('content-security-policy')).toContain("default-src 'none'");
    const html = await page.text();
    expect(html).not.toContain('<script');
    expect(html).toContain(`<form method="post" action="/checkout/${session.id}/pay">`);
  });

  it('refuses checkout modes it does not model', async () => {
    const [price] = (await stripe.prices.list({ lookup_keys: [PLANS.line.priceLookupKey] })).data;
    const attempt = stripe.checkout.sessions.create({
      mode: 'payment',
      line_items: [{ price: price.id, quantity: 1 }],
      success_url: 'http://127.0.0.1:5173/ok',
    });
    await expect(attempt).rejects.toMatchObject({ statusCode: 400, param: 'mode' });
  });

  it('delivers webhooks to loopback endpoints only', () => {
    expect(() => fake.setWebhookUrl('https://hooks.example.com/provider')).toThrow(/loopback/);
  });
});
