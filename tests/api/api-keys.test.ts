import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiKeySchema, createdApiKeySchema } from '@shared/schemas/api-keys';
import { sha256Hex } from '@server/lib/crypto';
import { manualClock } from '@server/lib/clock';
import { apiKeys } from '@server/db/tables';
import { bearer, createApiKey, signUp, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

const clock = manualClock(new Date(Math.ceil(Date.now() / 60_000) * 60_000));
let context: TestContext;
let owner: SignedUp;
beforeAll(async () => {
  context = await createTestContext({ clock });
  owner = await signUp(context);
});
afterAll(async () => {
  await context?.close();
});

const api = () => request(context.app);

describe('API key lifecycle', () => {
  it('creates a key whose secret is shown once and stored only as a hash', async () => {
    const response = await owner.agent
      .post('/v1/api-keys')
      .set('Idempotency-Key', '6f1d2c3a-8b4e-4f5a-9c7d-1e2f3a4b5c6d')
      .send({ name: 'KB-65 line 2 rig', scopes: ['captures:write', 'analyses:read'] });
    expect(response.status).toBe(201);
    const created = createdApiKeySchema.parse(response.body);
    expect(created.secret).toMatch(/^swl_live_[0-9A-Za-z]{43}$/);
    expect(created.apiKey).toMatchObject({
      name: 'KB-65 line 2 rig',
      scopes: ['captures:write', 'analyses:read'],
      status: 'active',
      prefix: created.secret.slice(0, 17),
      lastFour: created.secret.slice(-4),
      expiresAt: null,
      lastUsedAt: null,
      revokedAt: null,
      createdBy: { id: owner.userId, displayName: 'Ada Okafor' },
    });

    const rows = await context.deps.db.select().from(apiKeys);
    const row = rows.find((candidate) => candidate.id === created.apiKey.id)!;
    expect(row.secretHash).toBe(sha256Hex(created.secret));
    expect(JSON.stringify(rows)).not.toContain(created.secret);

    const list = await owner.agent.get('/v1/api-keys');
    expect(list.status).toBe(200);
    expect(JSON.stringify(list.body)).not.toContain(created.secret);
    expect(list.body.data.map((key: { id: string }) => key.id)).toContain(created.apiKey.id);
  });

  it('create → use → revoke → 401 on the very next request', async () => {
    const { apiKey, secret } = await createApiKey(owner.agent, ['members:read']);
    expect((await api().get('/v1/members').set(bearer(secret))).status).toBe(200);

    const current = await api().get('/v1/api-keys/current').set(bearer(secret));
    expect(current.status).toBe(200);
    expect(current.body.apiKey.id).toBe(apiKey.id);
    expect(current.body.organisation).toEqual({ id: owner.organisationId, name: 'Kestrel Bay Acoustics' });

    const revoked = await owner.agent.post(`/v1/api-keys/${apiKey.id}/revoke`);
    expect(revoked.status).toBe(200);
    expect(apiKeySchema.parse(revoked.body)).toMatchObject({ status: 'revoked', revokedAt: clock.now().toISOString() });

    const refused = await api().get('/v1/members').set(bearer(secret));
    expect(refused.status).toBe(401);
    expect(refused.body.code).toBe('api_key_revoked');

    const again = await owner.agent.post(`/v1/api-keys/${apiKey.id}/revoke`);
    expect(again.status).toBe(200);
    expect(again.body.revokedAt).toBe(revoked.body.revokedAt);
  });

  it('refuses an expired key with api_key_expired and refuses expiries in the past', async () => {
    const expiresAt = new Date(clock.now().getTime() + 3600_000).toISOString();
    const { apiKey, secret } = await createApiKey(owner.agent, ['members:read'], { expiresAt });
    expect(apiKey.expiresAt).toBe(expiresAt);
    expect((await api().get('/v1/members').set(bearer(secret))).status).toBe(200);
    clock.advanceSeconds(3601);
    const expired = await api().get('/v1/members').set(bearer(secret));
    expect(expired.status).toBe(401);
    expect(expired.body.code).toBe('api_key_expired');
    const listed = (await owner.agent.get('/v1/api-keys')).body.data.find((key: { id: string }) => key.id === apiKey.id);
    expect(listed.status).toBe('expired');

    const past = await owner.agent.post('/v1/api-keys').send({ name: 'late', scopes: ['members:read'], expiresAt: '2020-01-01T00:00:00.000Z' });
    expect(past.status).toBe(400);
    expect(past.body.errors).toEqual([expect.objectContaining({ pointer: '#/expiresAt' })]);
  });

  it('distinguishes garbled, unknown and missing keys', async () => {
    const { secret } = await createApiKey(owner.agent, ['members:read']);
    const cases: Array<[Record<string, string>, string]> = [
      [bearer('swl_live_short'), 'invalid_api_key'],
      [bearer(`${secret.slice(0, -1)}${secret.endsWith('A') ? 'B' : 'A'}`), 'invalid_api_key'],
      [{ Authorization: `Basic ${Buffer.from('a:b').toString('base64')}` }, 'invalid_api_key'],
      [{ Authorization: 'Bearer' }, 'invalid_api_key'],
      [{}, 'not_authenticated'],
    ];
    for (const [headers, code] of cases) {
      const response = await api().get('/v1/members').set(headers);
      expect(response.status, JSON.stringify(headers)).toBe(401);
      expect(response.body.code).toBe(code);
    }
    expect((await api().get('/v1/members').set({ Authorization: `bearer   ${secret}` })).status).toBe(200);
  });

  it('records last use at most once a minute', async () => {
    const { apiKey, secret } = await createApiKey(owner.agent, ['members:read']);
    const lastUsed = async () => (await owner.agent.get('/v1/api-keys')).body.data.find((key: { id: string }) => key.id === apiKey.id).lastUsedAt;
    const firstUse = clock.now().toISOString();
    await api().get('/v1/members').set(bearer(secret));
    expect(await lastUsed()).toBe(firstUse);
    clock.advanceSeconds(30);
    await api().get('/v1/members').set(bearer(secret));
    expect(await lastUsed()).toBe(firstUse);
    clock.advanceSeconds(31);
    await api().get('/v1/members').set(bearer(secret));
    expect(await lastUsed()).toBe(clock.now().toISOString());
  });

  it('writes audit events for creation and revocation', async () => {
    const { apiKey, secret } = await createApiKey(owner.agent, ['keys:manage', 'audit:read'], { name: 'Audit probe' });
    clock.advanceSeconds(1); // distinct times, so newest-first order is defined
    await api().post(`/v1/api-keys/${apiKey.id}/revoke`).set(bearer(secret)); // a key may revoke itself
    const events = await owner.agent.get('/v1/audit-events').query({ objectId: apiKey.id });
    expect(events.status).toBe(200);
    expect(events.body.data.map((event: { action: string }) => event.action)).toEqual(['api_key.revoked', 'api_key.created']);
    const [revokedEvent, createdEvent] = events.body.data;
    expect(createdEvent.actor).toEqual({ type: 'user', id: owner.userId, label: 'Ada Okafor' });
    expect(createdEvent.details).toMatchObject({ name: 'Audit probe', scopes: ['keys:manage', 'audit:read'] });
    expect(revokedEvent.actor).toEqual({ type: 'api_key', id: apiKey.id, label: 'Audit probe' });
    expect(JSON.stringify(events.body)).not.toContain(secret);
  });
});

describe('scopes', () => {
  it('refuses a route whose permission the key lacks with 403 insufficient_scope naming it', async () => {
    const { secret } = await createApiKey(owner.agent, ['analyses:read']);
    const response = await api().get('/v1/api-keys').set(bearer(secret));
    expect(response.status).toBe(403);
    expect(response.body).toMatchObject({ code: 'insufficient_scope', requiredPermission: 'keys:manage' });
    expect(response.body.detail).toContain('keys:manage');
  });

  it('never lets a key create a key broader than itself', async () => {
    const { secret } = await createApiKey(owner.agent, ['keys:manage', 'analyses:read']);
    const broader = await api().post('/v1/api-keys').set(bearer(secret)).send({ name: 'escalation', scopes: ['analyses:read', 'captures:write'] });
    expect(broader.status).toBe(403);
    expect(broader.body).toMatchObject({ code: 'scope_not_held', missingScopes: ['captures:write'] });
    const narrower = await api().post('/v1/api-keys').set(bearer(secret)).send({ name: 'narrower', scopes: ['analyses:read'] });
    expect(narrower.status).toBe(201);
    expect(narrower.body.apiKey.createdBy).toBeNull();
  });

  it('refuses unknown and repeated scopes', async () => {
    const unknown = await owner.agent.post('/v1/api-keys').send({ name: 'x', scopes: ['everything'] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.errors[0].pointer).toBe('#/scopes/0');
    const repeated = await owner.agent.post('/v1/api-keys').send({ name: 'x', scopes: ['members:read', 'members:read'] });
    expect(repeated.status).toBe(400);
    const empty = await owner.agent.post('/v1/api-keys').send({ name: 'x', scopes: [] });
    expect(empty.status).toBe(400);
  });

  it('keeps console-only endpoints to sessions and the key endpoint to keys', async () => {
    const { secret } = await createApiKey(owner.agent, ['members:read']);
    expect((await api().get('/v1/auth/session').set(bearer(secret))).status).toBe(401);
    const viaSession = await owner.agent.get('/v1/api-keys/current');
    expect(viaSession.status).toBe(401);
    expect(viaSession.body.code).toBe('not_authenticated');
  });
});
