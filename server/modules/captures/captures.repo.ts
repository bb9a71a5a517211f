import { and, eq, sql } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { newestFirst, olderThan } from '@server/db/keyset';
import { analyses, captures } from '@server/db/tables';
import type { CursorPosition } from '@server/http/pagination';

export type CaptureRow = typeof captures.$inferSelect;

export async function insertCapture(db: Executor, organisationId: string, row: Omit<typeof captures.$inferInsert, 'organisationId'>) {
  await db.insert(captures).values({ ...row, organisationId });
}

export async function findCapture(db: Executor, organisationId: string, captureId: string): Promise<CaptureRow | undefined> {
  const [row] = await db
    .select()
    .from(captures)
    .where(and(eq(captures.organisationId, organisationId), eq(captures.id, captureId)))
    .limit(1);
  return row;
}

export async function listCaptures(db: Executor, organisationId: string, page: { limit: number; after?: CursorPosition }): Promise<CaptureRow[]> {
  return db
    .select()
    .from(captures)
    .where(and(eq(captures.organisationId, organisationId), olderThan(captures.createdAt, captures.id, page.after)))
    .orderBy(...newestFirst(captures.createdAt, captures.id))
    .limit(page.limit + 1);
}

/** Ids of the organisation's analyses that use the capture (at most `limit`), newest first. */
export async function analysesUsingCapture(db: Executor, organisationId: string, captureId: string, limit: number): Promise<string[]> {
  const rows = await db
    .select({ id: analyses.id })
    .from(analyses)
    .where(and(eq(analyses.organisationId, organisationId), eq(analyses.captureId, captureId)))
    .orderBy(...newestFirst(analyses.createdAt, analyses.id))
    .limit(limit);
  return rows.map((row) => row.id);
}

export async function deleteCaptureRow(db: Executor, organisationId: string, captureId: string): Promise<boolean> {
  const [result] = await db.delete(captures).where(and(eq(captures.organisationId, organisationId), eq(captures.id, captureId)));
  return result.affectedRows === 1;
}

/**
 * The one query across organisations: whether any capture still points at a blob before the blob is removed
 * (blobs are shared by content). It reads only a count, never another organisation's data.
 */
export async function countCapturesWithBlob(db: Executor, sha256: string): Promise<number> {
  const [row] = await db.select({ count: sql<number>`count(*)` }).from(captures).where(eq(captures.sha256, sha256));
  return Number(row?.count ?? 0);
}
