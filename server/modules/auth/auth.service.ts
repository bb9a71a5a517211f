import type { Response } from 'express';
import type { Session, SignInRequest, SignUpRequest } from '@shared/schemas/auth';
import { permissionsOfRole } from '@shared/schemas/permissions';
import type { AppDeps } from '@server/deps';
import { isDuplicateKeyError } from '@server/db/errors';
import { newId } from '@server/lib/ids';
import { ApiProblem, notFound } from '@server/http/api-problem';
import type { SignedInUser } from '@server/http/principal';
import { recordAuditEvent } from '@server/modules/audit/audit.service';
import { insertMembership } from '@server/modules/members/members.repo';
import { insertOrganisation } from '@server/modules/organisations/organisations.repo';
import { hashPassword, verifyAgainstDummy, verifyPassword } from './passwords';
import { clearSessionCookie, issueSessionToken, setSessionCookie } from './session-token';
import { accountKeyOf, assertSignInAllowed, clearSignInFailures, recordSignInFailure } from './sign-in-throttle';
import { findUserByEmail, findUserById, insertUser, listMembershipsOfUser, type UserMembership } from './users.repo';

export const normaliseEmail = (email: string) => email.trim().toLowerCase();

async function sessionView(deps: AppDeps, userId: string, activeOrganisationId: string, expiresAt: Date): Promise<Session> {
  const [user, memberships] = await Promise.all([findUserById(deps.db, userId), listMembershipsOfUser(deps.db, userId)]);
  const active = memberships.find((membership) => membership.organisationId === activeOrganisationId);
  if (!user || !active) throw new ApiProblem('not_authenticated', 'The session no longer matches an account and organisation. Sign in again.');
  return {
    user: { id: user.id, email: user.email, displayName: user.displayName },
    activeOrganisation: { id: active.organisationId, name: active.organisationName, role: active.role },
    memberships: memberships.map(({ organisationId, organisationName, role }) => ({ organisationId, organisationName, role })),
    permissions: [...permissionsOfRole(active.role)],
    expiresAt: expiresAt.toISOString(),
  };
}

function startSession(deps: AppDeps, res: Response, userId: string, organisationId: string, authTimeSeconds?: number, sessionId?: string) {
  const session = issueSessionToken(deps, { userId, organisationId, authTimeSeconds, sessionId });
  setSessionCookie(res, deps, session);
  return session.expiresAt;
}

/** Creates the account, its organisation and the owner membership in one transaction. */
export async function createAccount(
  deps: AppDeps,
  input: SignUpRequest,
): Promise<{ userId: string; organisationId: string; membershipId: string }> {
  const now = deps.clock.now();
  const email = normaliseEmail(input.email);
  const passwordHash = await hashPassword(input.password);
  const userId = newId('user');
  const organisationId = newId('organisation');
  const membershipId = newId('membership');
  try {
    await deps.db.transaction(async (tx) => {
      await insertUser(tx, { id: userId, email, displayName: input.displayName, passwordHash, createdAt: now, updatedAt: now });
      await insertOrganisation(tx, { id: organisationId, name: input.organisationName, createdAt: now, updatedAt: now });
      await insertMembership(tx, organisationId, { id: membershipId, userId, role: 'owner', createdAt: now, updatedAt: now });
      await recordAuditEvent(tx, organisationId, { type: 'user', id: userId, label: input.displayName, membershipId, role: 'owner' }, {
        action: 'organisation.created',
        objectType: 'organisation',
        objectId: organisationId,
        details: { name: input.organisationName },
      }, now);
    });
  } catch (error) {
    // Telling that the address is taken is unavoidable without e-mail verification; sign-in never tells.
    if (isDuplicateKeyError(error)) throw new ApiProblem('email_already_registered', 'An account with this e-mail address already exists. Sign in instead.');
    throw error;
  }
  return { userId, organisationId, membershipId };
}

export async function signUp(deps: AppDeps, res: Response, input: SignUpRequest): Promise<Session> {
  const { userId, organisationId } = await createAccount(deps, input);
  return sessionView(deps, userId, organisationId, startSession(deps, res, userId, organisationId));
}

/** Unknown e-mail and wrong password get the same answer after the same amount of hashing. */
export async function signIn(deps: AppDeps, res: Response, input: SignInRequest, clientAddress: string): Promise<Session> {
  const email = normaliseEmail(input.email);
  const accountKey = accountKeyOf(email);
  await assertSignInAllowed(deps, accountKey, clientAddress);
  const user = await findUserByEmail(deps.db, email);
  const passwordMatches = user ? await verifyPassword(user.passwordHash, input.password) : await verifyAgainstDummy(input.password);
  if (!user || !passwordMatches) {
    await recordSignInFailure(deps, accountKey, clientAddress);
    throw new ApiProblem('invalid_credentials', 'The e-mail address or the password is wrong.');
  }
  await clearSignInFailures(deps, accountKey);
  const [first] = await listMembershipsOfUser(deps.db, user.id);
  if (!first) throw new ApiProblem('no_organisation', 'This account is not a member of any organisation. Ask an owner or admin to add you.');
  return sessionView(deps, user.id, first.organisationId, startSession(deps, res, user.id, first.organisationId));
}

/**
 * The current session. When the active organisation's membership has ended, the session moves to the user's
 * oldest remaining membership (and says so through activeOrganisation), or ends when none is left.
 */
export async function currentSession(deps: AppDeps, res: Response, user: SignedInUser): Promise<Session> {
  const memberships = await listMembershipsOfUser(deps.db, user.userId);
  const active: UserMembership | undefined =
    memberships.find((membership) => membership.organisationId === user.activeOrganisationId) ?? memberships[0];
  if (!active) {
    clearSessionCookie(res, deps);
    throw new ApiProblem('not_authenticated', 'This account is no longer a member of any organisation.');
  }
  const expiresAt =
    active.organisationId === user.activeOrganisationId
      ? user.expiresAt
      : startSession(deps, res, user.userId, active.organisationId, user.authTimeSeconds, user.sessionId);
  return sessionView(deps, user.userId, active.organisationId, expiresAt);
}

export async function switchOrganisation(deps: AppDeps, res: Response, user: SignedInUser, organisationId: string): Promise<Session> {
  const memberships = await listMembershipsOfUser(deps.db, user.userId);
  if (!memberships.some((membership) => membership.organisationId === organisationId)) throw notFound('organisation');
  return sessionView(deps, user.userId, organisationId, startSession(deps, res, user.userId, organisationId, user.authTimeSeconds, user.sessionId));
}
