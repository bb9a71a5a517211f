import { and, asc, desc, eq, getTableColumns, gte, inArray, lt, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { analyses } from '@server/db/tables';
import { afterPosition, hasKey, nullSegmentAfter, orderOf, type SortPosition, type SortSpec } from './analysis-sort';

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

function filtersWhere(organisationId: string, query: AnalysisFilters): SQL | undefined {
  return and(
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
  );
}

export type AnalysisListRow = Omit<AnalysisRow, 'resultJson'>;

/**
 * Up to limit+1 rows after `after` in the sort's (key, id) order. A nullable key is read in two segments, each an
 * index range: rows with a key first, then (once those run out) rows without one, by id.
 */
export async function listAnalyses(
  db: Executor,
  organisationId: string,
  query: AnalysisFilters & { limit: number; sort: SortSpec; after?: SortPosition },
): Promise<AnalysisListRow[]> {
  // The result text can be large: lists never read it.
  const { resultJson: _resultJson, ...columns } = getTableColumns(analyses);
  const { sort, after } = query;
  const wanted = query.limit + 1;
  const filters = filtersWhere(organisationId, query);
  const select = (where: SQL | undefined, order: SQL[], limit: number) => db.select(columns).from(analyses).where(where).orderBy(...order).limit(limit);
  const inNullSegment = sort.nullable && after !== undefined && after.key === null;
  const keyed: AnalysisListRow[] = inNullSegment
    ? []
    : await select(
        and(filters, sort.nullable ? hasKey(sort) : undefined, after && after.key !== null ? afterPosition(sort, { key: after.key, id: after.id }) : undefined),
        orderOf(sort),
        wanted,
      );
  if (!sort.nullable || keyed.length >= wanted) return keyed;
  const byId = sort.direction === 'asc' ? asc(analyses.id) : desc(analyses.id);
  const keyless = await select(and(filters, nullSegmentAfter(sort, inNullSegment ? after!.id : undefined)), [byId], wanted - keyed.length);
  return [...keyed, ...keyless];
}

/** Cancels a queued or running analysis; returns false when it had already finished. */
export async function markCanceled(db: Executor, organisationId: string, analysisId: string, now: Date): Promise<boolean> {
  const [result] = await db
    .update(analyses)
    .set({ status: 'canceled', cancelRequested: 1, leaseOwner: null, leaseExpiresAt: null, finishedAt: now, updatedAt: now })
    .where(and(eq(analyses.organisationId, organisationId), eq(analyses.id, analysisId), inArray(analyses.status, ['queued', 'running'])));
  return result.affectedRows === 1;
}
