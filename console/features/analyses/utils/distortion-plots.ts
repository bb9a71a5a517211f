import { okabeIto } from '@console/components/charts/chart-palette';
import type { ChartSeries, ChartSpec } from '@console/components/charts/chart-spec';
import { formatDb, formatPercent } from '@console/components/charts/format-units';
import { splitUpperBounds } from '@console/components/charts/upper-bounds';
import { AUDIO_RANGE_HZ } from './response-plots';
import type { DistortionView, ResidualView, ScreeningView } from './result-view';

export type ThdForm = 'thd_f' | 'thd_r';

const ORDER_COLOURS = [okabeIto.blue, okabeIto.bluishGreen, okabeIto.reddishPurple, okabeIto.orange, okabeIto.skyBlue];
const positive = (values: readonly (number | null)[]) => values.map((v) => (v !== null && v > 0 ? v : null));

/** A distortion curve as two series: measured values solid, upper bounds dashed with hollow markers. */
function boundedSeries(id: string, label: string, x: number[], values: (number | null)[], isUpperBound: boolean[], colour: string, width = 1.5): ChartSeries[] {
  const { measured, bounds } = splitUpperBounds(positive(values), isUpperBound);
  const series: ChartSeries[] = [{ id, label, x, y: measured, colour, width }];
  if (isUpperBound.some(Boolean)) {
    const markerIndices = isUpperBound.flatMap((bound, i) => (bound ? [i] : []));
    series.push({ id: `${id}-bound`, label: `${label} (upper bound)`, x, y: bounds, colour, width: 1, dash: [4, 3], markers: 'hollow', markerIndices, auxiliary: true });
  }
  return series;
}

const percentAxis = {
  xAxis: 'log-frequency' as const,
  xLabel: 'Fundamental frequency (Hz)',
  xRange: AUDIO_RANGE_HZ,
  yScale: 'log' as const,
  formatY: (v: number) => formatPercent(v),
};

/** THD (the chosen form) and each harmonic order against the fundamental's frequency, in % on a log axis. */
export function distortionSpec(view: DistortionView, form: ThdForm, shownOrders: ReadonlySet<number>): ChartSpec {
  const thd = form === 'thd_f' ? view.thdFPercent : view.thdRPercent;
  const series = boundedSeries('thd', form === 'thd_f' ? 'THD_F' : 'THD_R', view.frequencyHz, thd, view.thdIsUpperBound, okabeIto.vermillion, 2.25);
  view.orders
    .filter((order) => shownOrders.has(order.order))
    .forEach((order, i) => series.push(...boundedSeries(`hd${order.order}`, `HD${order.order}`, view.frequencyHz, order.percent, order.isUpperBound, ORDER_COLOURS[i % ORDER_COLOURS.length], 1.25)));
  return { ...percentAxis, yLabel: 'Distortion (% of the fundamental)', series };
}

export function screeningSpec(view: ScreeningView): ChartSpec {
  return {
    ...percentAxis,
    yLabel: 'High-order energy (% of the fundamental)',
    series: boundedSeries('screening', 'High-order screening', view.frequencyHz, view.percent, view.isUpperBound, okabeIto.reddishPurple, 1.75),
  };
}

export function residualSpec(view: ResidualView): ChartSpec {
  return {
    xAxis: 'log-frequency',
    xLabel: 'Frequency (Hz)',
    xRange: AUDIO_RANGE_HZ,
    yLabel: 'Level (dB re the fundamental)',
    series: [{ id: 'residual', label: 'Residual spectrum', x: view.frequencyHz, y: view.levelDbRelFundamental, colour: okabeIto.blue, width: 1.25 }],
    formatY: (v) => formatDb(v),
  };
}
