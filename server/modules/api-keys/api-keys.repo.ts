import { and, eq, isNull, lt, or } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { newestFirst, olderThan } from '@server/db/keyset';
import { apiKeys, users } from '@server/db/tables';
import type { CursorPosition } from '@server/http/pagination';

export type ApiKeyRow = typeof apiKeys.$inferSelect;
export type ApiKeyWithCreator = ApiKeyRow & { creatorDisplayName: string | null };

const withCreator = {
  id: apiKeys.id,
  organisationId: apiKeys.organisationId,
  name: apiKeys.name,
  prefix: apiKeys.prefix,
  lastFour: apiKeys.lastFour,
  secretHash: apiKeys.secretHash,
  scopes: apiKeys.scopes,
  createdByUserId: apiKeys.createdByUserId,
  createdAt: apiKeys.createdAt,
  expiresAt: apiKeys.expiresAt,
  lastUsedAt: apiKeys.lastUsedAt,
  revokedAt: apiKeys.revokedAt,
  creatorDisplayName: users.displayName,
};

export async function insertApiKey(db: Executor, organisationId: string, row: Omit<typeof apiKeys.$inferInsert, 'organisationId'>) {
  await db.insert(apiKeys).values({ ...row, organisationId });
}

export async function findApiKey(db: Executor, organisationId: string, keyId: string): Promise<ApiKeyWithCreator | undefined> {
  const [row] = await db
    .select(withCreator)
    .from(apiKeys)
    .leftJoin(users, eq(users.id, apiKeys.createdByUserId))
    .where(and(eq(apiKeys.organisationId, organisationId), eq(apiKeys.id, keyId)))
    .limit(1);
  return row;
}

export async function listApiKeys(
  db: Executor,
  organisationId: string,
  page: { limit: number; after?: CursorPosition },
): Promise<ApiKeyWithCreator[]> {
  return db
    .select(withCreator)
    .from(apiKeys)
    .leftJoin(users, eq(users.id, apiKeys.createdByUserId))
    .where(and(eq(apiKeys.organisationId, organisationId), olderThan(apiKeys.createdAt, apiKeys.id, page.after)))
    .orderBy(...newestFirst(apiKeys.createdAt, apiKeys.id))
    .limit(page.limit + 1);
}

/** Returns whether this call revoked the key (false when it was already revoked). */
export async function markRevoked(db: Executor, organisationId: string, keyId: string, revokedAt: Date): Promise<boolean> {
  const [result] = await db
    .update(apiKeys)
    .set({ revokedAt })
    .where(and(eq(apiKeys.organisationId, organisationId), eq(apiKeys.id, keyId), isNull(apiKeys.revokedAt)));
  return result.affectedRows === 1;
}

/** Writes lastUsedAt unless it was written within `minIntervalSeconds`, so busy rigs do not write per request. */
export async function touchLastUsed(db: Executor, organisationId: string, keyId: string, now: Date, minIntervalSeconds: number) {
  const staleBefore = new Date(now.getTime() - minIntervalSeconds * 1000);
  await db
    .update(apiKeys)
    .set({ lastUsedAt: now })
    .where(
      and(
        eq(apiKeys.organisationId, organisationId),
        eq(apiKeys.id, keyId),
        or(isNull(apiKeys.lastUsedAt), lt(apiKeys.lastUsedAt, staleBefore)),
      ),
    );
}

/**
 * The one lookup not scoped by organisation: authentication, where the key is what tells the organisation.
 * The prefix only narrows the search; the caller compares the full hash in constant time.
 */
export async function findKeysForAuthentication(db: Executor, prefix: string): Promise<ApiKeyRow[]> {
  return db.select().from(apiKeys).where(eq(apiKeys.prefix, prefix)).limit(10);
}
