import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, createApiKey, organisationWithRoles, type OrganisationWithRoles } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

let context: TestContext;
let a: OrganisationWithRoles;
let b: OrganisationWithRoles;
let keyOfA: { id: string; secret: string };
let keyOfB: string;
beforeAll(async () => {
  context = await createTestContext();
  a = await organisationWithRoles(context, 'Kestrel Bay Acoustics');
  b = await organisationWithRoles(context, 'Other Lab');
  const createdA = await createApiKey(a.owner.agent, ['members:read', 'keys:manage', 'audit:read']);
  keyOfA = { id: createdA.apiKey.id, secret: createdA.secret };
  keyOfB = (await createApiKey(b.owner.agent, ['members:read', 'members:manage', 'keys:manage', 'audit:read'])).secret;
});
afterAll(async () => {
  await context?.close();
});

describe('organisation isolation (another organisation\'s objects are 404, never 403)', () => {
  const asSessionOfB = () => b.owner.agent;
  const asKeyOfB = () => ({
    get: (path: string) => request(context.app).get(path).set(bearer(keyOfB)),
    patch: (path: string) => request(context.app).patch(path).set(bearer(keyOfB)),
    delete: (path: string) => request(context.app).delete(path).set(bearer(keyOfB)),
    post: (path: string) => request(context.app).post(path).set(bearer(keyOfB)),
  });

  for (const [label, client] of [['session of B', asSessionOfB], ['API key of B', asKeyOfB]] as const) {
    it(`${label} cannot change or remove A's members`, async () => {
      const change = await client().patch(`/v1/members/${a.viewer.membershipId}`).send({ role: 'admin' });
      expect(change.status).toBe(404);
      expect(change.body.code).toBe('not_found');
      const remove = await client().delete(`/v1/members/${a.viewer.membershipId}`);
      expect(remove.status).toBe(404);
      const removeOwner = await client().delete(`/v1/members/${a.owner.membershipId}`);
      expect(removeOwner.status).toBe(404);
    });

    it(`${label} cannot revoke A's key`, async () => {
      const revoke = await client().post(`/v1/api-keys/${keyOfA.id}/revoke`);
      expect(revoke.status).toBe(404);
      expect(revoke.body.code).toBe('not_found');
    });

    it(`${label} sees none of A's members, keys or audit events`, async () => {
      const members = await client().get('/v1/members');
      expect(members.body.data.map((member: { userId: string }) => member.userId)).not.toContain(a.viewer.userId);
      const keys = await client().get('/v1/api-keys');
      expect(keys.body.data.map((key: { id: string }) => key.id)).not.toContain(keyOfA.id);
      const audit = await client().get('/v1/audit-events').query({ objectId: keyOfA.id });
      expect(audit.body.data).toEqual([]);
    });
  }

  it('leaves A untouched after all those attempts', async () => {
    const members = await a.owner.agent.get('/v1/members');
    expect(members.body.data.find((member: { id: string }) => member.id === a.viewer.membershipId).role).toBe('viewer');
    expect((await request(context.app).get('/v1/api-keys/current').set(bearer(keyOfA.secret))).body.apiKey.status).toBe('active');
  });

  it('scopes A\'s key to A', async () => {
    const members = await request(context.app).get('/v1/members').set(bearer(keyOfA.secret));
    const ids = members.body.data.map((member: { userId: string }) => member.userId);
    expect(ids).toContain(a.owner.userId);
    expect(ids).not.toContain(b.owner.userId);
  });

  it('does not let a cursor from one organisation page through another', async () => {
    for (let n = 0; n < 3; n += 1) await createApiKey(a.owner.agent, ['members:read'], { name: `page ${n}` });
    const first = await a.owner.agent.get('/v1/api-keys').query({ limit: 1 });
    expect(first.body.hasMore).toBe(true);
    const replayed = await b.owner.agent.get('/v1/api-keys').query({ limit: 1, cursor: first.body.nextCursor });
    expect(replayed.status).toBe(400);
    expect(replayed.body.code).toBe('invalid_cursor');
  });
});
