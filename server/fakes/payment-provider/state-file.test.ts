import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { createBillingClient } from '@server/billing/billing-client';
import { startPaymentProviderFake } from './start-payment-provider-fake';

const WEBHOOK_SECRET = 'whsec_state_file_test';
const folders: string[] = [];

afterEach(() => {
  for (const folder of folders.splice(0)) rmSync(folder, { recursive: true, force: true });
});

describe('payment provider fake with a state file', () => {
  it('keeps customers and price ids across a restart', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'sweepline-payments-'));
    folders.push(folder);
    const statePath = join(folder, 'payment-provider.json');

    const first = await startPaymentProviderFake({ webhookSecret: WEBHOOK_SECRET, statePath });
    const firstClient = createBillingClient({ webhookSecret: WEBHOOK_SECRET, apiBaseUrl: first.baseUrl });
    const customer = await firstClient.customers.create({ name: 'Kestrel Bay Acoustics' });
    const pricesBefore = (await firstClient.prices.list({ limit: 10 })).data.map((price) => price.id).sort();
    await first.stop();

    const second = await startPaymentProviderFake({ webhookSecret: WEBHOOK_SECRET, statePath });
    try {
      const secondClient = createBillingClient({ webhookSecret: WEBHOOK_SECRET, apiBaseUrl: second.baseUrl });
      expect((await secondClient.customers.retrieve(customer.id)).id).toBe(customer.id);
      expect((await secondClient.prices.list({ limit: 10 })).data.map((price) => price.id).sort()).toEqual(pricesBefore);
    } finally {
      await second.stop();
    }
  });

  it('starts fresh without a state file', async () => {
    const one = await startPaymentProviderFake({ webhookSecret: WEBHOOK_SECRET });
    const other = await startPaymentProviderFake({ webhookSecret: WEBHOOK_SECRET });
    try {
      expect([...one.state.prices.keys()]).not.toEqual([...other.state.prices.keys()]);
    } finally {
      await Promise.all([one.stop(), other.stop()]);
    }
  });
});
