import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@server/app';
import { rateLimitWindows } from '@server/db/tables';
import { pruneRateLimitWindows } from '@server/http/rate-limit';
import { manualClock } from '@server/lib/clock';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { bearer, createApiKey, signUp, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

// Header syntax: IETF draft-ietf-httpapi-ratelimit-headers-11 (RateLimit-Policy: "name";q=..;w=..,
// RateLimit: "name";r=..;t=..); Retry-After in delay-seconds, RFC 9110 §10.2.3.
const start = new Date(Math.ceil(Date.now() / 60_000) * 60_000 + 37_000); // 37 s into a minute window
const clock = manualClock(start);
let context: TestContext;
let owner: SignedUp;

beforeAll(async () => {
  context = await createTestContext({ clock });
  owner = await signUp(context);
  await setOrganisationPlan(context.deps, owner.organisationId, { planId: 'bench', limitOverrides: { requestsPerMinute: 5 } });
});
afterAll(async () => {
  await context?.close();
});

const get = (secret: string, path = '/v1/usage', app = context.app) => request(app).get(path).set(bearer(secret));

describe('per-key rate limit', () => {
  it('sends RateLimit-Policy and RateLimit, then 429 with Retry-After and quota_exceeded', async () => {
    const { secret } = await createApiKey(owner.agent, ['usage:read']);
    for (let i = 1; i <= 5; i++) {
      const response = await get(secret);
      expect(response.status).toBe(200);
      expect(response.headers['ratelimit-policy']).toBe('"per-minute";q=5;w=60');
      // 37 s into the window: 23 s until it resets.
      expect(response.headers.ratelimit).toBe(`"per-minute";r=${5 - i};t=23`);
      expect(response.headers['x-ratelimit-limit']).toBeUndefined();
    }
    const refused = await get(secret);
    expect(refused.status).toBe(429);
    expect(refused.headers['retry-after']).toBe('23');
    expect(refused.headers.ratelimit).toBe('"per-minute";r=0;t=23');
    expect(refused.body).toMatchObject({ code: 'quota_exceeded', status: 429, 'violated-policies': ['per-minute'], limit: 5, retryAfterSeconds: 23 });

    clock.advanceSeconds(23); // next window
    const later = await get(secret);
    expect(later.status).toBe(200);
    expect(later.headers.ratelimit).toBe('"per-minute";r=4;t=60');
    clock.set(start);
  });

  it('counts each key on its own', async () => {
    const first = await createApiKey(owner.agent, ['usage:read']);
    const second = await createApiKey(owner.agent, ['usage:read']);
    for (let i = 0; i < 5; i++) expect((await get(first.secret)).status).toBe(200);
    expect((await get(first.secret)).status).toBe(429);
    expect((await get(second.secret)).status).toBe(200);
  });

  it('does not charge requests refused as unauthenticated, forbidden or invalid', async () => {
    const { secret } = await createApiKey(owner.agent, ['usage:read', 'calibrations:read']);
    const noScope = await createApiKey(owner.agent, ['masks:read']);
    for (let i = 0; i < 8; i++) {
      expect((await get(secret, '/v1/calibrations?inputChannel=first')).status).toBe(400);
      expect((await get(noScope.secret)).status).toBe(403);
    }
    const ok = await get(secret);
    expect(ok.status).toBe(200);
    expect(ok.headers.ratelimit).toBe('"per-minute";r=4;t=23');
  });

  it('holds across server processes that share the database', async () => {
    const { secret } = await createApiKey(owner.agent, ['usage:read']);
    const secondProcess = createApp(context.deps, { consoleDir: null });
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await get(secret, '/v1/usage', i % 2 === 0 ? context.app : secondProcess)).status);
    expect(statuses).toEqual([200, 200, 200, 200, 200, 429]);
  });

  it('gives a signed-in console user ten times a key\'s rate', async () => {
    const response = await owner.agent.get('/v1/usage');
    expect(response.status).toBe(200);
    expect(response.headers['ratelimit-policy']).toBe('"per-minute";q=50;w=60');
  });

  it('leaves public routes alone', async () => {
    const health = await request(context.app).get('/v1/health');
    expect(health.headers['ratelimit-policy']).toBeUndefined();
  });

  it('prunes finished windows', async () => {
    expect((await context.deps.db.select().from(rateLimitWindows)).length).toBeGreaterThan(0);
    clock.advanceSeconds(3 * 60);
    await pruneRateLimitWindows(context.deps);
    expect(await context.deps.db.select().from(rateLimitWindows)).toHaveLength(0);
    clock.set(start);
  });
});
