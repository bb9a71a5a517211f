import type { Request, Response } from 'express';
import type { Session } from '@shared/schemas/auth';
import type { AcceptInvitationRequest, InvitationLookup } from '@shared/schemas/invitations';
import type { AppDeps } from '@server/deps';
import type { Executor } from '@server/db/client';
import { refuseRevokedSession } from '@server/modules/auth/session-revocation';
import { isDuplicateKeyError } from '@server/db/errors';
import { newId } from '@server/lib/ids';
import { ApiProblem } from '@server/http/api-problem';
import type { SignedInUser } from '@server/http/principal';
import { recordAuditEvent } from '@server/modules/audit/audit.service';
import { switchOrganisation } from '@server/modules/auth/auth.service';
import { hashPassword } from '@server/modules/auth/passwords';
import { SESSION_COOKIE, verifySessionToken } from '@server/modules/auth/session-token';
import { findUserByEmail, findUserById, insertUser } from '@server/modules/auth/users.repo';
import { insertMembership } from '@server/modules/members/members.repo';
import { findOrganisation } from '@server/modules/organisations/organisations.repo';
import { effectiveStatus } from './invitation-presenter';
import { hashInvitationToken } from './invitation-token';
import { findInvitationByTokenHash, updateInvitation, type InvitationRow } from './invitations.repo';

/** Finds the invitation a link names, refusing one that can no longer be used (404 unknown, 410 spent). */
async function usableInvitation(db: Executor, token: string, now: Date, options: { lock?: boolean } = {}): Promise<InvitationRow> {
  const row = await findInvitationByTokenHash(db, hashInvitationToken(token), options);
  if (!row) {
    throw new ApiProblem('not_found', 'No invitation matches this link. It may have been replaced by a newer e-mail; use the latest one.');
  }
  const status = effectiveStatus(row, now);
  if (status === 'expired') {
    throw new ApiProblem('invitation_expired', `This invitation expired on ${row.expiresAt.toISOString()}. Ask an owner or admin to resend it.`);
  }
  if (status === 'revoked') throw new ApiProblem('invitation_revoked', 'This invitation was withdrawn. Ask an owner or admin if you still need access.');
  if (status === 'accepted') throw new ApiProblem('invitation_used', 'This invitation has already been accepted. Sign in instead.');
  return row;
}

export async function lookUpInvitation(deps: AppDeps, token: string): Promise<InvitationLookup> {
  const row = await usableInvitation(deps.db, token, deps.clock.now());
  const [organisation, account] = await Promise.all([findOrganisation(deps.db, row.organisationId), findUserByEmail(deps.db, row.email)]);
  return {
    organisationName: organisation?.name ?? 'Unnamed organisation',
    role: row.role,
    email: row.email,
    expiresAt: row.expiresAt.toISOString(),
    invitedBy: row.invitedByLabel,
    accountExists: account !== undefined,
  };
}

/** The signed-in user, if the request carries a valid session cookie; accepting never requires one. */
async function optionalSignedInUser(deps: AppDeps, req: Request): Promise<(SignedInUser & { email: string }) | null> {
  const token = (req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE];
  if (!token) return null;
  try {
    const claims = verifySessionToken(deps, token);
    await refuseRevokedSession(deps, claims);
    const user = await findUserById(deps.db, claims.userId);
    if (!user) return null;
    return {
      userId: user.id,
      sessionId: claims.sessionId,
      email: user.email,
      activeOrganisationId: claims.organisationId,
      authTimeSeconds: claims.authTimeSeconds,
      expiresAt: new Date(claims.expiresAtSeconds * 1000),
    };
  } catch {
    return null;
  }
}

/**
 * Joins the invited organisation with the invited role and answers with a session in it: either as the
 * signed-in user (same e-mail address as invited), or as a new account created from `displayName` and `password`.
 */
export async function acceptInvitation(deps: AppDeps, req: Request, res: Response, input: AcceptInvitationRequest): Promise<Session> {
  // Cheap refusals first: a spent link costs no password hashing.
  await usableInvitation(deps.db, input.token, deps.clock.now());
  if (input.displayName !== undefined && input.password !== undefined) {
    const { userId, organisationId } = await signUpAndJoin(deps, input.token, input.displayName, input.password);
    // Creating the account is its password sign-in: the session's maximum age counts from now.
    const signedUp: SignedInUser = {
      userId,
      activeOrganisationId: organisationId,
      authTimeSeconds: Math.floor(deps.clock.now().getTime() / 1000),
      expiresAt: deps.clock.now(),
    };
    return switchOrganisation(deps, res, signedUp, organisationId);
  }
  const user = await optionalSignedInUser(deps, req);
  if (!user) {
    throw new ApiProblem('not_authenticated', 'Sign in as the invited address to accept, or send displayName and password to create an account.');
  }
  const organisationId = await joinAsUser(deps, input.token, user.userId, user.email);
  return switchOrganisation(deps, res, user, organisationId);
}

async function markAccepted(tx: Executor, row: InvitationRow, userId: string, displayName: string, membershipId: string, now: Date) {
  await insertMembership(tx, row.organisationId, { id: membershipId, userId, role: row.role, createdAt: now, updatedAt: now });
  await updateInvitation(tx, row.organisationId, row.id, { status: 'accepted', pendingEmail: null, acceptedByUserId: userId, acceptedAt: now, updatedAt: now });
  await recordAuditEvent(tx, row.organisationId, { type: 'user', id: userId, label: displayName, membershipId, role: row.role }, {
    action: 'invitation.accepted',
    objectType: 'invitation',
    objectId: row.id,
    details: { email: row.email, role: row.role, membershipId },
  }, now);
}

async function signUpAndJoin(deps: AppDeps, token: string, displayName: string, password: string) {
  const passwordHash = await hashPassword(password);
  const now = deps.clock.now();
  const userId = newId('user');
  let organisationId = '';
  try {
    await deps.db.transaction(async (tx) => {
      const row = await usableInvitation(tx, token, now, { lock: true });
      await insertUser(tx, { id: userId, email: row.email, displayName, passwordHash, createdAt: now, updatedAt: now });
      await markAccepted(tx, row, userId, displayName, newId('membership'), now);
      organisationId = row.organisationId;
    });
  } catch (error) {
    if (isDuplicateKeyError(error)) {
      throw new ApiProblem('email_already_registered', 'An account with the invited address already exists. Sign in with it, then accept the invitation.');
    }
    throw error;
  }
  return { userId, organisationId };
}

async function joinAsUser(deps: AppDeps, token: string, userId: string, email: string): Promise<string> {
  const now = deps.clock.now();
  let organisationId = '';
  try {
    await deps.db.transaction(async (tx) => {
      const row = await usableInvitation(tx, token, now, { lock: true });
      if (row.email !== email) {
        throw new ApiProblem('invitation_email_mismatch', `This invitation was sent to ${row.email}, but you are signed in as ${email}. Sign out and use the invited address.`);
      }
      const user = await findUserById(tx, userId);
      await markAccepted(tx, row, userId, user?.displayName ?? email, newId('membership'), now);
      organisationId = row.organisationId;
    });
  } catch (error) {
    if (isDuplicateKeyError(error)) throw new ApiProblem('already_member', 'You are already a member of this organisation. Switch to it from the organisation menu.');
    throw error;
  }
  return organisationId;
}
