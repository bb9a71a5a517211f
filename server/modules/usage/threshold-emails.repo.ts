import { and, asc, eq, inArray, isNull } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { memberships, usageThresholdNotices, users } from '@server/db/tables';
import type { QuotaName } from './quota-problem';

export interface NoticeKey {
  periodStart: Date;
  quota: QuotaName;
  thresholdPercent: number;
}

function affected(result: unknown): number {
  return (result as [{ affectedRows: number }])[0].affectedRows;
}

function noticeIs(organisationId: string, key: NoticeKey) {
  return and(
    eq(usageThresholdNotices.organisationId, organisationId),
    eq(usageThresholdNotices.periodStart, key.periodStart),
    eq(usageThresholdNotices.quota, key.quota),
    eq(usageThresholdNotices.thresholdPercent, key.thresholdPercent),
  );
}

/**
 * Marks the notice as mailed; true for the one caller that may send. Run outside the transaction that inserted the
 * notice: the row lock makes this wait until that transaction ends, and a rolled-back notice matches no row.
 */
export async function claimNoticeForMail(db: Executor, organisationId: string, key: NoticeKey, now: Date): Promise<boolean> {
  const result = await db
    .update(usageThresholdNotices)
    .set({ notifiedAt: now })
    .where(and(noticeIs(organisationId, key), isNull(usageThresholdNotices.notifiedAt)));
  return affected(result) === 1;
}

/** After a failed send: the notice is recorded as not mailed. */
export async function releaseNoticeClaim(db: Executor, organisationId: string, key: NoticeKey): Promise<void> {
  await db.update(usageThresholdNotices).set({ notifiedAt: null }).where(noticeIs(organisationId, key));
}

/** E-mail addresses of the organisation's owners and admins, the people who can change its plan. */
export async function listOwnerAndAdminEmails(db: Executor, organisationId: string): Promise<string[]> {
  const rows = await db
    .select({ email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.organisationId, organisationId), inArray(memberships.role, ['owner', 'admin'])))
    .orderBy(asc(users.email));
  return [...new Set(rows.map((row) => row.email))];
}
