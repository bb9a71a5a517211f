import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiProblem } from '@server/http/api-problem';
import { webhookDeliveries, webhookEvents } from '@server/db/tables';
import { manualClock } from '@server/lib/clock';
import { newId } from '@server/lib/ids';
import { addMonthsUtc, usagePeriodAt } from '@server/modules/usage/billing-period';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { onQuotaThreshold, type QuotaThresholdNotice } from '@server/modules/usage/quota-thresholds';
import { getUsageSummary, recordStorageBytes, releaseAnalysis, reserveAnalysis } from '@server/modules/usage/usage.service';
import { bearer, createApiKey, signUp, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

// Near the real time: session tokens are checked against the wall clock too.
const clock = manualClock(new Date(Math.ceil(Date.now() / 60_000) * 60_000));
let context: TestContext;
let org: SignedUp;
let usageKey: string;

beforeAll(async () => {
  context = await createTestContext({ clock });
  org = await signUp(context);
});
afterAll(async () => {
  await context?.close();
});

async function freshOrganisation(limits: Record<string, number>) {
  const user = await signUp(context, { organisationName: `Quota lab ${Math.random()}` });
  await setOrganisationPlan(context.deps, user.organisationId, { planId: 'bench', limitOverrides: { requestsPerMinute: 100_000, ...limits } });
  return user;
}

const reserve = (orgId: string, audioSeconds = 2) => reserveAnalysis(context.deps, orgId, { analysisId: newId('analysis'), audioSeconds });

describe('monthly analysis quota', () => {
  it('accepts exactly the quota under 50 concurrent reservations (no overdraw)', async () => {
    const user = await freshOrganisation({ analysesPerMonth: 20 });
    const outcomes = await Promise.allSettled(Array.from({ length: 50 }, () => reserve(user.organisationId)));
    const accepted = outcomes.filter((outcome) => outcome.status === 'fulfilled');
    const refused = outcomes.filter((outcome): outcome is PromiseRejectedResult => outcome.status === 'rejected');
    expect(accepted).toHaveLength(20);
    expect(refused).toHaveLength(30);
    for (const { reason } of refused) {
      expect(reason).toBeInstanceOf(ApiProblem);
      expect((reason as ApiProblem).status).toBe(429);
      expect((reason as ApiProblem).code).toBe('quota_exceeded');
    }
    const problem = refused[0].reason as ApiProblem;
    const period = usagePeriodAt(new Date('2000-01-01T00:00:00.000Z'), clock.now());
    expect(problem.extensions).toMatchObject({ 'violated-policies': ['monthly-analyses'], quota: 'analyses', limit: 20, used: 20, resetsAt: period.end.toISOString() });

    const { secret } = await createApiKey(user.agent, ['usage:read']);
    const usage = await request(context.app).get('/v1/usage').set(bearer(secret));
    expect(usage.status).toBe(200);
    expect(usage.body.analyses).toEqual({ used: 20, limit: 20, remaining: 0, percentUsed: 100 });
    // 20 analyses × 2 s = 40 s = 0.667 min.
    expect(usage.body.audioMinutes.used).toBeCloseTo(40 / 60, 3);
    expect(usage.body.period).toEqual({ start: period.start.toISOString(), end: period.end.toISOString() });
    usageKey = secret;
  });

  it('meters audio seconds and refuses an analysis that would pass the audio quota', async () => {
    const user = await freshOrganisation({ audioMinutesPerMonth: 1 });
    await reserve(user.organisationId, 50);
    const over = await reserve(user.organisationId, 11).catch((error: unknown) => error as ApiProblem);
    expect(over).toBeInstanceOf(ApiProblem);
    expect((over as ApiProblem).extensions).toMatchObject({ quota: 'audio_minutes', limit: 1, 'violated-policies': ['monthly-audio-minutes'] });
    await reserve(user.organisationId, 10); // exactly 60 s: allowed (used + n <= limit)
  });

  it('charges an analysis once and refunds it once', async () => {
    const user = await freshOrganisation({ analysesPerMonth: 2 });
    const analysisId = newId('analysis');
    const first = await reserveAnalysis(context.deps, user.organisationId, { analysisId, audioSeconds: 3 });
    const repeat = await reserveAnalysis(context.deps, user.organisationId, { analysisId, audioSeconds: 3 });
    expect(first.charged).toBe(true);
    expect(repeat).toMatchObject({ charged: false, analysesUsed: 1, audioSecondsUsed: 3 });
    expect(await releaseAnalysis(context.deps, user.organisationId, analysisId)).toBe(true);
    expect(await releaseAnalysis(context.deps, user.organisationId, analysisId)).toBe(false);
    await reserve(user.organisationId);
    await reserve(user.organisationId);
    await expect(reserve(user.organisationId)).rejects.toMatchObject({ code: 'quota_exceeded' });
  });

  it('rolls the charge back with the caller\'s transaction', async () => {
    const user = await freshOrganisation({ analysesPerMonth: 1 });
    await expect(
      context.deps.db.transaction(async (tx) => {
        await reserveAnalysis(context.deps, user.organisationId, { analysisId: newId('analysis'), audioSeconds: 1 }, tx);
        throw new Error('analysis insert failed');
      }),
    ).rejects.toThrow('analysis insert failed');
    await reserve(user.organisationId); // the quota of 1 is still free
  });

  it('starts a new period at the anchor month boundary', async () => {
    const user = await freshOrganisation({ analysesPerMonth: 1 });
    await reserve(user.organisationId);
    await expect(reserve(user.organisationId)).rejects.toMatchObject({ code: 'quota_exceeded' });
    const saved = clock.now();
    clock.set(usagePeriodAt(new Date('2000-01-01T00:00:00.000Z'), saved).end);
    await reserve(user.organisationId);
    clock.set(saved);
  });
});

describe('quota thresholds', () => {
  it('announces a threshold only once its charge has committed: another connection already sees the new total', async () => {
    const user = await freshOrganisation({ analysesPerMonth: 5 });
    const seen: Array<[number, number]> = [];
    const stop = onQuotaThreshold(async (notice) => {
      if (notice.organisationId !== user.organisationId) return;
      // A plain read on another pooled connection sees committed rows only (InnoDB consistent read).
      seen.push([notice.used, (await getUsageSummary(context.deps, user.organisationId)).analysesUsed]);
    });
    try {
      for (let i = 0; i < 5; i++) await reserve(user.organisationId);
    } finally {
      stop();
    }
    expect(seen).toEqual([
      [4, 4],
      [5, 5],
    ]);
  });

  it('announces 80 % and 100 % once per period, as webhook events and to listeners', async () => {
    const user = await freshOrganisation({ analysesPerMonth: 5 });
    const endpoint = await user.agent
      .post('/v1/webhook-endpoints')
      .send({ url: 'http://127.0.0.1:9/quota', eventTypes: ['quota.threshold'] });
    expect(endpoint.status).toBe(201);
    const notices: QuotaThresholdNotice[] = [];
    const stop = onQuotaThreshold((notice) => {
      if (notice.organisationId === user.organisationId) notices.push(notice);
    });
    try {
      for (let i = 0; i < 5; i++) await reserve(user.organisationId);
      await expect(reserve(user.organisationId)).rejects.toMatchObject({ code: 'quota_exceeded' });
    } finally {
      stop();
    }
    // 4 of 5 = 80 %, 5 of 5 = 100 %; audio (10 s of 60 min) crosses nothing.
    expect(notices.map((notice) => [notice.quota, notice.thresholdPercent, notice.used])).toEqual([
      ['analyses', 80, 4],
      ['analyses', 100, 5],
    ]);
    const events = (await context.deps.db.select().from(webhookEvents)).filter((event) => event.organisationId === user.organisationId);
    // Rows carry no order of their own (both can share a millisecond): compare them sorted by threshold.
    const eventData = events.map((event) => JSON.parse(event.body).data).sort((a, b) => a.thresholdPercent - b.thresholdPercent);
    expect(eventData).toEqual([
      expect.objectContaining({ quota: 'analyses', thresholdPercent: 80, used: 4, limit: 5 }),
      expect.objectContaining({ quota: 'analyses', thresholdPercent: 100, used: 5, limit: 5 }),
    ]);
    const deliveries = (await context.deps.db.select().from(webhookDeliveries)).filter((row) => row.organisationId === user.organisationId);
    expect(deliveries).toHaveLength(2);
    expect(deliveries.every((row) => row.endpointId === endpoint.body.endpoint.id && row.status === 'pending')).toBe(true);
  });
});

describe('storage quota', () => {
  it('refuses bytes over the plan\'s storage and frees them on delete', async () => {
    const user = await freshOrganisation({ storageBytes: 1000 });
    await recordStorageBytes(context.deps, user.organisationId, 600);
    await expect(recordStorageBytes(context.deps, user.organisationId, 401)).rejects.toMatchObject({ code: 'quota_exceeded', extensions: expect.objectContaining({ quota: 'storage_bytes', used: 600, limit: 1000 }) });
    expect(await recordStorageBytes(context.deps, user.organisationId, 400)).toEqual({ storageBytes: 1000 });
    expect(await recordStorageBytes(context.deps, user.organisationId, -700)).toEqual({ storageBytes: 300 });
    expect(await recordStorageBytes(context.deps, user.organisationId, -700)).toEqual({ storageBytes: 0 });
  });
});

describe('GET /v1/usage', () => {
  it('needs usage:read and shows the plan\'s upload limits', async () => {
    const usage = await request(context.app).get('/v1/usage').set(bearer(usageKey));
    expect(usage.body.planId).toBe('bench');
    // server/billing/plans.ts, plan "bench".
    expect(usage.body.uploadLimits).toEqual({ maxUploadBytes: 64e6, maxUploadDurationSeconds: 60, maxUploadChannels: 2, maxUploadSampleRateHz: 96_000 });
    const { secret } = await createApiKey(org.agent, ['calibrations:read']);
    const refused = await request(context.app).get('/v1/usage').set(bearer(secret));
    expect(refused.status).toBe(403);
    expect((await request(context.app).get('/v1/usage')).status).toBe(401);
  });
});

describe('usage periods', () => {
  it('adds months in UTC, clamping the day to the month\'s length', () => {
    // Gregorian calendar: 2024 is a leap year, 2025 is not (common practice, no source).
    expect(addMonthsUtc(new Date('2025-01-31T12:00:00.000Z'), 1).toISOString()).toBe('2025-02-28T12:00:00.000Z');
    expect(addMonthsUtc(new Date('2024-01-31T12:00:00.000Z'), 1).toISOString()).toBe('2024-02-29T12:00:00.000Z');
    expect(addMonthsUtc(new Date('2024-11-15T00:00:00.000Z'), 3).toISOString()).toBe('2025-02-15T00:00:00.000Z');
    const period = usagePeriodAt(new Date('2024-01-31T00:00:00.000Z'), new Date('2024-03-01T00:00:00.000Z'));
    expect([period.start.toISOString(), period.end.toISOString()]).toEqual(['2024-02-29T00:00:00.000Z', '2024-03-31T00:00:00.000Z']);
    const calendar = usagePeriodAt(new Date('2000-01-01T00:00:00.000Z'), new Date('2025-03-14T09:00:00.000Z'));
    expect([calendar.start.toISOString(), calendar.end.toISOString()]).toEqual(['2025-03-01T00:00:00.000Z', '2025-04-01T00:00:00.000Z']);
  });
});

describe('organisation plans from billing', () => {
  it('applies a provider plan change and finds the organisation by customer', async () => {
    const { organisationPlanBillingStore } = await import('@server/modules/usage/organisation-plan-billing-store');
    const { getOrganisationPlan } = await import('@server/modules/usage/organisation-plan.service');
    const user = await freshOrganisation({ analysesPerMonth: 7 });
    const store = organisationPlanBillingStore(context.deps);
    await store.applyPlanChange({
      organisationId: user.organisationId,
      customerId: 'cus_kestrelbay_0001',
      subscriptionId: 'sub_kestrelbay_0001',
      planId: 'line',
      subscriptionStatus: 'active',
      currentPeriodEndsAt: new Date('2025-04-14T00:00:00.000Z'),
      providerEventId: 'evt_test_1',
    });
    expect(await store.findOrganisationIdByCustomerId('cus_kestrelbay_0001')).toBe(user.organisationId);
    expect(await store.findOrganisationIdByCustomerId('cus_unknown')).toBeNull();
    const plan = await getOrganisationPlan(context.deps, user.organisationId);
    // The "line" plan's limits (server/billing/plans.ts) with the individual override kept.
    expect(plan.planId).toBe('line');
    expect(plan.limits.analysesPerMonth).toBe(7);
    expect(plan.limits.audioMinutesPerMonth).toBe(6_000);
  });
});
