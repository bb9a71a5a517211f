import { and, eq, getTableColumns, gte, inArray, lt, sql } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { newestFirst, olderThan } from '@server/db/keyset';
import { analyses } from '@server/db/tables';
import type { CursorPosition } from '@server/http/pagination';

export type AnalysisRow = typeof analyses.$inferSelect;

export async function insertAnalysis(db: Executor, organisationId: string, row: Omit<typeof analyses.$inferInsert, 'organisationId'>) {
  await db.insert(analyses).values({ ...row, organisationId });
}

export async function findAnalysis(db: Executor, organisationId: string, analysisId: string): Promise<AnalysisRow | undefined> {
  const [row] = await db
    .select()
    .from(analyses)
    .where(and(eq(analyses.organisationId, organisationId), eq(analyses.id, analysisId)))
    .limit(1);
  return row;
}

export async function findAnalyses(db: Executor, organisationId: string, analysisIds: string[]): Promise<AnalysisRow[]> {
  if (analysisIds.length === 0) return [];
  return db
    .select()
    .from(analyses)
    .where(and(eq(analyses.organisationId, organisationId), inArray(analyses.id, analysisIds)));
}

export interface AnalysisFilters {
  kind?: string;
  status?: string;
  verdict?: string;
  model?: string;
  serial?: string;
  lot?: string;
  tag?: string;
  createdFrom?: Date;
  createdTo?: Date;
}

export async function listAnalyses(
  db: Executor,
  organisationId: string,
  query: AnalysisFilters & { limit: number; after?: CursorPosition },
): Promise<Omit<AnalysisRow, 'resultJson'>[]> {
  // The result text can be large: lists never read it.
  const { resultJson: _resultJson, ...columns } = getTableColumns(analyses);
  return db
    .select(columns)
    .from(analyses)
    .where(
      and(
        eq(analyses.organisationId, organisationId),
        query.kind ? eq(analyses.kind, query.kind) : undefined,
        query.status ? eq(analyses.status, query.status) : undefined,
        query.verdict ? eq(analyses.verdict, query.verdict) : undefined,
        query.model ? eq(analyses.dutModel, query.model) : undefined,
        query.serial ? eq(analyses.dutSerial, query.serial) : undefined,
        query.lot ? eq(analyses.dutLot, query.lot) : undefined,
        query.tag ? sql`JSON_CONTAINS(${analyses.tags}, JSON_QUOTE(${query.tag}))` : undefined,
        query.createdFrom ? gte(analyses.createdAt, query.createdFrom) : undefined,
        query.createdTo ? lt(analyses.createdAt, query.createdTo) : undefined,
        olderThan(analyses.createdAt, analyses.id, query.after),
      ),
    )
    .orderBy(...newestFirst(analyses.createdAt, analyses.id))
    .limit(query.limit + 1);
}

/** Cancels a queued or running analysis; returns false when it had already finished. */
export async function markCanceled(db: Executor, organisationId: string, analysisId: string, now: Date): Promise<boolean> {
  const [result] = await db
    .update(analyses)
    .set({ status: 'canceled', cancelRequested: 1, leaseOwner: null, leaseExpiresAt: null, finishedAt: now, updatedAt: now })
    .where(and(eq(analyses.organisationId, organisationId), eq(analyses.id, analysisId), inArray(analyses.status, ['queued', 'running'])));
  return result.affectedRows === 1;
}
