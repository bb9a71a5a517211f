import {
  PRODUCTION_LOTS_LIMIT,
  PRODUCTION_UNITS_LIMIT,
  type ProductionLotList,
  type ProductionLotsQuery,
  type ProductionSummaryQuery,
  type ProductionUnitList,
} from '@shared/schemas/production';
import type { AppDeps } from '@server/deps';
import { invalidField } from '@server/http/api-problem';
import { sensitivityOf, thdFAtOneKilohertzOf } from './figure-readers';
import { listProductionLots, listProductionUnits } from './production-listings.repo';
import { parseFigures } from './production.service';

const VERDICTS = new Set(['pass', 'fail', 'incomplete']);

/** The models and lots the organisation has measured, so a console can offer them as choices. */
export async function productionLots(deps: AppDeps, orgId: string, query: ProductionLotsQuery): Promise<ProductionLotList> {
  const rows = await listProductionLots(deps.db, orgId, { model: query.model }, PRODUCTION_LOTS_LIMIT + 1);
  return {
    data: rows.slice(0, PRODUCTION_LOTS_LIMIT).map((row) => ({
      model: row.model ?? '',
      lot: row.lot,
      analyses: Number(row.analyses),
      firstCreatedAt: new Date(row.firstCreatedAt ?? 0).toISOString(),
      lastCreatedAt: new Date(row.lastCreatedAt ?? 0).toISOString(),
    })),
    truncated: rows.length > PRODUCTION_LOTS_LIMIT,
  };
}

/** Each succeeded analysis of the model (and lot, range) with the same figures the summary aggregates. */
export async function productionUnits(deps: AppDeps, orgId: string, query: ProductionSummaryQuery): Promise<ProductionUnitList> {
  const from = query.from ? new Date(query.from) : undefined;
  const to = query.to ? new Date(query.to) : undefined;
  if (from && to && to.getTime() <= from.getTime()) throw invalidField('#/to', '`to` must lie after `from`.');
  const rows = await listProductionUnits(deps.db, orgId, { model: query.model, lot: query.lot, from, to }, PRODUCTION_UNITS_LIMIT + 1);
  return {
    data: rows.slice(0, PRODUCTION_UNITS_LIMIT).map((row) => {
      const figures = parseFigures(row.figuresJson) ?? {};
      return {
        analysisId: row.id,
        serial: row.serial,
        createdAt: row.createdAt.toISOString(),
        verdict: row.verdict && VERDICTS.has(row.verdict) ? (row.verdict as 'pass' | 'fail' | 'incomplete') : null,
        sensitivity: {
          dbSplAt2p83VoltsOneMetre: sensitivityOf(figures, 'dbSplAt2p83VoltsOneMetre'),
          dbSplPerVolt: sensitivityOf(figures, 'dbSplPerVolt'),
          millivoltsPerPascal: sensitivityOf(figures, 'millivoltsPerPascal'),
        },
        thdFAtOneKilohertzPercent: thdFAtOneKilohertzOf(figures),
      };
    }),
    truncated: rows.length > PRODUCTION_UNITS_LIMIT,
  };
}
