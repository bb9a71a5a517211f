import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/schemas/permissions';
import { signUp, joinOrganisation, organisationWithRoles, type Agent, type OrganisationWithRoles } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

let context: TestContext;
let org: OrganisationWithRoles;
beforeAll(async () => {
  context = await createTestContext();
  org = await organisationWithRoles(context);
});
afterAll(async () => {
  await context?.close();
});

const ROLES: Role[] = ['owner', 'admin', 'analyst', 'viewer'];

interface AdminRoute {
  name: string;
  allowed: Role[];
  /** Performs the request; makes its own target so that allowed calls succeed for every role in turn. */
  call(agent: Agent): Promise<{ status: number; body: { code?: string } }>;
  success: number;
}

async function disposableMember(role: Role = 'viewer') {
  const user = await signUp(context, { organisationName: 'throwaway' });
  return joinOrganisation(context, user, org.organisationId, role);
}

const routes: AdminRoute[] = [
  { name: 'GET /v1/members', allowed: ROLES, success: 200, call: (agent) => agent.get('/v1/members') },
  { name: 'GET /v1/permissions', allowed: ROLES, success: 200, call: (agent) => agent.get('/v1/permissions') },
  {
    name: 'PATCH /v1/members/{id}',
    allowed: ['owner', 'admin'],
    success: 200,
    call: async (agent) => agent.patch(`/v1/members/${(await disposableMember('viewer')).membershipId}`).send({ role: 'analyst' }),
  },
  {
    name: 'DELETE /v1/members/{id}',
    allowed: ['owner', 'admin'],
    success: 204,
    call: async (agent) => agent.delete(`/v1/members/${(await disposableMember('viewer')).membershipId}`),
  },
  { name: 'GET /v1/api-keys', allowed: ['owner', 'admin'], success: 200, call: (agent) => agent.get('/v1/api-keys') },
  {
    name: 'POST /v1/api-keys',
    allowed: ['owner', 'admin'],
    success: 201,
    call: (agent) => agent.post('/v1/api-keys').send({ name: 'matrix', scopes: ['analyses:read'] }),
  },
  {
    name: 'POST /v1/api-keys/{id}/revoke',
    allowed: ['owner', 'admin'],
    success: 200,
    call: async (agent) => {
      const created = await org.owner.agent.post('/v1/api-keys').send({ name: 'to revoke', scopes: ['analyses:read'] });
      return agent.post(`/v1/api-keys/${created.body.apiKey.id}/revoke`);
    },
  },
  { name: 'GET /v1/audit-events', allowed: ['owner', 'admin'], success: 200, call: (agent) => agent.get('/v1/audit-events') },
];

describe('role matrix', () => {
  for (const route of routes) {
    for (const role of ROLES) {
      const allowed = route.allowed.includes(role);
      it(`${route.name} as ${role}: ${allowed ? 'allowed' : '403'}`, async () => {
        const response = await route.call(org[role].agent);
        if (allowed) {
          expect(response.status, JSON.stringify(response.body)).toBe(route.success);
        } else {
          expect(response.status).toBe(403);
          expect(response.body.code).toBe('insufficient_permission');
        }
      });
    }
  }

  it('matches the roles the permission catalogue publishes', async () => {
    const catalogue = (await org.viewer.agent.get('/v1/permissions')).body as { roles: Array<{ role: Role; permissions: string[] }> };
    const of = (role: Role) => catalogue.roles.find((entry) => entry.role === role)!.permissions;
    for (const role of ROLES) {
      expect(of(role).includes('keys:manage')).toBe(role === 'owner' || role === 'admin');
      expect(of(role).includes('members:manage')).toBe(role === 'owner' || role === 'admin');
      expect(of(role).includes('analyses:write')).toBe(role !== 'viewer');
      expect(of(role).includes('analyses:read')).toBe(true);
    }
  });

  it('applies a role change on the member\'s next request', async () => {
    const member = await disposableMember('admin');
    expect((await member.agent.get('/v1/api-keys')).status).toBe(200);
    await org.owner.agent.patch(`/v1/members/${member.membershipId}`).send({ role: 'viewer' }).expect(200);
    const after = await member.agent.get('/v1/api-keys');
    expect(after.status).toBe(403);
    expect(after.body.requiredPermission).toBe('keys:manage');
  });
});
