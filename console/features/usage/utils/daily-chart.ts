import type { DailyUsage } from '@shared/schemas/usage';

export type DailyMetric = 'analyses' | 'audioMinutes';

/**
 * A round axis maximum at or above `max` with `tickCount` equal steps of 1, 2 or 5 × 10^n (the usual "nice
 * numbers" steps; common practice, no source). `integer` keeps steps whole (counts); an empty chart still gets an
 * axis of one step per tick.
 */
export function niceAxis(max: number, options: { tickCount?: number; integer?: boolean } = {}): { max: number; step: number } {
  const tickCount = options.tickCount ?? 4;
  const rough = (max > 0 ? max : tickCount) / tickCount;
  const magnitude = 10 ** Math.floor(Math.log10(rough));
  const nice = [1, 2, 5, 10].map((factor) => factor * magnitude).find((candidate) => candidate >= rough * (1 - 1e-12)) ?? 10 * magnitude;
  const step = options.integer ? Math.max(1, Math.ceil(nice)) : nice;
  return { max: step * tickCount, step };
}

const DAY_MS = 86_400_000;

/**
 * One bar per UTC day of the whole period, so the chart reads against the month: the days still to come are
 * null (no bar), the days so far carry their figures.
 */
export function dailyBars(daily: DailyUsage, metric: DailyMetric): Array<{ date: string; value: number | null }> {
  const known = new Map(daily.days.map((day) => [day.date, day[metric]]));
  const first = Date.parse(`${daily.period.start.slice(0, 10)}T00:00:00.000Z`);
  const end = Date.parse(daily.period.end);
  const bars: Array<{ date: string; value: number | null }> = [];
  for (let time = first; time < end; time += DAY_MS) {
    const date = new Date(time).toISOString().slice(0, 10);
    bars.push({ date, value: known.get(date) ?? null });
  }
  return bars;
}

/** "1 Dec" for a UTC calendar day, in the reader's language. */
export function dayLabel(isoDate: string, locale?: string): string {
  return new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', timeZone: 'UTC' }).format(new Date(`${isoDate}T00:00:00Z`));
}
