import { and, eq, gte, lt, sql } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { analyses } from '@server/db/tables';

export interface ProductionRow {
  status: string;
  verdict: string | null;
  serial: string | null;
  /** Only the result's `figures` (extracted in SQL, so curves never leave the database). */
  figuresJson: unknown;
}

/** Most analyses one summary reads; beyond it the summary says it is truncated by narrowing the time range. */
export const PRODUCTION_ROW_LIMIT = 100_000;

export async function listProductionRows(
  db: Executor,
  organisationId: string,
  filter: { model: string; lot?: string; from?: Date; to?: Date },
): Promise<ProductionRow[]> {
  return db
    .select({
      status: analyses.status,
      verdict: analyses.verdict,
      serial: analyses.dutSerial,
      figuresJson: sql<unknown>`JSON_EXTRACT(${analyses.resultJson}, '$.figures')`,
    })
    .from(analyses)
    .where(
      and(
        eq(analyses.organisationId, organisationId),
        eq(analyses.dutModel, filter.model),
        filter.lot !== undefined ? eq(analyses.dutLot, filter.lot) : undefined,
        filter.from ? gte(analyses.createdAt, filter.from) : undefined,
        filter.to ? lt(analyses.createdAt, filter.to) : undefined,
      ),
    )
    .limit(PRODUCTION_ROW_LIMIT);
}
