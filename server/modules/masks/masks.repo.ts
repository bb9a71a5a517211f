import { and, desc, eq, sql } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { newestFirst, olderThan } from '@server/db/keyset';
import { maskVersions, masks } from '@server/db/tables';
import type { CursorPosition } from '@server/http/pagination';

export type MaskRow = typeof masks.$inferSelect;
export type MaskVersionRow = typeof maskVersions.$inferSelect;

export async function insertMask(db: Executor, organisationId: string, row: Omit<typeof masks.$inferInsert, 'organisationId'>) {
  await db.insert(masks).values({ ...row, organisationId });
}

export async function insertMaskVersion(db: Executor, organisationId: string, row: Omit<typeof maskVersions.$inferInsert, 'organisationId'>) {
  await db.insert(maskVersions).values({ ...row, organisationId });
}

export async function findMask(db: Executor, organisationId: string, maskId: string): Promise<MaskRow | undefined> {
  const [row] = await db.select().from(masks).where(and(eq(masks.organisationId, organisationId), eq(masks.id, maskId))).limit(1);
  return row;
}

/** Locks the mask row so two concurrent new versions get consecutive numbers. */
export async function findMaskForUpdate(db: Executor, organisationId: string, maskId: string): Promise<MaskRow | undefined> {
  const [row] = await db
    .select()
    .from(masks)
    .where(and(eq(masks.organisationId, organisationId), eq(masks.id, maskId)))
    .limit(1)
    .for('update');
  return row;
}

export async function findMaskVersion(db: Executor, organisationId: string, maskId: string, version: number): Promise<MaskVersionRow | undefined> {
  const [row] = await db
    .select()
    .from(maskVersions)
    .where(and(eq(maskVersions.organisationId, organisationId), eq(maskVersions.maskId, maskId), eq(maskVersions.version, version)))
    .limit(1);
  return row;
}

export async function listMaskVersions(db: Executor, organisationId: string, maskId: string): Promise<MaskVersionRow[]> {
  return db
    .select()
    .from(maskVersions)
    .where(and(eq(maskVersions.organisationId, organisationId), eq(maskVersions.maskId, maskId)))
    .orderBy(desc(maskVersions.version));
}

export async function listMasks(db: Executor, organisationId: string, page: { limit: number; after?: CursorPosition }): Promise<MaskRow[]> {
  return db
    .select()
    .from(masks)
    .where(and(eq(masks.organisationId, organisationId), olderThan(masks.createdAt, masks.id, page.after)))
    .orderBy(...newestFirst(masks.createdAt, masks.id))
    .limit(page.limit + 1);
}

export async function advanceLatestVersion(db: Executor, organisationId: string, maskId: string, version: number, at: Date) {
  await db
    .update(masks)
    .set({ latestVersion: version, updatedAt: at })
    .where(and(eq(masks.organisationId, organisationId), eq(masks.id, maskId), sql`${masks.latestVersion} = ${version - 1}`));
}
