import { ANALYSIS_KINDS, ANALYSIS_STATUSES, type AnalysisKind, type AnalysisStatus } from '@shared/schemas/analyses';

export const VERDICTS = ['pass', 'fail', 'incomplete'] as const;
export type Verdict = (typeof VERDICTS)[number];

/**
 * The history's filters as they live in the URL (so a filtered view can be bookmarked and shared). Dates are
 * calendar days in UTC: `createdFrom` = from the start of that day, `createdTo` = up to the end of that day.
 */
export interface AnalysisFilters {
  kind?: AnalysisKind;
  status?: AnalysisStatus;
  verdict?: Verdict;
  model?: string;
  serial?: string;
  lot?: string;
  tag?: string;
  /** YYYY-MM-DD */
  createdFrom?: string;
  /** YYYY-MM-DD, inclusive */
  createdTo?: string;
}

export const FILTER_NAMES = ['kind', 'status', 'verdict', 'model', 'serial', 'lot', 'tag', 'createdFrom', 'createdTo'] as const;

const DAY = /^\d{4}-\d{2}-\d{2}$/;
const isDay = (value: string) => DAY.test(value) && !Number.isNaN(Date.parse(`${value}T00:00:00Z`));

function pick<T extends string>(value: string | null, allowed: readonly T[]): T | undefined {
  return value !== null && (allowed as readonly string[]).includes(value) ? (value as T) : undefined;
}

function text(value: string | null, maxLength: number): string | undefined {
  const trimmed = value?.trim();
  return trimmed ? trimmed.slice(0, maxLength) : undefined;
}

/** Reads the filters from the URL, dropping values the API would refuse (an edited URL never breaks the page). */
export function filtersFromSearchParams(params: URLSearchParams): AnalysisFilters {
  const from = params.get('createdFrom');
  const to = params.get('createdTo');
  const filters: AnalysisFilters = {
    kind: pick(params.get('kind'), ANALYSIS_KINDS),
    status: pick(params.get('status'), ANALYSIS_STATUSES),
    verdict: pick(params.get('verdict'), VERDICTS),
    model: text(params.get('model'), 100),
    serial: text(params.get('serial'), 100),
    lot: text(params.get('lot'), 100),
    tag: text(params.get('tag'), 50),
    createdFrom: from && isDay(from) ? from : undefined,
    createdTo: to && isDay(to) ? to : undefined,
  };
  return Object.fromEntries(Object.entries(filters).filter(([, value]) => value !== undefined)) as AnalysisFilters;
}

/** Writes the filters into search params, keeping any other parameter of the page as it is. */
export function withFilters(params: URLSearchParams, filters: AnalysisFilters): URLSearchParams {
  const next = new URLSearchParams(params);
  for (const name of FILTER_NAMES) {
    const value = filters[name];
    if (value) next.set(name, value);
    else next.delete(name);
  }
  return next;
}

function nextDay(day: string): string {
  const date = new Date(`${day}T00:00:00.000Z`);
  date.setUTCDate(date.getUTCDate() + 1);
  return date.toISOString();
}

/** The API's query: days become timestamps (createdTo is exclusive there, so the day after the chosen one). */
export function toListQuery(filters: AnalysisFilters): Record<string, string | undefined> {
  const { createdFrom, createdTo, ...rest } = filters;
  return {
    ...rest,
    createdFrom: createdFrom ? new Date(`${createdFrom}T00:00:00.000Z`).toISOString() : undefined,
    createdTo: createdTo ? nextDay(createdTo) : undefined,
  };
}

export const hasFilters = (filters: AnalysisFilters) => Object.keys(filters).length > 0;
