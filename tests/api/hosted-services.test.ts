import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '@server/config/env';
import { PLANS } from '@server/billing/plans';
import { createTestContext, type TestContext } from '../support/test-app';

let context: TestContext;

beforeAll(async () => {
  context = await createTestContext({ hostedFakes: true });
});

afterAll(async () => {
  await context.close();
});

describe('hosted services in tests and development', () => {
  it('mail sent through the configured mailer lands in the local catcher the console reads', async () => {
    const { mailer, devOutbox } = context.deps;
    expect(mailer).toBeDefined();
    expect(devOutbox).toBeDefined();
    await mailer!.sendMail({ to: 'analyst@kestrelbay.example', subject: 'Calibration due on rig 3', text: 'Channel 1 is due.' });
    const caught = await devOutbox!.waitFor((email) => email.subject === 'Calibration due on rig 3');
    expect(caught.envelope.rcptTo).toEqual(['analyst@kestrelbay.example']);
    expect(caught.text).toContain('Channel 1 is due.');
  });

  it('the billing client reaches the payment fake through the official SDK and finds every paid plan price', async () => {
    const { billing } = context.deps;
    expect(billing).toBeDefined();
    const prices = await billing!.stripe.prices.list({ active: true, limit: 100 });
    const lookupKeys = prices.data.map((price) => price.lookup_key);
    for (const plan of Object.values(PLANS)) {
      if (plan.priceLookupKey) expect(lookupKeys).toContain(plan.priceLookupKey);
    }
  });
});

describe('hosted-service configuration', () => {
  it('development starts the local fakes by default; tests and production do not', () => {
    expect(loadConfig({ NODE_ENV: 'development' }).hosted.localFakes).toBe(true);
    expect(loadConfig({ NODE_ENV: 'test' }).hosted.localFakes).toBe(false);
  });

  it('a payment key without its webhook secret is refused at start, naming the missing variable', () => {
    expect(() => loadConfig({ NODE_ENV: 'development', PAYMENTS_SECRET_KEY: 'sk_test_x' })).toThrow(/PAYMENTS_WEBHOOK_SECRET/);
  });

  it('the local fakes cannot be switched on in production', () => {
    expect(() =>
      loadConfig({
        NODE_ENV: 'production',
        SESSION_SECRET: 'x'.repeat(40),
        DATABASE_URL: 'mysql://u:p@db.internal:3306/sweepline',
        PUBLIC_ORIGIN: 'https://sweepline.example',
        SWEEPLINE_LOCAL_FAKES: 'true',
      }),
    ).toThrow(/SWEEPLINE_LOCAL_FAKES/);
  });

  it('a configured relay replaces the catcher', () => {
    const config = loadConfig({ NODE_ENV: 'development', SMTP_URL: 'smtp://relay.kestrelbay.example:587' });
    expect(config.hosted.smtpUrl).toBe('smtp://relay.kestrelbay.example:587');
  });
});
