import { and, count, desc, eq, gte, isNotNull, lt, max, min, sql } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { analyses } from '@server/db/tables';

export interface ProductionLotRow {
  model: string | null;
  lot: string | null;
  analyses: number;
  firstCreatedAt: Date | null;
  lastCreatedAt: Date | null;
}

/** Distinct model/lot pairs of the organisation's analyses, most recently measured first, at most `limit`. */
export async function listProductionLots(db: Executor, organisationId: string, filter: { model?: string }, limit: number): Promise<ProductionLotRow[]> {
  return db
    .select({
      model: analyses.dutModel,
      lot: analyses.dutLot,
      analyses: count(),
      firstCreatedAt: min(analyses.createdAt),
      lastCreatedAt: max(analyses.createdAt),
    })
    .from(analyses)
    .where(
      and(
        eq(analyses.organisationId, organisationId),
        isNotNull(analyses.dutModel),
        filter.model !== undefined ? eq(analyses.dutModel, filter.model) : undefined,
      ),
    )
    .groupBy(analyses.dutModel, analyses.dutLot)
    .orderBy(desc(max(analyses.createdAt)), analyses.dutModel, analyses.dutLot)
    .limit(limit);
}

export interface ProductionUnitRow {
  id: string;
  serial: string | null;
  verdict: string | null;
  createdAt: Date;
  /** Only the result's `figures` (extracted in SQL, so curves never leave the database). */
  figuresJson: unknown;
}

/** Succeeded analyses of a model (and lot, time range), newest first, at most `limit`. */
export async function listProductionUnits(
  db: Executor,
  organisationId: string,
  filter: { model: string; lot?: string; from?: Date; to?: Date },
  limit: number,
): Promise<ProductionUnitRow[]> {
  return db
    .select({
      id: analyses.id,
      serial: analyses.dutSerial,
      verdict: analyses.verdict,
      createdAt: analyses.createdAt,
      figuresJson: sql<unknown>`JSON_EXTRACT(${analyses.resultJson}, '$.figures')`,
    })
    .from(analyses)
    .where(
      and(
        eq(analyses.organisationId, organisationId),
        eq(analyses.dutModel, filter.model),
        eq(analyses.status, 'succeeded'),
        filter.lot !== undefined ? eq(analyses.dutLot, filter.lot) : undefined,
        filter.from ? gte(analyses.createdAt, filter.from) : undefined,
        filter.to ? lt(analyses.createdAt, filter.to) : undefined,
      ),
    )
    .orderBy(desc(analyses.createdAt), desc(analyses.id))
    .limit(limit);
}
