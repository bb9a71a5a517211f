import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { bearer, browserAgent, createApiKey, signUp, uniqueEmail, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

// What openapi/openapi.json promises about response headers, checked on real responses: Location on creates
// (RFC 9110 §15.3.2), RateLimit fields (IETF draft-ietf-httpapi-ratelimit-headers), Retry-After on 429
// (RFC 6585 §4, RFC 9110 §10.2.3), Idempotent-Replayed on a replay.
let context: TestContext;
let owner: SignedUp;
beforeAll(async () => {
  context = await createTestContext();
  owner = await signUp(context);
});
afterAll(async () => {
  await context?.close();
});

const spectrum = { kind: 'spectrum', spectrum: { frequenciesHz: [100, 1000, 10_000], magnitudeDb: [80, 85, 82], magnitudeReference: 'db_spl' } };

describe('documented response headers', () => {
  it('sign-up answers 201 with the Location of the new session', async () => {
    const response = await browserAgent(context).post('/v1/auth/sign-up').send({ email: uniqueEmail('noor'), password: 'kb65-woofer-sweep-pass', displayName: 'Noor', organisationName: 'KB lab' });
    expect(response.status).toBe(201);
    expect(response.headers.location).toBe('/v1/auth/session');
  });

  it('an API key create answers with a Location that reads the key back (without its secret)', async () => {
    const created = await owner.agent.post('/v1/api-keys').send({ name: 'KB-65 line 2 rig', scopes: ['analyses:read'] });
    expect(created.status).toBe(201);
    expect(created.headers.location).toBe(`/v1/api-keys/${created.body.apiKey.id}`);
    const read = await owner.agent.get(created.headers.location);
    expect(read.status).toBe(200);
    expect(read.body).toEqual(created.body.apiKey);
    expect(JSON.stringify(read.body)).not.toContain(created.body.secret);
    expect((await owner.agent.get('/v1/api-keys/key_doesnotexist00000000')).status).toBe(404);
  });

  it('authenticated responses carry RateLimit and RateLimit-Policy; a replay carries Idempotent-Replayed', async () => {
    const { secret } = await createApiKey(owner.agent, ['analyses:read', 'analyses:write'], { name: 'rig' });
    const key = randomUUID();
    const first = await request(context.app).post('/v1/analyses').set(bearer(secret)).set('Idempotency-Key', key).send(spectrum);
    expect(first.status).toBe(202);
    expect(first.headers['ratelimit-policy']).toMatch(/^"per-minute";q=\d+;w=60$/);
    expect(first.headers.ratelimit).toMatch(/^"per-minute";r=\d+;t=\d+$/);
    expect(first.headers['idempotent-replayed']).toBeUndefined();
    const replay = await request(context.app).post('/v1/analyses').set(bearer(secret)).set('Idempotency-Key', key).send(spectrum);
    expect(replay.headers['idempotent-replayed']).toBe('true');
    expect(replay.headers.location).toBe(first.headers.location);
  });

  it('a monthly quota refusal carries Retry-After = seconds until the period resets', async () => {
    const lab = await signUp(context, { organisationName: 'Quota lab' });
    await setOrganisationPlan(context.deps, lab.organisationId, { planId: 'plant', limitOverrides: { analysesPerMonth: 1, requestsPerMinute: 100_000 } });
    const { secret } = await createApiKey(lab.agent, ['analyses:write'], { name: 'rig' });
    expect((await request(context.app).post('/v1/analyses').set(bearer(secret)).set('Idempotency-Key', randomUUID()).send(spectrum)).status).toBe(202);
    const before = Date.now();
    const refused = await request(context.app).post('/v1/analyses').set(bearer(secret)).set('Idempotency-Key', randomUUID()).send(spectrum);
    expect(refused.status).toBe(429);
    expect(refused.body.code).toBe('quota_exceeded');
    const expected = (Date.parse(refused.body.resetsAt) - before) / 1000;
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(expected - 5);
    expect(Number(refused.headers['retry-after'])).toBeLessThanOrEqual(Math.ceil(expected));
  });
});
