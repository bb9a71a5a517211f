import { and, desc, eq, gt, inArray } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { auditEvents, invitations, memberships, users } from '@server/db/tables';

export type InvitationRow = typeof invitations.$inferSelect;
export type NewInvitationRow = Omit<typeof invitations.$inferInsert, 'organisationId'>;

export async function insertInvitation(db: Executor, organisationId: string, row: NewInvitationRow): Promise<void> {
  await db.insert(invitations).values({ ...row, organisationId });
}

/** Invitations nobody has accepted or revoked yet (some may be past their expiry), newest first. */
export async function listOpenInvitations(db: Executor, organisationId: string): Promise<InvitationRow[]> {
  return db
    .select()
    .from(invitations)
    .where(and(eq(invitations.organisationId, organisationId), eq(invitations.status, 'pending')))
    .orderBy(desc(invitations.createdAt), desc(invitations.id));
}

export async function findInvitation(db: Executor, organisationId: string, invitationId: string, options: { lock?: boolean } = {}) {
  const query = db
    .select()
    .from(invitations)
    .where(and(eq(invitations.organisationId, organisationId), eq(invitations.id, invitationId)))
    .limit(1);
  const [row] = options.lock ? await query.for('update') : await query;
  return row as InvitationRow | undefined;
}

export async function findPendingInvitationForEmail(db: Executor, organisationId: string, email: string, options: { lock?: boolean } = {}) {
  const query = db
    .select()
    .from(invitations)
    .where(and(eq(invitations.organisationId, organisationId), eq(invitations.pendingEmail, email)))
    .limit(1);
  const [row] = options.lock ? await query.for('update') : await query;
  return row as InvitationRow | undefined;
}

/**
 * The one lookup not scoped by organisation: the link's token is all its holder has. The token hash is unique
 * and unguessable, so it names exactly one invitation; every later step uses that invitation's organisation.
 */
export async function findInvitationByTokenHash(db: Executor, tokenHash: string, options: { lock?: boolean } = {}) {
  const query = db.select().from(invitations).where(eq(invitations.tokenHash, tokenHash)).limit(1);
  const [row] = options.lock ? await query.for('update') : await query;
  return row as InvitationRow | undefined;
}

export async function updateInvitation(
  db: Executor,
  organisationId: string,
  invitationId: string,
  changes: Partial<Omit<typeof invitations.$inferInsert, 'id' | 'organisationId'>>,
): Promise<void> {
  await db
    .update(invitations)
    .set(changes)
    .where(and(eq(invitations.organisationId, organisationId), eq(invitations.id, invitationId)));
}

/** Whether a user with this (lower-cased) e-mail is a member of the organisation. */
export async function isMemberByEmail(db: Executor, organisationId: string, email: string): Promise<boolean> {
  const [row] = await db
    .select({ id: memberships.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.organisationId, organisationId), eq(users.email, email)))
    .limit(1);
  return row !== undefined;
}

/** When the n-th most recent invitation e-mail of the organisation after `since` was recorded, if there were n. */
export async function nthRecentInvitationEmailAt(db: Executor, organisationId: string, since: Date, n: number): Promise<Date | undefined> {
  const [row] = await db
    .select({ createdAt: auditEvents.createdAt })
    .from(auditEvents)
    .where(
      and(
        eq(auditEvents.organisationId, organisationId),
        gt(auditEvents.createdAt, since),
        inArray(auditEvents.action, ['invitation.created', 'invitation.resent']),
      ),
    )
    .orderBy(desc(auditEvents.createdAt))
    .limit(1)
    .offset(n - 1);
  return row?.createdAt;
}
