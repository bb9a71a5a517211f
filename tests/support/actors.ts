import request from 'supertest';
import { expect } from 'vitest';
import type { Session } from '@shared/schemas/auth';
import type { CreatedApiKey } from '@shared/schemas/api-keys';
import type { Permission, Role } from '@shared/schemas/permissions';
import { newId } from '@server/lib/ids';
import { randomBase62 } from '@server/lib/random';
import { insertMembership, listMembers } from '@server/modules/members/members.repo';
import type { TestContext } from './test-app';

export type Agent = ReturnType<typeof request.agent>;

/** A cookie-keeping client that behaves like the console in a browser: it sends the console's Origin. */
export function browserAgent(context: TestContext): Agent {
  const agent = request.agent(context.app);
  agent.set('Origin', context.origin);
  return agent;
}

export function uniqueEmail(label: string): string {
  return `${label}.${randomBase62(8).toLowerCase()}@kestrelbay.example`;
}

export const bearer = (secret: string) => ({ Authorization: `Bearer ${secret}` });

export interface SignedUp {
  agent: Agent;
  session: Session;
  email: string;
  password: string;
  userId: string;
  organisationId: string;
  membershipId?: string;
}

export async function signUp(
  context: TestContext,
  overrides: Partial<{ email: string; password: string; displayName: string; organisationName: string }> = {},
): Promise<SignedUp> {
  const agent = browserAgent(context);
  const body = {
    email: overrides.email ?? uniqueEmail('engineer'),
    password: overrides.password ?? 'kb65-woofer-sweep-pass',
    displayName: overrides.displayName ?? 'Ada Okafor',
    organisationName: overrides.organisationName ?? 'Kestrel Bay Acoustics',
  };
  const response = await agent.post('/v1/auth/sign-up').send(body);
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  const session = response.body as Session;
  return { agent, session, email: body.email, password: body.password, userId: session.user.id, organisationId: session.activeOrganisation.id };
}

export type Member = SignedUp & { membershipId: string; role: Role };

/**
 * Adds an existing user to an organisation directly in the database (a shortcut for tests about something other
 * than joining; tests/api/invitations.test.ts covers the real path) and switches that user's session to it.
 */
export async function joinOrganisation(context: TestContext, user: SignedUp, organisationId: string, role: Role): Promise<Member> {
  const membershipId = newId('membership');
  const now = context.deps.clock.now();
  await insertMembership(context.deps.db, organisationId, { id: membershipId, userId: user.userId, role, createdAt: now, updatedAt: now });
  const switched = await user.agent.post('/v1/auth/active-organisation').send({ organisationId });
  expect(switched.status, JSON.stringify(switched.body)).toBe(200);
  return { ...user, session: switched.body as Session, organisationId, membershipId, role };
}

export interface OrganisationWithRoles {
  organisationId: string;
  owner: Member;
  admin: Member;
  analyst: Member;
  viewer: Member;
}

/** An organisation with one member per role, each with a signed-in browser session on it. */
export async function organisationWithRoles(context: TestContext, name = 'Kestrel Bay Acoustics'): Promise<OrganisationWithRoles> {
  const ownerSignUp = await signUp(context, { organisationName: name, displayName: 'Ines Halvorsen', email: uniqueEmail('owner') });
  const ownerRow = (await listMembers(context.deps.db, ownerSignUp.organisationId)).find((row) => row.userId === ownerSignUp.userId);
  const owner: Member = { ...ownerSignUp, membershipId: ownerRow!.id, role: 'owner' };
  const others: Record<'admin' | 'analyst' | 'viewer', Member> = {} as never;
  for (const role of ['admin', 'analyst', 'viewer'] as const) {
    const user = await signUp(context, { organisationName: `${role} sandbox`, displayName: `KB ${role}`, email: uniqueEmail(role) });
    others[role] = await joinOrganisation(context, user, ownerSignUp.organisationId, role);
  }
  return { organisationId: ownerSignUp.organisationId, owner, ...others };
}

export async function createApiKey(
  agent: Agent,
  scopes: Permission[],
  extra: { name?: string; expiresAt?: string } = {},
): Promise<CreatedApiKey> {
  const response = await agent.post('/v1/api-keys').send({ name: extra.name ?? 'KB-65 line 2 rig', scopes, ...(extra.expiresAt ? { expiresAt: extra.expiresAt } : {}) });
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body as CreatedApiKey;
}
