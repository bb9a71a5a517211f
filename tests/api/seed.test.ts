import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_USERS } from '@server/db/seed/demo-scenario';
import { seedDemo, type SeedStep } from '@server/db/seed/seed';
import { bearer, browserAgent } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

let context: TestContext;
beforeAll(async () => {
  context = await createTestContext();
});
afterAll(async () => {
  await context?.close();
});

describe('demo seed', () => {
  it('creates Kestrel Bay Acoustics with one user per role and a demo key shown once', async () => {
    const first = await seedDemo(context.deps);
    expect(first.createdOrganisation).toBe(true);
    expect(first.members.map((member) => member.role)).toEqual(['owner', 'admin', 'analyst', 'viewer']);
    expect(first.apiKeySecret).toMatch(/^swl_live_/);

    for (const user of DEMO_USERS) {
      const agent = browserAgent(context);
      const session = await agent.post('/v1/auth/sign-in').send({ email: user.email, password: user.password });
      expect(session.status, user.email).toBe(200);
      expect(session.body.activeOrganisation).toMatchObject({ name: 'Kestrel Bay Acoustics', role: user.role });
    }
    const key = await request(context.app).get('/v1/api-keys/current').set(bearer(first.apiKeySecret!));
    expect(key.status).toBe(200);
    expect(key.body.apiKey.scopes).toContain('analyses:write');
    expect(key.body.organisation.id).toBe(first.organisationId);
  });

  it('is idempotent: a second run adds nothing and shows no secret', async () => {
    const ran: string[] = [];
    const extra: SeedStep = { name: 'probe', run: async ({ organisationId, members }) => void ran.push(`${organisationId}:${members.analyst.email}`) };
    const second = await seedDemo(context.deps, [extra]);
    expect(second.createdOrganisation).toBe(false);
    expect(second.apiKeySecret).toBeNull();
    expect(ran).toEqual([`${second.organisationId}:analyst@kestrelbay.example`]);

    const owner = browserAgent(context);
    const session = await owner.post('/v1/auth/sign-in').send({ email: 'owner@kestrelbay.example', password: 'kestrel-owner-demo' });
    expect(session.body.memberships.map((membership: { organisationName: string }) => membership.organisationName).sort()).toEqual([
      'Kestrel Bay Acoustics',
      'Kestrel Bay Service Lab',
    ]);
    const members = await owner.get('/v1/members');
    expect(members.body.data).toHaveLength(4);
    const keys = await owner.get('/v1/api-keys');
    expect(keys.body.data).toHaveLength(1);
  });
});
