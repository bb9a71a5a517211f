/**
 * Performance marks around a chart's life (data prepared, effect, fonts, creation, first draw), written only
 * once a page asks for them (the overlay benchmark), so ordinary use leaves the performance timeline alone.
 */
export const CHART_MARKS = ['prepare', 'effect', 'fonts', 'create', 'drawn'] as const;
export type ChartMark = (typeof CHART_MARKS)[number];

let enabled = false;

export function enableChartTiming(): void {
  enabled = true;
}

export function markChart(name: ChartMark): void {
  if (enabled) performance.mark(`sweepline:chart-${name}`);
}

/** The latest time of each mark (performance.now() scale), or null where a mark was never written. */
export function latestChartMarks(): Record<ChartMark, number | null> {
  const latest = (name: ChartMark) => performance.getEntriesByName(`sweepline:chart-${name}`).at(-1)?.startTime ?? null;
  return Object.fromEntries(CHART_MARKS.map((name) => [name, latest(name)])) as Record<ChartMark, number | null>;
}
