import { and, asc, eq } from 'drizzle-orm';
import type { Role } from '@shared/schemas/permissions';
import type { Executor } from '@server/db/client';
import { memberships, users } from '@server/db/tables';

export interface MemberRow {
  id: string;
  userId: string;
  email: string;
  displayName: string;
  role: Role;
  joinedAt: Date;
}

const memberColumns = {
  id: memberships.id,
  userId: memberships.userId,
  email: users.email,
  displayName: users.displayName,
  role: memberships.role,
  joinedAt: memberships.createdAt,
};

export async function insertMembership(db: Executor, organisationId: string, row: Omit<typeof memberships.$inferInsert, 'organisationId'>) {
  await db.insert(memberships).values({ ...row, organisationId });
}

/** Owners first (the enum's order), then by name. */
export async function listMembers(db: Executor, organisationId: string): Promise<MemberRow[]> {
  return db
    .select(memberColumns)
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.organisationId, organisationId))
    .orderBy(asc(memberships.role), asc(users.displayName), asc(memberships.id));
}

export async function findMember(db: Executor, organisationId: string, memberId: string): Promise<MemberRow | undefined> {
  const [row] = await db
    .select(memberColumns)
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.organisationId, organisationId), eq(memberships.id, memberId)))
    .limit(1);
  return row;
}

/**
 * Locks the organisation's owner rows (and the target row) for the rest of the transaction, so two concurrent
 * demotions cannot both see "another owner remains".
 */
export async function lockOwnersAndMember(db: Executor, organisationId: string, memberId: string) {
  const owners = await db
    .select({ id: memberships.id })
    .from(memberships)
    .where(and(eq(memberships.organisationId, organisationId), eq(memberships.role, 'owner')))
    .for('update');
  const [target] = await db
    .select({ id: memberships.id, role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.organisationId, organisationId), eq(memberships.id, memberId)))
    .for('update');
  return { ownerCount: owners.length, target };
}

export async function updateMemberRole(db: Executor, organisationId: string, memberId: string, role: Role, now: Date) {
  await db
    .update(memberships)
    .set({ role, updatedAt: now })
    .where(and(eq(memberships.organisationId, organisationId), eq(memberships.id, memberId)));
}

export async function deleteMember(db: Executor, organisationId: string, memberId: string) {
  await db.delete(memberships).where(and(eq(memberships.organisationId, organisationId), eq(memberships.id, memberId)));
}
