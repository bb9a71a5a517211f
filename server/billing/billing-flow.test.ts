import { fetch } from 'undici';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startPaymentProviderFake, type PaymentProviderFake } from '@server/fakes/payment-provider/start-payment-provider-fake';
import { fetchPageForms, formsOnPage, submitPageForm } from '@server/fakes/payment-provider/testing/hosted-page-forms';
import { startWebhookReceiver, type WebhookReceiver } from '@server/fakes/payment-provider/testing/webhook-receiver';
import { signatureHeader } from '@server/fakes/payment-provider/webhooks/sign-payload';
import { BillingError } from './billing-error';
import { createBillingService, type BillingService } from './billing-service';
import type { BillingStore, PlanChange } from './billing-store';
import { planFromSubscription } from './plan-from-subscription';
import { PLANS } from './plans';

const WEBHOOK_SECRET = 'whsec_billing_flow_test';
const ORGANISATION_ID = 'org_kestrel_bay';
const CONSOLE = 'http://127.0.0.1:5173';

let fake: PaymentProviderFake;
let receiver: WebhookReceiver;
let billing: BillingService;
const appliedChanges: PlanChange[] = [];
const customersByOrganisation = new Map<string, string>();

// The port our database layer will implement; here a Map, because this suite is about the provider flow.
const store: BillingStore = {
  async findOrganisationIdByCustomerId(customerId) {
    return [...customersByOrganisation].find(([, customer]) => customer === customerId)?.[0] ?? null;
  },
  async applyPlanChange(change) {
    appliedChanges.push(change);
  },
};

beforeAll(async () => {
  receiver = await startWebhookReceiver('/v1/billing/provider-webhooks');
  fake = await startPaymentProviderFake({ webhookSecret: WEBHOOK_SECRET });
  fake.setWebhookUrl(receiver.url);
  billing = createBillingService({ webhookSecret: WEBHOOK_SECRET, apiBaseUrl: fake.baseUrl }, store);
});

afterAll(async () => {
  await fake.stop();
  await receiver.stop();
});

beforeEach(() => {
  receiver.received.length = 0;
  appliedChanges.length = 0;
});

async function applyAll(): Promise<PlanChange[]> {
  for (const delivery of receiver.received) await billing.handleProviderWebhook(delivery.rawBody, delivery.signature);
  return [...appliedChanges];
}

describe('plan changes through the provider SDK and the local fake', () => {
  let customerId: string;

  it('checkout: page → pay → signed webhooks → the organisation is on the new plan', async () => {
    const checkout = await billing.startCheckout({
      organisationId: ORGANISATION_ID,
      organisationName: 'Kestrel Bay Acoustics',
      billingEmail: 'billing@kestrelbay.example',
      planId: 'plant',
      successUrl: `${CONSOLE}/settings/plan?checkout={CHECKOUT_SESSION_ID}`,
      cancelUrl: `${CONSOLE}/settings/plan`,
    });
    customerId = checkout.customerId;
    customersByOrganisation.set(ORGANISATION_ID, customerId);
    expect(checkout.url.startsWith(`${fake.baseUrl}/checkout/`)).toBe(true);

    const page = await fetch(checkout.url);
    expect(page.status).toBe(200);
    const [payForm] = formsOnPage(await page.text());
    expect(payForm.label).toBe('Pay €1,490.00 and subscribe');

    const paid = await submitPageForm(checkout.url, payForm);
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`${CONSOLE}/settings/plan?checkout=${checkout.sessionId}`);

    // Delivered before the redirect, in the provider's order.
    const events = receiver.received.map((delivery) => billing.verifyProviderWebhook(delivery.rawBody, delivery.signature));
    expect(events.map((event) => event.type)).toEqual(['customer.subscription.created', 'invoice.paid', 'checkout.session.completed']);
    const [created] = events;
    if (created.type !== 'customer.subscription.created') throw new Error('unexpected event order');
    expect(planFromSubscription(created.data.object)).toBe('plant');

    const changes = await applyAll();
    expect(changes).toHaveLength(3);
    for (const change of changes) {
      expect(change).toMatchObject({ organisationId: ORGANISATION_ID, customerId, planId: 'plant', subscriptionStatus: 'active' });
      // One calendar month ahead: 28 to 31 days (Gregorian calendar).
      const daysAhead = ((change.currentPeriodEndsAt?.getTime() ?? 0) - Date.now()) / 86_400_000;
      expect(daysAhead).toBeGreaterThan(27.9);
      expect(daysAhead).toBeLessThanOrEqual(31);
    }
  });

  it('refuses tampered, wrongly keyed, stale and unsigned deliveries', async () => {
    const payload = JSON.stringify({ id: 'evt_forged', object: 'event', type: 'customer.subscription.updated', data: { object: {} } }, null, 2);
    const now = Math.floor(Date.now() / 1000);
    const valid = signatureHeader(payload, WEBHOOK_SECRET, now);
    expect(billing.verifyProviderWebhook(payload, valid).id).toBe('evt_forged');

    const tamperedBody = payload.replace('evt_forged', 'evt_forgeD');
    const refusals = [
      () => billing.verifyProviderWebhook(tamperedBody, valid),
      () => billing.verifyProviderWebhook(payload, signatureHeader(payload, 'whsec_someone_else', now)),
      // 10 minutes old, beyond the 5-minute tolerance.
      () => billing.verifyProviderWebhook(payload, signatureHeader(payload, WEBHOOK_SECRET, now - 600)),
      () => billing.verifyProviderWebhook(payload, valid.replace(/v1=[0-9a-f]{4}/, 'v1=0000')),
    ];
    for (const refusal of refusals) {
      expect(refusal).toThrow(BillingError);
      expect(refusal).toThrow(expect.objectContaining({ code: 'webhook_signature_invalid', status: 400 }));
    }
    expect(() => billing.verifyProviderWebhook(payload, undefined)).toThrow(expect.objectContaining({ code: 'webhook_signature_missing' }));
    await expect(billing.handleProviderWebhook(tamperedBody, valid)).rejects.toMatchObject({ code: 'webhook_signature_invalid' });
  });

  it('sends a paying organisation to the portal instead of a second checkout', async () => {
    const attempt = billing.startCheckout({ organisationId: ORGANISATION_ID, customerId, planId: 'line', successUrl: `${CONSOLE}/ok`, cancelUrl: `${CONSOLE}/no` });
    await expect(attempt).rejects.toMatchObject({ code: 'subscription_exists', status: 409 });
  });

  it('replaces a stored customer the provider no longer knows', async () => {
    const checkout = await billing.startCheckout({
      organisationId: 'org_harbour_lab',
      customerId: 'cus_forgotten_by_the_provider',
      planId: 'line',
      successUrl: `${CONSOLE}/ok`,
      cancelUrl: `${CONSOLE}/no`,
    });
    expect(checkout.customerId).not.toBe('cus_forgotten_by_the_provider');
    const customer = await billing.stripe.customers.retrieve(checkout.customerId);
    expect((customer as { metadata: Record<string, string> }).metadata).toEqual({ organisation_id: 'org_harbour_lab' });
  });

  it('refuses a checkout for the free plan', async () => {
    const attempt = billing.startCheckout({ organisationId: ORGANISATION_ID, planId: 'bench', successUrl: `${CONSOLE}/ok`, cancelUrl: `${CONSOLE}/no` });
    await expect(attempt).rejects.toMatchObject({ code: 'plan_not_purchasable', status: 422 });
  });

  it('lists the paid invoice with amount, service period and plan', async () => {
    const invoices = await billing.listInvoices(customerId);
    expect(invoices).toHaveLength(1);
    const [invoice] = invoices;
    expect(invoice).toMatchObject({ status: 'paid', currency: 'eur', amountPaidMinor: PLANS.plant.monthlyPriceMinor, planId: 'plant' });
    expect(invoice.number).toMatch(/^[A-Z0-9]{8}-0001$/);
    expect(invoice.periodEnd.getTime()).toBeGreaterThan(invoice.periodStart.getTime());
    const hosted = await fetch(String(invoice.hostedInvoiceUrl));
    expect(hosted.status).toBe(200);
    expect(await hosted.text()).toContain(`Invoice ${invoice.number}`);
  });

  it('portal: downgrade from plant to line', async () => {
    const portal = await billing.openPortal({ customerId, returnUrl: `${CONSOLE}/settings/plan` });
    const forms = await fetchPageForms(portal.url);
    const downgrade = forms.find((form) => form.label.startsWith('Switch to Sweepline Line'));
    expect(downgrade?.label).toBe('Switch to Sweepline Line (€290.00 per month)');
    expect(forms.some((form) => form.label.startsWith('Switch to Sweepline Bench'))).toBe(false);

    const changed = await submitPageForm(portal.url, downgrade!);
    expect(changed.status).toBe(303);
    expect(changed.headers.get('location')).toBe(`${CONSOLE}/settings/plan`);

    expect(receiver.received).toHaveLength(1);
    const event = billing.verifyProviderWebhook(receiver.received[0].rawBody, receiver.received[0].signature);
    if (event.type !== 'customer.subscription.updated') throw new Error(`unexpected ${event.type}`);
    expect(planFromSubscription(event.data.object)).toBe('line');
    const previousItems = event.data.previous_attributes?.items?.data ?? [];
    expect(previousItems.map((item) => item.price.lookup_key)).toEqual([PLANS.plant.priceLookupKey]);

    const [change] = await applyAll();
    expect(change).toMatchObject({ organisationId: ORGANISATION_ID, planId: 'line', subscriptionStatus: 'active' });
  });

  it('portal: cancelling returns the organisation to the free plan', async () => {
    const portal = await billing.openPortal({ customerId, returnUrl: `${CONSOLE}/settings/plan` });
    const forms = await fetchPageForms(portal.url);
    const cancel = forms.find((form) => form.label === 'Cancel subscription now');
    expect((await submitPageForm(portal.url, cancel!)).status).toBe(303);

    const [event] = receiver.received.map((delivery) => billing.verifyProviderWebhook(delivery.rawBody, delivery.signature));
    expect(event.type).toBe('customer.subscription.deleted');
    const [change] = await applyAll();
    expect(change).toMatchObject({ organisationId: ORGANISATION_ID, planId: 'bench', subscriptionId: null, subscriptionStatus: 'canceled', currentPeriodEndsAt: null });
  });

  it('falls back to the stored customer link when a subscription carries no organisation id', async () => {
    // A subscription made without our metadata (e.g. by hand at the provider) still maps through the store.
    const [price] = (await billing.stripe.prices.list({ lookup_keys: [PLANS.line.priceLookupKey] })).data;
    const session = await billing.stripe.checkout.sessions.create({
      mode: 'subscription',
      customer: customerId,
      line_items: [{ price: price.id }],
      success_url: `${CONSOLE}/ok`,
    });
    const [payForm] = await fetchPageForms(String(session.url));
    await submitPageForm(String(session.url), payForm);
    const changes = await applyAll();
    expect(changes.map((change) => [change.organisationId, change.planId])).toEqual([
      [ORGANISATION_ID, 'line'],
      [ORGANISATION_ID, 'line'],
      [ORGANISATION_ID, 'line'],
    ]);
  });
});
