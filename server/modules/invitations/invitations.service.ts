import { INVITATION_LIFETIME_DAYS, type CreateInvitationRequest, type Invitation } from '@shared/schemas/invitations';
import type { Role } from '@shared/schemas/permissions';
import type { AppDeps } from '@server/deps';
import { isDuplicateKeyError } from '@server/db/errors';
import { newId } from '@server/lib/ids';
import { ApiProblem, notFound } from '@server/http/api-problem';
import type { Principal } from '@server/http/principal';
import { recordAuditEvent } from '@server/modules/audit/audit.service';
import { normaliseEmail } from '@server/modules/auth/auth.service';
import { deliverInvitationEmail } from './invitation-email-delivery';
import { effectiveStatus, presentInvitation } from './invitation-presenter';
import { assertInvitationEmailAllowed } from './invitation-throttle';
import { newInvitationToken } from './invitation-token';
import {
  findInvitation,
  findPendingInvitationForEmail,
  insertInvitation,
  isMemberByEmail,
  listOpenInvitations,
  updateInvitation,
  type InvitationRow,
} from './invitations.repo';

const expiryFrom = (now: Date) => new Date(now.getTime() + INVITATION_LIFETIME_DAYS * 24 * 3600 * 1000);

const actsAsOwner = (principal: Principal) => principal.actor.type === 'user' && principal.actor.role === 'owner';

/** The members module's rule, applied to invitations: only an owner invites an owner or touches such an invitation. */
function refuseOwnerRoleByNonOwner(principal: Principal, role: Role) {
  if (role === 'owner' && !actsAsOwner(principal)) {
    throw new ApiProblem('owner_role_required', 'Only an owner can invite an owner or change an invitation to the owner role.');
  }
}

const invitedByUserId = (principal: Principal) => (principal.actor.type === 'user' ? principal.actor.id : null);

export async function listInvitations(deps: AppDeps, organisationId: string): Promise<Invitation[]> {
  const now = deps.clock.now();
  return (await listOpenInvitations(deps.db, organisationId)).map((row) => presentInvitation(row, now));
}

export async function createInvitation(deps: AppDeps, principal: Principal, input: CreateInvitationRequest): Promise<Invitation> {
  const organisationId = principal.organisationId;
  const email = normaliseEmail(input.email);
  refuseOwnerRoleByNonOwner(principal, input.role);
  if (await isMemberByEmail(deps.db, organisationId, email)) {
    throw new ApiProblem('already_member', `${email} is already a member of this organisation. Change their role on the Members page instead.`);
  }
  await assertInvitationEmailAllowed(deps, organisationId);

  const now = deps.clock.now();
  const { token, tokenHash } = newInvitationToken();
  const row: InvitationRow = {
    id: newId('invitation'),
    organisationId,
    email,
    role: input.role,
    status: 'pending',
    pendingEmail: email,
    tokenHash,
    expiresAt: expiryFrom(now),
    invitedByLabel: principal.actor.label.slice(0, 100),
    invitedByUserId: invitedByUserId(principal),
    emailStatus: 'not_sent',
    emailError: null,
    lastSentAt: now,
    sendCount: 1,
    acceptedByUserId: null,
    acceptedAt: null,
    revokedAt: null,
    createdAt: now,
    updatedAt: now,
  };
  try {
    await deps.db.transaction(async (tx) => {
      const open = await findPendingInvitationForEmail(tx, organisationId, email, { lock: true });
      if (open && effectiveStatus(open, now) === 'pending') throw pendingProblem(open);
      // An expired invitation to the same address gives way to the new one.
      if (open) await updateInvitation(tx, organisationId, open.id, { status: 'expired', pendingEmail: null, updatedAt: now });
      await insertInvitation(tx, organisationId, row);
      await recordAuditEvent(tx, organisationId, principal.actor, {
        action: 'invitation.created',
        objectType: 'invitation',
        objectId: row.id,
        details: { email, role: input.role, replaces: open?.id ?? null },
      }, now);
    });
  } catch (error) {
    // Two invitations to one address raced; the unique index let only one through.
    if (isDuplicateKeyError(error)) throw pendingProblem();
    throw error;
  }
  const delivery = await deliverInvitationEmail(deps, row, token);
  return presentInvitation({ ...row, ...delivery }, deps.clock.now());
}

function pendingProblem(open?: InvitationRow): ApiProblem {
  return new ApiProblem('invitation_pending', 'An invitation to this address is already pending. Resend it instead of inviting again.', {
    extensions: open ? { invitationId: open.id } : {},
  });
}

/** A new link (the previous one stops working) with a fresh expiry, and the e-mail again. */
export async function resendInvitation(deps: AppDeps, principal: Principal, invitationId: string): Promise<Invitation> {
  const organisationId = principal.organisationId;
  const existing = await findInvitation(deps.db, organisationId, invitationId);
  if (!existing) throw notFound('invitation');
  refuseOwnerRoleByNonOwner(principal, existing.role);
  if (existing.status !== 'pending') throw closedProblem(existing);
  await assertInvitationEmailAllowed(deps, organisationId);

  const now = deps.clock.now();
  const { token, tokenHash } = newInvitationToken();
  let updated: InvitationRow | undefined;
  await deps.db.transaction(async (tx) => {
    const row = await findInvitation(tx, organisationId, invitationId, { lock: true });
    if (!row) throw notFound('invitation');
    if (row.status !== 'pending') throw closedProblem(row);
    const changes = { tokenHash, expiresAt: expiryFrom(now), lastSentAt: now, sendCount: row.sendCount + 1, updatedAt: now };
    await updateInvitation(tx, organisationId, invitationId, changes);
    await recordAuditEvent(tx, organisationId, principal.actor, {
      action: 'invitation.resent',
      objectType: 'invitation',
      objectId: invitationId,
      details: { email: row.email, role: row.role, attempt: changes.sendCount },
    }, now);
    updated = { ...row, ...changes };
  });
  const delivery = await deliverInvitationEmail(deps, updated!, token);
  return presentInvitation({ ...updated!, ...delivery }, deps.clock.now());
}

export async function revokeInvitation(deps: AppDeps, principal: Principal, invitationId: string): Promise<void> {
  const organisationId = principal.organisationId;
  const existing = await findInvitation(deps.db, organisationId, invitationId);
  if (!existing) throw notFound('invitation');
  refuseOwnerRoleByNonOwner(principal, existing.role);
  const now = deps.clock.now();
  await deps.db.transaction(async (tx) => {
    const row = await findInvitation(tx, organisationId, invitationId, { lock: true });
    if (!row) throw notFound('invitation');
    if (row.status !== 'pending') throw closedProblem(row);
    await updateInvitation(tx, organisationId, invitationId, { status: 'revoked', pendingEmail: null, revokedAt: now, updatedAt: now });
    await recordAuditEvent(tx, organisationId, principal.actor, {
      action: 'invitation.revoked',
      objectType: 'invitation',
      objectId: invitationId,
      details: { email: row.email, role: row.role },
    }, now);
  });
}

function closedProblem(row: InvitationRow): ApiProblem {
  const what = row.status === 'accepted' ? 'accepted' : row.status === 'revoked' ? 'revoked' : 'replaced by a newer invitation';
  return new ApiProblem('invitation_closed', `This invitation was already ${what}.`);
}
