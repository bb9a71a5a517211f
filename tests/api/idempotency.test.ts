import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sha256Hex } from '@server/http/idempotency';
import { insertInProgress } from '@server/http/idempotency-records.repo';
import { pruneIdempotencyRecords } from '@server/http/idempotency';
import { idempotencyRecords } from '@server/db/tables';
import { manualClock } from '@server/lib/clock';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { bearer, createApiKey, signUp, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

// Semantics under test: IETF draft-ietf-httpapi-idempotency-key-header (409 while in progress, 422 on reuse with
// another request, 400 when required and missing) and Stripe's replay of the stored response.
const clock = manualClock(new Date(Math.ceil(Date.now() / 60_000) * 60_000));
let context: TestContext;
let owner: SignedUp;
let other: SignedUp;
let secret: string;
let otherSecret: string;

beforeAll(async () => {
  context = await createTestContext({ clock });
  owner = await signUp(context);
  other = await signUp(context, { organisationName: 'Other Lab' });
  for (const org of [owner, other]) {
    await setOrganisationPlan(context.deps, org.organisationId, { planId: 'bench', limitOverrides: { requestsPerMinute: 100_000 } });
  }
  secret = (await createApiKey(owner.agent, ['calibrations:write', 'calibrations:read', 'masks:write', 'masks:read'])).secret;
  otherSecret = (await createApiKey(other.agent, ['calibrations:write', 'calibrations:read'])).secret;
});
afterAll(async () => {
  await context?.close();
});

let serial = 0;
const newKey = () => `kb-rig-retry-${++serial}-${Date.now()}`;
const calibrationBody = (dbfsAtOnePascal = -38) => ({ source: 'entered_dbfs', rigId: 'kb-line2-rig1', inputChannel: 0, dbfsAtOnePascal });
/** Sends exact bytes, so the test knows the fingerprint the server computes. */
const postCalibration = (key: string | null, body: unknown, token = secret) => {
  const call = request(context.app).post('/v1/calibrations').set(bearer(token)).set('Content-Type', 'application/json');
  if (key !== null) call.set('Idempotency-Key', key);
  return call.send(JSON.stringify(body));
};
const calibrationCount = async (token = secret) => {
  const list = await request(context.app).get('/v1/calibrations').query({ limit: 100 }).set(bearer(token));
  expect(list.status).toBe(200);
  return list.body.data.length as number;
};

describe('Idempotency-Key', () => {
  it('is required on POST /v1/calibrations, and its format is checked first', async () => {
    const before = await calibrationCount();
    const missing = await postCalibration(null, calibrationBody());
    expect(missing.status).toBe(400);
    expect(missing.body.code).toBe('idempotency_key_missing');
    expect(missing.body.detail).toContain('Idempotency-Key');
    for (const bad of ['has space', 'x'.repeat(256), 'tab\there']) {
      const invalid = await postCalibration(bad, calibrationBody());
      expect(invalid.status, bad).toBe(400);
      expect(invalid.body.code).toBe('idempotency_key_invalid');
    }
    expect(await calibrationCount()).toBe(before);
  });

  it('replays the stored response for the same key and body, marked Idempotent-Replayed', async () => {
    const before = await calibrationCount();
    const key = newKey();
    const first = await postCalibration(key, calibrationBody(-37.5));
    expect(first.status).toBe(201);
    expect(first.headers['idempotent-replayed']).toBeUndefined();
    clock.advanceSeconds(30);
    const again = await postCalibration(key, calibrationBody(-37.5));
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.headers.location).toBe(first.headers.location);
    expect(again.body).toEqual(first.body);
    expect(await calibrationCount()).toBe(before + 1);
  });

  it('answers 422 idempotency_key_reused when the same key comes with another body', async () => {
    const key = newKey();
    expect((await postCalibration(key, calibrationBody(-40))).status).toBe(201);
    const reused = await postCalibration(key, calibrationBody(-41));
    expect(reused.status).toBe(422);
    expect(reused.body.code).toBe('idempotency_key_reused');
  });

  it('answers 409 idempotency_request_in_progress while the first request runs', async () => {
    const key = newKey();
    const body = calibrationBody(-42);
    // The first request's claim, as the router writes it when the handler starts.
    await insertInProgress(context.deps.db, { organisationId: owner.organisationId, method: 'POST', routeTemplate: '/calibrations', idempotencyKey: key }, {
      fingerprint: sha256Hex(JSON.stringify(body)),
      createdAt: clock.now(),
      expiresAt: new Date(clock.now().getTime() + 86_400_000),
    });
    const before = await calibrationCount();
    const second = await postCalibration(key, body);
    expect(second.status).toBe(409);
    expect(second.body.code).toBe('idempotency_request_in_progress');
    expect(second.headers['retry-after']).toBe('1');
    expect(await calibrationCount()).toBe(before);
  });

  it('lets parallel retries with one key create exactly one object', async () => {
    const before = await calibrationCount();
    const key = newKey();
    const responses = await Promise.all(Array.from({ length: 12 }, () => postCalibration(key, calibrationBody(-36))));
    const created = responses.filter((response) => response.status === 201);
    expect(responses.every((response) => response.status === 201 || response.status === 409)).toBe(true);
    expect(created.length).toBeGreaterThanOrEqual(1);
    expect(new Set(created.map((response) => response.body.id)).size).toBe(1);
    expect(responses.filter((response) => response.status === 201 && response.headers['idempotent-replayed'] !== 'true')).toHaveLength(1);
    expect(await calibrationCount()).toBe(before + 1);
    // After the race, every retry gets the one stored response.
    const late = await postCalibration(key, calibrationBody(-36));
    expect(late.status).toBe(201);
    expect(late.body.id).toBe(created[0].body.id);
  });

  it('stores nothing for a request refused by validation, so the corrected retry succeeds', async () => {
    const key = newKey();
    const invalid = await postCalibration(key, { ...calibrationBody(), dbfsAtOnePascal: 'loud' });
    expect(invalid.status).toBe(400);
    const refused = await postCalibration(key, { ...calibrationBody(), validFrom: new Date(clock.now().getTime() + 3600_000).toISOString(), validUntil: clock.now().toISOString() });
    expect(refused.status).toBe(400);
    const corrected = await postCalibration(key, calibrationBody(-35));
    expect(corrected.status).toBe(201);
    expect(corrected.headers['idempotent-replayed']).toBeUndefined();
  });

  it('scopes keys by organisation and by endpoint', async () => {
    const key = newKey();
    const mine = await postCalibration(key, calibrationBody(-34));
    const theirs = await postCalibration(key, calibrationBody(-34), otherSecret);
    expect(mine.status).toBe(201);
    expect(theirs.status).toBe(201);
    expect(theirs.headers['idempotent-replayed']).toBeUndefined();
    expect(theirs.body.id).not.toBe(mine.body.id);
    const mask = await request(context.app)
      .post('/v1/masks')
      .set(bearer(secret))
      .set('Idempotency-Key', key)
      .send({ name: 'KB-65 limits', levelReference: 'absolute', upper: [{ frequencyHz: 100, levelDb: 95 }, { frequencyHz: 5000, levelDb: 95 }] });
    expect(mask.status).toBe(201);
  });

  it('replays API-key creation (optional key) instead of minting a second key', async () => {
    const key = newKey();
    const body = { name: 'KB-T25 rig', scopes: ['calibrations:read'] };
    const first = await owner.agent.post('/v1/api-keys').set('Idempotency-Key', key).send(body);
    const again = await owner.agent.post('/v1/api-keys').set('Idempotency-Key', key).send(body);
    expect(first.status).toBe(201);
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body.apiKey.id).toBe(first.body.apiKey.id);
  });

  it('keeps records 24 h: afterwards the key is new again, and pruning removes them', async () => {
    const key = newKey();
    const first = await postCalibration(key, calibrationBody(-33));
    expect(first.status).toBe(201);
    clock.advanceSeconds(24 * 3600 - 1);
    expect((await postCalibration(key, calibrationBody(-33))).headers['idempotent-replayed']).toBe('true');
    clock.advanceSeconds(2);
    const fresh = await postCalibration(key, calibrationBody(-33));
    expect(fresh.status).toBe(201);
    expect(fresh.headers['idempotent-replayed']).toBeUndefined();
    expect(fresh.body.id).not.toBe(first.body.id);

    const rowsBefore = (await context.deps.db.select().from(idempotencyRecords)).length;
    clock.advanceSeconds(24 * 3600 + 1);
    const pruned = await pruneIdempotencyRecords(context.deps);
    expect(pruned).toBe(rowsBefore);
    expect(await context.deps.db.select().from(idempotencyRecords)).toHaveLength(0);
  });

});
