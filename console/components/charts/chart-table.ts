import type { AlignedData, ChartSpec } from './chart-spec';
import { thirdOctaveGridLines } from './log-axis-ticks';

export interface ChartTableRow {
  x: number;
  /** One cell per listed series, null where the series has no value near this x. */
  values: (number | null)[];
}

function nearestIndex(sortedX: ArrayLike<number>, target: number): number {
  let low = 0;
  let high = sortedX.length - 1;
  while (high - low > 1) {
    const mid = (low + high) >> 1;
    if (sortedX[mid] < target) low = mid;
    else high = mid;
  }
  return Math.abs(sortedX[low] - target) <= Math.abs(sortedX[high] - target) ? low : high;
}

/**
 * The rows of a chart's text alternative: on a log-frequency axis one row per 1/3-octave centre (the nearest
 * data point to it), on a linear axis about `linearRows` evenly spaced rows. Only the listed series appear.
 */
export function chartTableRows(spec: ChartSpec, data: AlignedData, listed: number[], linearRows = 24): ChartTableRow[] {
  if (data.x.length === 0) return [];
  const [fromX, toX] = spec.xRange;
  const targets =
    spec.xAxis === 'log-frequency'
      ? thirdOctaveGridLines(fromX, toX).map((line) => line.frequencyHz)
      : Array.from({ length: linearRows }, (_, i) => fromX + ((toX - fromX) * i) / (linearRows - 1));
  const rows: ChartTableRow[] = [];
  for (const target of targets) {
    const index = nearestIndex(data.x, target);
    const x = data.x[index];
    if (x < fromX || x > toX || rows.some((row) => row.x === x)) continue;
    rows.push({ x, values: listed.map((seriesIndex) => data.ys[seriesIndex][index] ?? null) });
  }
  return rows;
}
