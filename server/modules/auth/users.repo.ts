import { and, asc, eq } from 'drizzle-orm';
import type { Role } from '@shared/schemas/permissions';
import type { Executor } from '@server/db/client';
import { memberships, organisations, users } from '@server/db/tables';

/** Users are global (not owned by an organisation); these lookups are keyed by the user. */
export type UserRow = typeof users.$inferSelect;

export async function findUserByEmail(db: Executor, email: string): Promise<UserRow | undefined> {
  const [row] = await db.select().from(users).where(eq(users.email, email)).limit(1);
  return row;
}

export async function findUserById(db: Executor, userId: string): Promise<UserRow | undefined> {
  const [row] = await db.select().from(users).where(eq(users.id, userId)).limit(1);
  return row;
}

export async function insertUser(db: Executor, row: typeof users.$inferInsert): Promise<void> {
  await db.insert(users).values(row);
}

export interface UserMembership {
  membershipId: string;
  organisationId: string;
  organisationName: string;
  role: Role;
}

const membershipColumns = {
  membershipId: memberships.id,
  organisationId: memberships.organisationId,
  organisationName: organisations.name,
  role: memberships.role,
};

/** The user's organisations, oldest membership first. */
export async function listMembershipsOfUser(db: Executor, userId: string): Promise<UserMembership[]> {
  return db
    .select(membershipColumns)
    .from(memberships)
    .innerJoin(organisations, eq(organisations.id, memberships.organisationId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.createdAt), asc(memberships.id));
}

export async function findMembershipOfUser(
  db: Executor,
  organisationId: string,
  userId: string,
): Promise<UserMembership | undefined> {
  const [row] = await db
    .select(membershipColumns)
    .from(memberships)
    .innerJoin(organisations, eq(organisations.id, memberships.organisationId))
    .where(and(eq(memberships.organisationId, organisationId), eq(memberships.userId, userId)))
    .limit(1);
  return row;
}
