import { createHmac } from 'node:crypto';
import { once } from 'node:events';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LOCAL_FAKE_WEBHOOK_SECRET } from '@server/billing/billing-config';
import { PLANS } from '@server/billing/plans';
import { fetchPageForms, submitPageForm } from '@server/fakes/payment-provider/testing/hosted-page-forms';
import type { PaymentProviderFake } from '@server/fakes/payment-provider/start-payment-provider-fake';
import { and, eq } from 'drizzle-orm';
import { usageThresholdNotices } from '@server/db/tables';
import type { Mailer } from '@server/email/mailer';
import { manualClock } from '@server/lib/clock';
import { newId } from '@server/lib/ids';
import { findOrganisationPlan } from '@server/modules/usage/organisation-plans.repo';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { thresholdEmailsSettled } from '@server/modules/usage/threshold-emails';
import { reserveAnalysis } from '@server/modules/usage/usage.service';
import { organisationWithRoles, type Agent, type OrganisationWithRoles } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

const WEBHOOK_PATH = '/v1/billing/provider-webhook';

let context: TestContext;
let server: http.Server;
let fake: PaymentProviderFake;
let org: OrganisationWithRoles;

beforeAll(async () => {
  context = await createTestContext({ hostedFakes: true });
  // The fake posts its signed events over HTTP, so this app listens (on loopback) like a deployed server.
  server = http.createServer(context.app);
  server.listen(0, '127.0.0.1');
  await once(server, 'listening');
  context.hosted!.announceBaseUrl(`http://127.0.0.1:${(server.address() as AddressInfo).port}`);
  fake = context.hosted!.fakes!.payments;
  org = await organisationWithRoles(context, 'Kestrel Bay Acoustics');
});

afterAll(async () => {
  server?.closeAllConnections();
  await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
  await context?.close();
});

/**
 * The provider's webhook signature computed here from its published scheme, independent of the fake's signer:
 * `t=<unix seconds>,v1=<hex HMAC-SHA256(secret, "<t>.<raw body>")>` (payment provider's webhook documentation,
 * "verify signatures manually"; from memory). HMAC-SHA256 per RFC 2104 / FIPS 198-1.
 */
function sign(payload: string, secret: string, timestampSeconds = Math.floor(Date.now() / 1000)): string {
  return `t=${timestampSeconds},v1=${createHmac('sha256', secret).update(`${timestampSeconds}.${payload}`, 'utf8').digest('hex')}`;
}

const postEvent = (payload: string, signature?: string) => {
  const call = request(context.app).post(WEBHOOK_PATH).set('Content-Type', 'application/json');
  return (signature ? call.set('Stripe-Signature', signature) : call).send(payload);
};

async function planRow() {
  return findOrganisationPlan(context.deps.db, org.organisationId);
}

async function usageOf(agent: Agent) {
  const response = await agent.get('/v1/usage');
  expect(response.status).toBe(200);
  return response.body as { planId: string; analyses: { limit: number }; audioMinutes: { limit: number }; storageBytes: { limit: number }; requestsPerMinute: { limit: number } };
}

describe('billing API access', () => {
  const calls: Array<[string, (agent: Agent) => Promise<{ status: number; body: { code?: string } }>]> = [
    ['GET /v1/billing/plans', (agent) => agent.get('/v1/billing/plans')],
    ['GET /v1/billing/account', (agent) => agent.get('/v1/billing/account')],
    ['GET /v1/billing/invoices', (agent) => agent.get('/v1/billing/invoices')],
    ['POST /v1/billing/checkout', (agent) => agent.post('/v1/billing/checkout').send({ planId: 'line' })],
    ['POST /v1/billing/portal', (agent) => agent.post('/v1/billing/portal')],
  ];
  for (const [name, call] of calls) {
    for (const role of ['analyst', 'viewer'] as const) {
      it(`${name} as ${role}: 403`, async () => {
        const response = await call(org[role].agent);
        expect(response.status).toBe(403);
        expect(response.body.code).toBe('insufficient_permission');
      });
    }
  }

  it('owners and admins read the catalogue with prices and limits', async () => {
    for (const role of ['owner', 'admin'] as const) {
      const response = await org[role].agent.get('/v1/billing/plans');
      expect(response.status).toBe(200);
      expect(response.body.currentPlanId).toBe('bench');
      expect(response.body.billingAvailable).toBe(true);
      expect(response.body.data.map((plan: { id: string }) => plan.id)).toEqual(['bench', 'line', 'plant']);
      // Our own catalogue (server/billing/plans.ts) is the reference for what the API publishes.
      expect(response.body.data[1]).toEqual({
        id: 'line',
        name: PLANS.line.name,
        summary: PLANS.line.summary,
        monthlyPriceMinor: PLANS.line.monthlyPriceMinor,
        currency: 'eur',
        limits: PLANS.line.limits,
      });
    }
  });

  it('refuses a checkout for the free plan and for an unknown plan', async () => {
    const free = await org.admin.agent.post('/v1/billing/checkout').send({ planId: 'bench' });
    expect(free.status).toBe(422);
    expect(free.body.code).toBe('plan_not_purchasable');
    const unknown = await org.admin.agent.post('/v1/billing/checkout').send({ planId: 'studio' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.errors[0].pointer).toBe('#/planId');
  });

  it('has no portal before the first checkout, and an empty invoice list', async () => {
    const portal = await org.admin.agent.post('/v1/billing/portal');
    expect(portal.status).toBe(409);
    expect(portal.body.code).toBe('billing_account_missing');
    const invoices = await org.admin.agent.get('/v1/billing/invoices');
    expect(invoices.status).toBe(200);
    expect(invoices.body.data).toEqual([]);
  });
});

describe('plan change through the hosted checkout and signed provider events', () => {
  let subscriptionCreatedEventId: string;

  it('checkout → pay on the hosted page → signed events to our route → new plan and limits', async () => {
    expect((await usageOf(org.admin.agent)).planId).toBe('bench');

    const started = await org.admin.agent.post('/v1/billing/checkout').send({ planId: 'line' });
    expect(started.status, JSON.stringify(started.body)).toBe(200);
    const checkoutUrl: string = started.body.url;
    expect(checkoutUrl.startsWith(`${fake.baseUrl}/checkout/`)).toBe(true);

    // The customer the checkout created is stored before anything is paid.
    const stored = await planRow();
    expect(stored?.providerCustomerId).toMatch(/^cus_/);
    expect(stored?.planId).toBe('bench');

    const [payForm] = await fetchPageForms(checkoutUrl);
    expect(payForm.label).toBe('Pay €290.00 and subscribe');
    const deliveriesBefore = fake.state.deliveries.length;
    const paid = await submitPageForm(checkoutUrl, payForm);
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toMatch(new RegExp(`^${context.origin}/usage\\?checkout=cs_`));

    // Every event reached our route and was acknowledged with 2xx.
    const deliveries = fake.state.deliveries.slice(deliveriesBefore);
    expect(deliveries.map((delivery) => delivery.type)).toEqual(['customer.subscription.created', 'invoice.paid', 'checkout.session.completed']);
    expect(deliveries.map((delivery) => delivery.responseStatus)).toEqual([200, 200, 200]);
    expect(deliveries.every((delivery) => delivery.url?.endsWith(WEBHOOK_PATH))).toBe(true);
    subscriptionCreatedEventId = deliveries[0].eventId;

    const usage = await usageOf(org.admin.agent);
    expect(usage.planId).toBe('line');
    expect(usage.analyses.limit).toBe(PLANS.line.limits.analysesPerMonth);
    expect(usage.audioMinutes.limit).toBe(PLANS.line.limits.audioMinutesPerMonth);
    expect(usage.storageBytes.limit).toBe(PLANS.line.limits.storageBytes);
    expect(usage.requestsPerMinute.limit).toBe(PLANS.line.limits.requestsPerMinute);

    const account = await org.owner.agent.get('/v1/billing/account');
    expect(account.body).toMatchObject({ planId: 'line', subscriptionStatus: 'active', hasBillingAccount: true, hasSubscription: true });
    // One calendar month ahead: 28 to 31 days (Gregorian calendar).
    const daysAhead = (Date.parse(account.body.currentPeriodEndsAt) - Date.now()) / 86_400_000;
    expect(daysAhead).toBeGreaterThan(27.9);
    expect(daysAhead).toBeLessThanOrEqual(31);

    const invoices = await org.admin.agent.get('/v1/billing/invoices');
    expect(invoices.body.data).toHaveLength(1);
    expect(invoices.body.data[0]).toMatchObject({ status: 'paid', currency: 'eur', amountPaidMinor: PLANS.line.monthlyPriceMinor, planId: 'line' });
  });

  it('a paying organisation is sent to the portal instead of a second checkout', async () => {
    const again = await org.admin.agent.post('/v1/billing/checkout').send({ planId: 'plant' });
    expect(again.status).toBe(409);
    expect(again.body.code).toBe('subscription_exists');
    expect(again.headers['content-type']).toMatch(/application\/problem\+json/);
  });

  it('a replayed event has no second effect, even after a later change (whole state, read fresh)', async () => {
    const before = await planRow();
    const replay = await fake.resendEvent(subscriptionCreatedEventId);
    expect(replay.responseStatus).toBe(200);
    const after = await planRow();
    expect(after).toMatchObject({ planId: 'line', providerSubscriptionId: before?.providerSubscriptionId, providerCustomerId: before?.providerCustomerId });
    expect((await org.admin.agent.get('/v1/billing/invoices')).body.data).toHaveLength(1);

    // Upgrade in the portal, then the old "created" event (which named Line) arrives once more: Plant stays.
    const portal = await org.admin.agent.post('/v1/billing/portal');
    expect(portal.status).toBe(200);
    const upgrade = (await fetchPageForms(portal.body.url)).find((form) => form.label.startsWith('Switch to Sweepline Plant'));
    expect(upgrade).toBeDefined();
    const switched = await submitPageForm(portal.body.url, upgrade!);
    expect(switched.headers.get('location')).toBe(`${context.origin}/usage`);
    expect((await usageOf(org.owner.agent)).planId).toBe('plant');

    expect((await fake.resendEvent(subscriptionCreatedEventId)).responseStatus).toBe(200);
    const usage = await usageOf(org.owner.agent);
    expect(usage.planId).toBe('plant');
    expect(usage.analyses.limit).toBe(PLANS.plant.limits.analysesPerMonth);
  });

  it('refuses unsigned, wrongly signed and tampered events with 400 and changes nothing', async () => {
    const before = await planRow();
    const subscriptionId = before!.providerSubscriptionId!;
    // An event that would end the subscription if it were believed.
    const payload = JSON.stringify({
      id: 'evt_forged_kb65',
      object: 'event',
      type: 'customer.subscription.deleted',
      data: { object: { id: subscriptionId, object: 'subscription', status: 'canceled' } },
    });

    const missing = await postEvent(payload);
    expect(missing.status).toBe(400);
    expect(missing.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(missing.body.code).toBe('webhook_signature_missing');

    const wrongKey = await postEvent(payload, sign(payload, 'whsec_someone_else'));
    expect(wrongKey.status).toBe(400);
    expect(wrongKey.body.code).toBe('webhook_signature_invalid');

    const tampered = await postEvent(payload.replace('kb65', 'kb66'), sign(payload, LOCAL_FAKE_WEBHOOK_SECRET));
    expect(tampered.status).toBe(400);
    expect(tampered.body.code).toBe('webhook_signature_invalid');

    // Ten minutes old: beyond the 5-minute tolerance against replays.
    const stale = await postEvent(payload, sign(payload, LOCAL_FAKE_WEBHOOK_SECRET, Math.floor(Date.now() / 1000) - 600));
    expect(stale.status).toBe(400);
    expect(stale.body.code).toBe('webhook_signature_invalid');

    expect(await planRow()).toEqual(before);
  });

  it('accepts a correctly signed event of a type that changes no plan, and ignores it', async () => {
    const payload = JSON.stringify({ id: 'evt_kb_customer_updated', object: 'event', type: 'customer.updated', data: { object: { id: 'cus_x' } } });
    const response = await postEvent(payload, sign(payload, LOCAL_FAKE_WEBHOOK_SECRET));
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ received: true, outcome: 'ignored', eventId: 'evt_kb_customer_updated' });
  });
});

describe('without a payment provider', () => {
  let bare: TestContext;
  let bareOrg: OrganisationWithRoles;

  beforeAll(async () => {
    bare = await createTestContext();
    bareOrg = await organisationWithRoles(bare, 'Kestrel Bay Harbour Lab');
  });
  afterAll(async () => {
    await bare?.close();
  });

  it('checkout, portal, invoices and the webhook answer 503 naming the missing settings', async () => {
    const responses = [
      await bareOrg.admin.agent.post('/v1/billing/checkout').send({ planId: 'line' }),
      await bareOrg.admin.agent.post('/v1/billing/portal'),
      await bareOrg.admin.agent.get('/v1/billing/invoices'),
      await request(bare.app).post(WEBHOOK_PATH).set('Content-Type', 'application/json').send('{}'),
    ];
    for (const response of responses) {
      expect(response.status).toBe(503);
      expect(response.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(response.body.code).toBe('billing_not_configured');
      expect(response.body.detail).toMatch(/PAYMENTS_SECRET_KEY/);
      expect(response.body.missingSettings).toEqual(['PAYMENTS_SECRET_KEY', 'PAYMENTS_WEBHOOK_SECRET']);
    }
  });

  it('the catalogue is still served and says billing is unavailable', async () => {
    const response = await bareOrg.owner.agent.get('/v1/billing/plans');
    expect(response.status).toBe(200);
    expect(response.body.billingAvailable).toBe(false);
    expect(response.body.currentPlanId).toBe('bench');
  });
});

describe('quota threshold e-mails to owners and admins', () => {
  const reserve = (deps: TestContext['deps'], organisationId: string) =>
    reserveAnalysis(deps, organisationId, { analysisId: newId('analysis'), audioSeconds: 2 });

  it('sends exactly one e-mail per threshold (80 %, 100 %) to the owners and admins only', async () => {
    const lab = await organisationWithRoles(context, 'Kestrel Bay Line 3');
    await setOrganisationPlan(context.deps, lab.organisationId, { planId: 'bench', limitOverrides: { analysesPerMonth: 5 } });
    const outbox = context.deps.devOutbox!;
    const mailsOfLab = () => outbox.list().filter((email) => email.subject.startsWith('Kestrel Bay Line 3 '));

    // 3 of 5 = 60 %: nothing yet.
    for (let count = 0; count < 3; count += 1) await reserve(context.deps, lab.organisationId);
    await thresholdEmailsSettled();
    expect(mailsOfLab()).toHaveLength(0);

    // 4 of 5 = 80 %, 5 of 5 = 100 %, then refusals over the quota: one mail per threshold, never more.
    await reserve(context.deps, lab.organisationId);
    await reserve(context.deps, lab.organisationId);
    await expect(reserve(context.deps, lab.organisationId)).rejects.toMatchObject({ code: 'quota_exceeded' });
    await thresholdEmailsSettled();

    const mails = mailsOfLab();
    expect(mails.map((email) => email.subject).sort()).toEqual([
      'Kestrel Bay Line 3 has reached its analyses limit on Sweepline',
      'Kestrel Bay Line 3 has used 80\u00a0% of its analyses on Sweepline',
    ]);
    const adminAddresses = [lab.owner.email, lab.admin.email].sort();
    for (const mail of mails) {
      expect([...mail.envelope.rcptTo].sort()).toEqual(adminAddresses);
      expect(mail.text).toContain(`${context.origin}/usage`);
    }
    const eighty = mails.find((email) => email.subject.includes('80'))!;
    // 4 of 5 analyses = 80 % (arithmetic).
    expect(eighty.text).toContain('has used 4 of the 5 of analyses');

    const notices = await context.deps.db
      .select()
      .from(usageThresholdNotices)
      .where(and(eq(usageThresholdNotices.organisationId, lab.organisationId), eq(usageThresholdNotices.quota, 'analyses')));
    expect(notices.map((notice) => notice.thresholdPercent).sort()).toEqual([100, 80]);
    expect(notices.every((notice) => notice.notifiedAt !== null)).toBe(true);
  });

  it('a failing relay is logged, not thrown into the analysis, and the notice stays unmailed', async () => {
    const lab = await organisationWithRoles(context, 'Kestrel Bay Line 4');
    await setOrganisationPlan(context.deps, lab.organisationId, { planId: 'bench', limitOverrides: { analysesPerMonth: 1 } });
    const brokenRelay: Mailer = {
      sendMail: () => Promise.reject(new Error('relay refused the connection')),
      verify: () => Promise.resolve(),
      close: () => undefined,
    };
    const errors: unknown[] = [];
    const logger = Object.assign(Object.create(context.deps.logger), { error: (...args: unknown[]) => errors.push(args) });
    const reservation = await reserve({ ...context.deps, mailer: brokenRelay, logger }, lab.organisationId);
    expect(reservation.charged).toBe(true);
    await thresholdEmailsSettled();
    expect(errors).toHaveLength(2); // 80 % and 100 % of a quota of 1, both crossed by the one analysis
    const notices = await context.deps.db.select().from(usageThresholdNotices).where(eq(usageThresholdNotices.organisationId, lab.organisationId));
    expect(notices.filter((notice) => notice.quota === 'analyses').map((notice) => notice.notifiedAt)).toEqual([null, null]);
  });
});

describe('daily usage series', () => {
  it('sums the period\'s charges per UTC day, adds up to GET /v1/usage, and counts only the own organisation', async () => {
    const lab = await organisationWithRoles(context, 'Kestrel Bay Line 5');
    const other = await organisationWithRoles(context, 'Kestrel Bay Line 6');
    const now = Date.now();
    const today = new Date(now).toISOString().slice(0, 10);
    const yesterdayNoon = new Date(Date.parse(`${today}T12:00:00.000Z`) - 86_400_000);
    const sameMonth = yesterdayNoon.getUTCMonth() === new Date(now).getUTCMonth();
    const charge = async (organisationId: string, at: Date, audioSeconds: number) =>
      reserveAnalysis({ ...context.deps, clock: manualClock(at) }, organisationId, { analysisId: newId('analysis'), audioSeconds });

    if (sameMonth) {
      await charge(lab.organisationId, yesterdayNoon, 30);
      await charge(lab.organisationId, yesterdayNoon, 30);
    }
    await charge(lab.organisationId, new Date(now - 1000), 90);
    await charge(other.organisationId, new Date(now - 1000), 600);

    const daily = await lab.viewer.agent.get('/v1/usage/daily');
    expect(daily.status).toBe(200);
    const usage = await lab.viewer.agent.get('/v1/usage');
    expect(daily.body.period).toEqual(usage.body.period);
    const byDay = new Map(daily.body.days.map((day: { date: string }) => [day.date, day]));
    expect(daily.body.days.at(-1).date).toBe(today);
    // 90 s = 1.5 min; 2 × 30 s = 1 min (arithmetic).
    expect(byDay.get(today)).toEqual({ date: today, analyses: 1, audioMinutes: 1.5 });
    if (sameMonth) expect(byDay.get(yesterdayNoon.toISOString().slice(0, 10))).toEqual({ date: yesterdayNoon.toISOString().slice(0, 10), analyses: 2, audioMinutes: 1 });
    const sum = (key: 'analyses' | 'audioMinutes') => daily.body.days.reduce((total: number, day: Record<string, number>) => total + day[key], 0);
    expect(sum('analyses')).toBe(usage.body.analyses.used);
    expect(sum('audioMinutes')).toBeCloseTo(usage.body.audioMinutes.used, 3);
    // Every day from the period's first to today, none missing.
    const firstDay = usage.body.period.start.slice(0, 10);
    expect(daily.body.days[0].date).toBe(firstDay);
    expect(daily.body.days).toHaveLength(Math.round((Date.parse(today) - Date.parse(firstDay)) / 86_400_000) + 1);
  });
});
