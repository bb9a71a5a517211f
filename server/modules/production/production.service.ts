import type { ProductionSummary, ProductionSummaryQuery } from '@shared/schemas/production';
import type { AppDeps } from '@server/deps';
import { invalidField } from '@server/http/api-problem';
import { bandLimitsOf, sensitivityOf, thdFAtOneKilohertzOf } from './figure-readers';
import { listProductionRows } from './production.repo';
import { distributionOf } from './statistics';

/** The driver hands JSON_EXTRACT's value over parsed (a JSON-typed column) or as text, depending on the server. */
export function parseFigures(json: unknown): Record<string, unknown> | null {
  if (json && typeof json === 'object') return json as Record<string, unknown>;
  if (typeof json !== 'string' || json === '') return null;
  try {
    const value: unknown = JSON.parse(json);
    return value && typeof value === 'object' ? (value as Record<string, unknown>) : null;
  } catch {
    return null;
  }
}

/** Counts, yield and distributions of the headline figures over a model's (and lot's) analyses. */
export async function productionSummary(deps: AppDeps, orgId: string, query: ProductionSummaryQuery): Promise<ProductionSummary> {
  const from = query.from ? new Date(query.from) : undefined;
  const to = query.to ? new Date(query.to) : undefined;
  if (from && to && to.getTime() <= from.getTime()) throw invalidField('#/to', '`to` must lie after `from`.');
  const rows = await listProductionRows(deps.db, orgId, { model: query.model, lot: query.lot, from, to });

  const count = (predicate: (row: (typeof rows)[number]) => boolean) => rows.filter(predicate).length;
  const succeeded = rows.filter((row) => row.status === 'succeeded');
  const figures = succeeded.map((row) => parseFigures(row.figuresJson)).filter((value): value is Record<string, unknown> => value !== null);
  const pass = count((row) => row.status === 'succeeded' && row.verdict === 'pass');
  const fail = count((row) => row.status === 'succeeded' && row.verdict === 'fail');

  const numbers = (read: (figures: Record<string, unknown>) => number | null) =>
    figures.map(read).filter((value): value is number => value !== null);
  const byDrop = new Map<number, { lower: number[]; upper: number[] }>();
  for (const each of figures) {
    for (const limit of bandLimitsOf(each)) {
      const entry = byDrop.get(limit.dropDb) ?? { lower: [], upper: [] };
      if (limit.lowerHz !== null) entry.lower.push(limit.lowerHz);
      if (limit.upperHz !== null) entry.upper.push(limit.upperHz);
      byDrop.set(limit.dropDb, entry);
    }
  }

  return {
    filter: { model: query.model, lot: query.lot, from: query.from, to: query.to },
    counts: {
      analyses: rows.length,
      succeeded: succeeded.length,
      failed: count((row) => row.status === 'failed'),
      pending: count((row) => row.status === 'queued' || row.status === 'running'),
      canceled: count((row) => row.status === 'canceled'),
      serials: new Set(succeeded.map((row) => row.serial).filter((serial) => serial !== null)).size,
      pass,
      fail,
      incomplete: count((row) => row.status === 'succeeded' && row.verdict === 'incomplete'),
      withoutVerdict: count((row) => row.status === 'succeeded' && row.verdict === null),
    },
    yieldPercent: pass + fail > 0 ? (100 * pass) / (pass + fail) : null,
    sensitivity: {
      dbSplAt2p83VoltsOneMetre: distributionOf(numbers((f) => sensitivityOf(f, 'dbSplAt2p83VoltsOneMetre'))),
      dbSplPerVolt: distributionOf(numbers((f) => sensitivityOf(f, 'dbSplPerVolt'))),
      millivoltsPerPascal: distributionOf(numbers((f) => sensitivityOf(f, 'millivoltsPerPascal'))),
    },
    thdFAtOneKilohertzPercent: distributionOf(numbers(thdFAtOneKilohertzOf)),
    bandLimits: [...byDrop.entries()]
      .sort(([a], [b]) => a - b)
      .map(([dropDb, values]) => ({ dropDb, lowerHz: distributionOf(values.lower), upperHz: distributionOf(values.upper) })),
  };
}
