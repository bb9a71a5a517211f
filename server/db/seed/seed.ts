import type { Role } from '@shared/schemas/permissions';
import { permissionsOfRole } from '@shared/schemas/permissions';
import type { AppDeps } from '@server/deps';
import { newId } from '@server/lib/ids';
import type { Principal } from '@server/http/principal';
import { createApiKey } from '@server/modules/api-keys/api-keys.service';
import { listApiKeys } from '@server/modules/api-keys/api-keys.repo';
import { createAccount, normaliseEmail } from '@server/modules/auth/auth.service';
import { hashPassword } from '@server/modules/auth/passwords';
import { findUserByEmail, insertUser, listMembershipsOfUser } from '@server/modules/auth/users.repo';
import { insertMembership, listMembers } from '@server/modules/members/members.repo';
import { insertOrganisation } from '@server/modules/organisations/organisations.repo';
import { DEMO_API_KEY, DEMO_ORGANISATION_NAME, DEMO_SECOND_ORGANISATION_NAME, DEMO_USERS, type DemoUser } from './demo-scenario';
import { demoWorkspace } from './demo-workspace';

export interface SeededMember extends DemoUser {
  userId: string;
  membershipId: string;
}

/** What later seed steps build on: the demo organisation and its members by role. */
export interface SeedContext {
  deps: AppDeps;
  organisationId: string;
  members: Record<Role, SeededMember>;
  /** Acting as the owner, for services that need a principal. */
  ownerPrincipal: Principal;
}

/** One idempotent piece of demo data. Each step must check what exists before it creates anything. */
export interface SeedStep {
  name: string;
  run(context: SeedContext): Promise<void>;
}

export interface DemoSeedResult {
  organisationId: string;
  organisationName: string;
  /** True when this run created the demo organisation. */
  createdOrganisation: boolean;
  members: SeededMember[];
  /** The demo key's secret, only on the run that created the key. */
  apiKeySecret: string | null;
}

async function ensureOrganisation(deps: AppDeps) {
  const owner = DEMO_USERS.find((user) => user.role === 'owner')!;
  const existing = await findUserByEmail(deps.db, normaliseEmail(owner.email));
  if (existing) {
    const memberships = await listMembershipsOfUser(deps.db, existing.id);
    const demo = memberships.find((membership) => membership.organisationName === DEMO_ORGANISATION_NAME) ?? memberships[0];
    if (!demo) throw new Error('The demo owner exists but belongs to no organisation; reset the development database.');
    return { organisationId: demo.organisationId, created: false };
  }
  const { organisationId } = await createAccount(deps, {
    email: owner.email,
    password: owner.password,
    displayName: owner.displayName,
    organisationName: DEMO_ORGANISATION_NAME,
  });
  return { organisationId, created: true };
}

async function ensureMember(deps: AppDeps, organisationId: string, user: DemoUser) {
  const email = normaliseEmail(user.email);
  let userId = (await findUserByEmail(deps.db, email))?.id;
  const now = deps.clock.now();
  if (!userId) {
    userId = newId('user');
    await insertUser(deps.db, { id: userId, email, displayName: user.displayName, passwordHash: await hashPassword(user.password), createdAt: now, updatedAt: now });
  }
  const member = (await listMembers(deps.db, organisationId)).find((row) => row.userId === userId);
  if (member) return { ...user, userId, membershipId: member.id };
  const membershipId = newId('membership');
  await insertMembership(deps.db, organisationId, { id: membershipId, userId, role: user.role, createdAt: now, updatedAt: now });
  return { ...user, userId, membershipId };
}

/** A second organisation for the owner, so switching organisations can be tried in the console. */
const secondOrganisation: SeedStep = {
  name: 'second organisation',
  async run({ deps, members }) {
    const memberships = await listMembershipsOfUser(deps.db, members.owner.userId);
    if (memberships.some((membership) => membership.organisationName === DEMO_SECOND_ORGANISATION_NAME)) return;
    const now = deps.clock.now();
    const organisationId = newId('organisation');
    await insertOrganisation(deps.db, { id: organisationId, name: DEMO_SECOND_ORGANISATION_NAME, createdAt: now, updatedAt: now });
    await insertMembership(deps.db, organisationId, { id: newId('membership'), userId: members.owner.userId, role: 'owner', createdAt: now, updatedAt: now });
    await insertMembership(deps.db, organisationId, { id: newId('membership'), userId: members.analyst.userId, role: 'viewer', createdAt: now, updatedAt: now });
  },
};

/** The steps `seedDemo` runs after the organisation and its members exist. Later data adds steps here. */
export const DEMO_SEED_STEPS: SeedStep[] = [secondOrganisation];

export interface SeedOptions {
  /**
   * The measured workspace (demo-workspace.ts): on by default, as `npm start` seeds it. Tests that only need the
   * users and the demo key turn it off; it takes seconds and fills the lists.
   */
  workspace?: boolean;
}

/**
 * Seeds the demo organisation of Kestrel Bay Acoustics, one user per role, a second organisation, one demo API
 * key and the measured workspace (demo-workspace.ts). Safe to run on every start: it only adds what is missing.
 * `extraSteps` run last.
 */
export async function seedDemo(deps: AppDeps, extraSteps: SeedStep[] = [], options: SeedOptions = {}): Promise<DemoSeedResult> {
  const { organisationId, created } = await ensureOrganisation(deps);
  const seeded: SeededMember[] = [];
  for (const user of DEMO_USERS) seeded.push(await ensureMember(deps, organisationId, user));
  const members = Object.fromEntries(seeded.map((member) => [member.role, member])) as Record<Role, SeededMember>;
  const owner = members.owner;
  const ownerPrincipal: Principal = {
    organisationId,
    permissions: new Set(permissionsOfRole('owner')),
    actor: { type: 'user', id: owner.userId, label: owner.displayName, membershipId: owner.membershipId, role: 'owner' },
  };
  const context: SeedContext = { deps, organisationId, members, ownerPrincipal };

  let apiKeySecret: string | null = null;
  const keys = await listApiKeys(deps.db, organisationId, { limit: 100 });
  if (!keys.some((key) => key.name === DEMO_API_KEY.name)) {
    apiKeySecret = (await createApiKey(deps, ownerPrincipal, { name: DEMO_API_KEY.name, scopes: DEMO_API_KEY.scopes })).secret;
  }
  const workspace = options.workspace === false ? [] : [demoWorkspace];
  for (const step of [...DEMO_SEED_STEPS, ...workspace, ...extraSteps]) await step.run(context);
  return { organisationId, organisationName: DEMO_ORGANISATION_NAME, createdOrganisation: created, members: seeded, apiKeySecret };
}
