/**
 * The production screen's choice as it lives in the URL: a model, optionally a lot, and a range of calendar days
 * in UTC (`from` from the start of that day, `to` through the end of that day).
 */
export interface ProductionFilter {
  model?: string;
  lot?: string;
  /** YYYY-MM-DD */
  from?: string;
  /** YYYY-MM-DD, inclusive */
  to?: string;
}

/** What the production endpoints take: timestamps, `to` exclusive. */
export type ProductionQuery = {
  model: string;
  lot?: string;
  from?: string;
  to?: string;
};

const NAMES = ['model', 'lot', 'from', 'to'] as const;
const DAY = /^\d{4}-\d{2}-\d{2}$/;
const isDay = (value: string | null): value is string => !!value && DAY.test(value) && !Number.isNaN(Date.parse(`${value}T00:00:00Z`));
const text = (value: string | null) => value?.trim().slice(0, 100) || undefined;

export function productionFilterFromSearchParams(params: URLSearchParams): ProductionFilter {
  const from = params.get('from');
  const to = params.get('to');
  const filter: ProductionFilter = {
    model: text(params.get('model')),
    lot: text(params.get('lot')),
    from: isDay(from) ? from : undefined,
    to: isDay(to) ? to : undefined,
  };
  return Object.fromEntries(Object.entries(filter).filter(([, value]) => value !== undefined)) as ProductionFilter;
}

export function withProductionFilter(params: URLSearchParams, filter: ProductionFilter): URLSearchParams {
  const next = new URLSearchParams(params);
  for (const name of NAMES) {
    const value = filter[name];
    if (value) next.set(name, value);
    else next.delete(name);
  }
  return next;
}

function dayAfter(day: string): string {
  const date = new Date(`${day}T00:00:00.000Z`);
  date.setUTCDate(date.getUTCDate() + 1);
  return date.toISOString();
}

/** Null until a model is chosen: the endpoints need one. */
export function toProductionQuery(filter: ProductionFilter): ProductionQuery | null {
  if (!filter.model) return null;
  return {
    model: filter.model,
    ...(filter.lot ? { lot: filter.lot } : {}),
    ...(filter.from ? { from: new Date(`${filter.from}T00:00:00.000Z`).toISOString() } : {}),
    ...(filter.to ? { to: dayAfter(filter.to) } : {}),
  };
}
