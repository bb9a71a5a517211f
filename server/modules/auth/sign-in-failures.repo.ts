import { and, desc, eq, gt, lt } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { signInFailures } from '@server/db/tables';

/** Sign-in failures are keyed by account or by client address, never by organisation (none is known yet). */
export async function insertSignInFailure(db: Executor, row: typeof signInFailures.$inferInsert) {
  await db.insert(signInFailures).values(row);
}

/**
 * When the `n`-th most recent failure after `since` happened, or undefined if there were fewer than n.
 * The n-th newest is the one whose expiry lets the next attempt through.
 */
export async function nthRecentFailureAt(
  db: Executor,
  key: { accountKey: string } | { clientAddress: string },
  since: Date,
  n: number,
): Promise<Date | undefined> {
  const match = 'accountKey' in key ? eq(signInFailures.accountKey, key.accountKey) : eq(signInFailures.clientAddress, key.clientAddress);
  const [row] = await db
    .select({ createdAt: signInFailures.createdAt })
    .from(signInFailures)
    .where(and(match, gt(signInFailures.createdAt, since)))
    .orderBy(desc(signInFailures.createdAt))
    .limit(1)
    .offset(n - 1);
  return row?.createdAt;
}

export async function deleteFailuresOfAccount(db: Executor, accountKey: string) {
  await db.delete(signInFailures).where(eq(signInFailures.accountKey, accountKey));
}

export async function pruneFailuresBefore(db: Executor, before: Date) {
  await db.delete(signInFailures).where(lt(signInFailures.createdAt, before)).limit(500);
}

