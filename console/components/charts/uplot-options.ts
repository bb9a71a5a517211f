import type uPlot from 'uplot';
import { withMinus } from './format-units';
import { chartInk } from './chart-palette';
import type { ChartSpec } from './chart-spec';
import { dbAxisRange, dbTicks, dbTickStep, logAxisRange, logTicks } from './db-ticks';
import { decadeFrequenciesHz, frequencyTickLabel, thirdOctaveGridLines } from './log-axis-ticks';

const AXIS_FONT = '11px "JetBrains Mono Variable", ui-monospace, monospace';
const LABEL_FONT = '600 12px "Manrope Variable", ui-sans-serif, sans-serif';
/** The fonts the canvas uses; they must be loaded before the chart measures and draws text. */
export const CHART_FONTS = ['11px "JetBrains Mono Variable"', '600 12px "Manrope Variable"'];
/** The font strings the canvas is given, exactly as uPlot sets them. */
export const CHART_CANVAS_FONTS = [AXIS_FONT, LABEL_FONT];

function logFrequencyAxis(): Partial<uPlot.Axis> {
  return {
    splits: (_u, _axis, min, max) => thirdOctaveGridLines(min, max).map((line) => line.frequencyHz),
    filter: (_u, splits) => splits,
    values: (u, splits) => {
      const lines = thirdOctaveGridLines(u.scales.x.min ?? splits[0], u.scales.x.max ?? splits[splits.length - 1]);
      const labelAt = new Map(lines.map((line) => [line.frequencyHz, line.isLabelled ? frequencyTickLabel(Number(line.nominalLabel)) : '']));
      return splits.map((split) => labelAt.get(split) ?? '');
    },
  };
}

function yAxis(spec: ChartSpec): Partial<uPlot.Axis> {
  return {
    splits: (_u, _axis, min, max) => (spec.yScale === 'log' ? logTicks(min, max) : dbTicks(min, max, dbTickStep(max - min))),
    // uPlot thins log-axis labels by default (nulls in `splits`); our ticks are already chosen, so keep them all.
    filter: (_u, splits) => splits,
    values: (_u, splits) => splits.map((v) => (v === null || v === undefined ? '' : withMinus(String(Number(v.toPrecision(6)))))),
    size: 60,
  };
}

function yScale(spec: ChartSpec): uPlot.Scale {
  const minimumSpan = spec.minimumYSpan ?? 20;
  if (spec.yScale === 'log') {
    return { distr: 3, log: 10, range: (_u, min, max) => spec.yRange ?? logAxisRange(min, max) };
  }
  return {
    range: (_u, min, max) =>
      spec.yRange ?? (min === null || max === null || !Number.isFinite(min) ? [-minimumSpan / 2, minimumSpan / 2] : dbAxisRange(min, max, minimumSpan)),
  };
}

/** Draws marked x regions (failing spans, the gate) under the curves, then the strong decade lines. */
function drawBackdrop(spec: ChartSpec) {
  return (u: uPlot) => {
    const { ctx } = u;
    const { left, top, width, height } = u.bbox;
    ctx.save();
    ctx.beginPath();
    ctx.rect(left, top, width, height);
    ctx.clip();
    for (const region of spec.regions ?? []) {
      const x0 = u.valToPos(region.fromX, 'x', true);
      const x1 = u.valToPos(region.toX, 'x', true);
      ctx.fillStyle = region.fill;
      ctx.fillRect(Math.min(x0, x1), top, Math.max(Math.abs(x1 - x0), 1), height);
      if (region.edge) {
        ctx.strokeStyle = region.edge;
        ctx.lineWidth = devicePixelRatio;
        ctx.setLineDash([4 * devicePixelRatio, 3 * devicePixelRatio]);
        for (const x of [x0, x1]) {
          ctx.beginPath();
          ctx.moveTo(x, top);
          ctx.lineTo(x, top + height);
          ctx.stroke();
        }
        ctx.setLineDash([]);
      }
    }
    if (spec.xAxis === 'log-frequency') {
      ctx.strokeStyle = chartInk.gridDecade;
      ctx.lineWidth = devicePixelRatio;
      for (const decadeHz of decadeFrequenciesHz(u.scales.x.min ?? spec.xRange[0], u.scales.x.max ?? spec.xRange[1])) {
        const x = Math.round(u.valToPos(decadeHz, 'x', true)) + 0.5;
        ctx.beginPath();
        ctx.moveTo(x, top);
        ctx.lineTo(x, top + height);
        ctx.stroke();
      }
    }
    ctx.restore();
  };
}

function seriesOptions(series: ChartSpec['series'][number]): uPlot.Series {
  const markers = series.markers ?? 'none';
  return {
    label: series.label,
    stroke: series.colour,
    width: series.width ?? 1.75,
    dash: series.dash,
    spanGaps: series.spanGaps ?? false,
    show: series.visible !== false,
    points:
      markers === 'none'
        ? { show: false }
        : {
            show: true,
            size: markers === 'hollow' ? 7 : 5,
            width: 1.5,
            stroke: series.colour,
            fill: markers === 'hollow' ? '#fffefb' : series.colour,
            ...(series.markerIndices ? { filter: () => series.markerIndices ?? null } : {}),
          },
  };
}

/** uPlot options for a chart spec: fixed x range, 1/3-octave grid with decade lines, dB ticks on the y axis. */
export function buildUplotOptions(spec: ChartSpec, size: { width: number; height: number }, hooks: uPlot.Hooks.Arrays = {}): uPlot.Options {
  const seriesIndex = new Map(spec.series.map((series, i) => [series.id, i + 1]));
  return {
    width: size.width,
    height: size.height,
    legend: { show: false },
    cursor: { drag: { x: false, y: false, setScale: false }, points: { size: 7 } },
    padding: [12, 16, 0, 0],
    scales: {
      x: spec.xAxis === 'log-frequency' ? { time: false, distr: 3, log: 10, range: () => spec.xRange } : { time: false, range: () => spec.xRange },
      y: yScale(spec),
    },
    axes: [
      {
        label: spec.xLabel,
        font: AXIS_FONT,
        labelFont: LABEL_FONT,
        stroke: chartInk.axisText,
        grid: { stroke: chartInk.gridFine, width: 1 },
        ticks: { stroke: chartInk.gridFine, size: 4 },
        ...(spec.xAxis === 'log-frequency' ? logFrequencyAxis() : {}),
      },
      {
        label: spec.yLabel,
        font: AXIS_FONT,
        labelFont: LABEL_FONT,
        stroke: chartInk.axisText,
        grid: { stroke: chartInk.gridFine, width: 1 },
        ticks: { stroke: chartInk.gridFine, size: 4 },
        ...yAxis(spec),
      },
    ],
    series: [{}, ...spec.series.map(seriesOptions)],
    bands: (spec.bands ?? [])
      .filter((band) => seriesIndex.has(band.upperSeriesId) && seriesIndex.has(band.lowerSeriesId))
      .map((band) => ({ series: [seriesIndex.get(band.upperSeriesId)!, seriesIndex.get(band.lowerSeriesId)!] as [number, number], fill: band.fill })),
    hooks: { ...hooks, drawAxes: [drawBackdrop(spec), ...(hooks.drawAxes ?? [])] },
  };
}
