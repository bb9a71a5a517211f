import type Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { createBillingClient } from './billing-client';
import { BillingError } from './billing-error';
import { currentPeriodEnd, planFromSubscription } from './plan-from-subscription';
import { isPaidPlanId, PLAN_IDS, PLANS, planByPriceLookupKey } from './plans';

function subscription(status: string, lookupKeys: (string | null)[], periodEnds: number[] = []): Stripe.Subscription {
  return {
    object: 'subscription',
    status,
    items: { data: lookupKeys.map((lookup_key, index) => ({ price: { lookup_key }, current_period_end: periodEnds[index] ?? 0 })) },
  } as unknown as Stripe.Subscription;
}

describe('planFromSubscription', () => {
  it.each([
    ['active', 'plant'],
    ['trialing', 'plant'],
    ['past_due', 'plant'],
    ['canceled', 'bench'],
    ['unpaid', 'bench'],
    ['incomplete', 'bench'],
    ['incomplete_expired', 'bench'],
    ['paused', 'bench'],
  ])('a %s subscription to the plant price means %s', (status, planId) => {
    expect(planFromSubscription(subscription(status, [PLANS.plant.priceLookupKey]))).toBe(planId);
  });

  it('ignores prices that are not ours', () => {
    expect(planFromSubscription(subscription('active', [null, 'someone_elses_price', PLANS.line.priceLookupKey]))).toBe('line');
    expect(planFromSubscription(subscription('active', ['someone_elses_price']))).toBe('bench');
  });

  it('takes the latest item period end', () => {
    expect(currentPeriodEnd(subscription('active', ['a', 'b'], [1_775_001_600, 1_775_088_000]))?.toISOString()).toBe('2026-04-02T00:00:00.000Z');
    expect(currentPeriodEnd(subscription('active', []))).toBeNull();
  });
});

describe('plan catalogue', () => {
  it('has one free plan and unique lookup keys that map back to their plan', () => {
    expect(PLAN_IDS.filter((id) => !isPaidPlanId(id))).toEqual(['bench']);
    for (const plan of Object.values(PLANS)) expect(planByPriceLookupKey(plan.priceLookupKey)?.id).toBe(plan.id);
  });

  it('never gives a larger plan a smaller limit', () => {
    const ordered = PLAN_IDS.map((id) => PLANS[id]);
    for (let index = 1; index < ordered.length; index++) {
      const smaller = ordered[index - 1];
      const larger = ordered[index];
      expect(larger.monthlyPriceMinor).toBeGreaterThan(smaller.monthlyPriceMinor);
      for (const key of Object.keys(smaller.limits) as (keyof typeof smaller.limits)[]) {
        expect(larger.limits[key], `${larger.id}.${key}`).toBeGreaterThanOrEqual(smaller.limits[key]);
      }
    }
  });
});

describe('createBillingClient', () => {
  it('needs the local fake address when no real key is set', () => {
    expect(() => createBillingClient({ webhookSecret: 'whsec_x' })).toThrow(BillingError);
  });

  it('talks to a local fake on loopback only', () => {
    expect(() => createBillingClient({ webhookSecret: 'whsec_x', apiBaseUrl: 'http://payments.example.com' })).toThrow(/loopback/);
    expect(() => createBillingClient({ webhookSecret: 'whsec_x', apiBaseUrl: 'http://127.0.0.1:4243/v1' })).toThrow(/origin only/);
    expect(() => createBillingClient({ webhookSecret: 'whsec_x', apiBaseUrl: 'http://127.0.0.1:4243' })).not.toThrow();
  });

  it('accepts a real key without an address override', () => {
    expect(() => createBillingClient({ secretKey: 'sk_test_kestrel_bay_sandbox', webhookSecret: 'whsec_x' })).not.toThrow();
  });
});
