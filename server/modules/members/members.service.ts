import type { Member } from '@shared/schemas/members';
import type { Role } from '@shared/schemas/permissions';
import type { AppDeps } from '@server/deps';
import { ApiProblem, notFound } from '@server/http/api-problem';
import type { Principal } from '@server/http/principal';
import { recordAuditEvent } from '@server/modules/audit/audit.service';
import { deleteMember, findMember, listMembers, lockOwnersAndMember, updateMemberRole, type MemberRow } from './members.repo';

function presentMember(row: MemberRow): Member {
  return { ...row, joinedAt: row.joinedAt.toISOString() };
}

const actsAsOwner = (principal: Principal) => principal.actor.type === 'user' && principal.actor.role === 'owner';

/** Admins (and API keys) manage everyone but owners; only an owner grants, changes or removes the owner role. */
function refuseOwnerChangeByNonOwner(principal: Principal, target: MemberRow, newRole?: Role) {
  if ((target.role === 'owner' || newRole === 'owner') && !actsAsOwner(principal)) {
    throw new ApiProblem('owner_role_required', 'Only an owner can grant the owner role or change or remove an owner.');
  }
}

const lastOwner = (what: string) =>
  new ApiProblem('last_owner', `This member is the organisation's only owner and cannot be ${what}. Make another member owner first.`);

export async function listOrganisationMembers(deps: AppDeps, organisationId: string): Promise<Member[]> {
  return (await listMembers(deps.db, organisationId)).map(presentMember);
}

export async function changeMemberRole(deps: AppDeps, principal: Principal, memberId: string, role: Role): Promise<Member> {
  const organisationId = principal.organisationId;
  const member = await findMember(deps.db, organisationId, memberId);
  if (!member) throw notFound('member');
  refuseOwnerChangeByNonOwner(principal, member, role);
  if (member.role === role) return presentMember(member);

  const now = deps.clock.now();
  await deps.db.transaction(async (tx) => {
    const { ownerCount, target } = await lockOwnersAndMember(tx, organisationId, memberId);
    if (!target) throw notFound('member');
    if (target.role === 'owner' && role !== 'owner' && ownerCount <= 1) throw lastOwner('demoted');
    await updateMemberRole(tx, organisationId, memberId, role, now);
    await recordAuditEvent(tx, organisationId, principal.actor, {
      action: 'member.role_changed',
      objectType: 'membership',
      objectId: memberId,
      details: { userId: member.userId, email: member.email, from: target.role, to: role },
    }, now);
  });
  return presentMember({ ...member, role });
}

export async function removeMember(deps: AppDeps, principal: Principal, memberId: string): Promise<void> {
  const organisationId = principal.organisationId;
  const member = await findMember(deps.db, organisationId, memberId);
  if (!member) throw notFound('member');
  refuseOwnerChangeByNonOwner(principal, member);

  const now = deps.clock.now();
  await deps.db.transaction(async (tx) => {
    const { ownerCount, target } = await lockOwnersAndMember(tx, organisationId, memberId);
    if (!target) throw notFound('member');
    if (target.role === 'owner' && ownerCount <= 1) throw lastOwner('removed');
    await deleteMember(tx, organisationId, memberId);
    await recordAuditEvent(tx, organisationId, principal.actor, {
      action: 'member.removed',
      objectType: 'membership',
      objectId: memberId,
      details: { userId: member.userId, email: member.email, role: target.role },
    }, now);
  });
}
