/** What a chart draws, independent of the plotting library: curves, marked x regions and filled bands. */
export interface ChartSeries {
  id: string;
  label: string;
  x: ArrayLike<number>;
  /** null = no value here (the line breaks, unless `spanGaps`). */
  y: ArrayLike<number | null>;
  colour: string;
  dash?: number[];
  width?: number;
  /** 'hollow' marks values that are only upper bounds; 'filled' shows every point. */
  markers?: 'none' | 'filled' | 'hollow';
  /** Only these indices get a marker (e.g. the bound points of a bound series); all points when absent. */
  markerIndices?: number[];
  /** Join across missing values (limit lines with few points). */
  spanGaps?: boolean;
  /** Hidden series keep their slot (legend toggles), they are only not drawn. */
  visible?: boolean;
  /** Left out of the data-table fallback and the summary (helper lines such as the other half of a split curve). */
  auxiliary?: boolean;
}

export interface ChartRegion {
  fromX: number;
  toX: number;
  fill: string;
  edge?: string;
  label: string;
}

/** Fill between two series (e.g. the upper and lower limit of a mask). */
export interface ChartBand {
  upperSeriesId: string;
  lowerSeriesId: string;
  fill: string;
}

export interface ChartSpec {
  xAxis: 'log-frequency' | 'linear';
  xLabel: string;
  xRange: [number, number];
  yLabel: string;
  /** 'log' for quantities spanning decades (distortion in %); non-positive values are not drawn there. */
  yScale?: 'linear' | 'log';
  /** Fixed y range; otherwise derived from the data. */
  yRange?: [number, number];
  /** Smallest y span shown (dB axes: 20). */
  minimumYSpan?: number;
  series: ChartSeries[];
  regions?: ChartRegion[];
  bands?: ChartBand[];
  /** Format of a y value for readouts and the data table, e.g. (v) => formatDb(v). */
  formatY?: (value: number) => string;
}

export interface AlignedData {
  /** Ascending; typed arrays are passed through to the chart as they are. */
  x: ArrayLike<number>;
  ys: ArrayLike<number | null>[];
}

function allFinite(values: ArrayLike<number | null>): boolean {
  for (let i = 0; i < values.length; i++) {
    const value = values[i];
    if (value === null || !Number.isFinite(value)) return false;
  }
  return true;
}

function sameX(a: ArrayLike<number>, b: ArrayLike<number>): boolean {
  if (a === b) return true;
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/**
 * Puts every series on one ascending x array (what the plotting library needs): the union of all x values,
 * with null where a series has no point. Series sharing one x array cost nothing extra.
 */
export function alignSeries(series: readonly Pick<ChartSeries, 'x' | 'y'>[]): AlignedData {
  if (series.length === 0) return { x: [], ys: [] };
  const first = series[0].x;
  if (series.every((s) => sameX(s.x, first))) {
    // One x axis (an overlay of curves on one grid): the arrays go to the chart without a copy; only a series
    // with non-finite values is copied, to turn them into gaps.
    return { x: first, ys: series.map((s) => (allFinite(s.y) ? s.y : Array.from(s.y, (v) => (v === null || Number.isFinite(v) ? v : null)))) };
  }
  const union = [...new Set(series.flatMap((s) => Array.from(s.x)))].sort((a, b) => a - b);
  const position = new Map(union.map((x, i) => [x, i]));
  const ys = series.map((s) => {
    const column: (number | null)[] = new Array(union.length).fill(null);
    for (let i = 0; i < s.x.length; i++) {
      const value = s.y[i];
      column[position.get(s.x[i])!] = value === null || !Number.isFinite(value) ? null : value;
    }
    return column;
  });
  return { x: union, ys };
}

/** Smallest and largest finite y of the visible series inside the x range. */
export function visibleYExtent(spec: Pick<ChartSpec, 'series' | 'xRange'>): [number, number] | null {
  let low = Infinity;
  let high = -Infinity;
  for (const series of spec.series) {
    if (series.visible === false) continue;
    for (let i = 0; i < series.x.length; i++) {
      const x = series.x[i];
      const y = series.y[i];
      if (y === null || !Number.isFinite(y) || x < spec.xRange[0] || x > spec.xRange[1]) continue;
      low = Math.min(low, y);
      high = Math.max(high, y);
    }
  }
  return low <= high ? [low, high] : null;
}
