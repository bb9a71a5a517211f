import { chartFills, okabeIto } from '@console/components/charts/chart-palette';
import type { ChartSeries, ChartSpec } from '@console/components/charts/chart-spec';
import { formatDb, formatFrequency } from '@console/components/charts/format-units';
import type { MaskVersion } from '@shared/schemas/masks';
import type { MaskPoint } from './mask-rows';

type MaskLines = Pick<MaskVersion, 'levelReference' | 'referenceLevel'> & {
  upper: readonly MaskPoint[] | null;
  lower: readonly MaskPoint[] | null;
  derivation?: MaskVersion['derivation'];
};

const AUDIO_RANGE_HZ: [number, number] = [20, 20_000];

/** What 0 dB means on the level axis of a mask. */
export function maskLevelLabel(lines: Pick<MaskVersion, 'levelReference' | 'referenceLevel'>): string {
  if (lines.levelReference === 'absolute') return 'Level (dB, the curve’s own reference; dB SPL when calibrated)';
  const reference = lines.referenceLevel;
  if (reference?.kind === 'at_frequency') return `Level (dB re the curve at ${formatFrequency(reference.frequencyHz)})`;
  if (reference?.kind === 'band_mean') return `Level (dB re the curve’s mean ${formatFrequency(reference.fromHz)}–${formatFrequency(reference.toHz)})`;
  return 'Level (dB, relative)';
}

/** The mask as a band between its limit lines on a log-frequency axis, with the golden mean when it was derived. */
export function maskBandSpec(lines: MaskLines): ChartSpec {
  const series: ChartSeries[] = [];
  for (const [id, points, label] of [
    ['mask-upper', lines.upper, 'Upper limit'],
    ['mask-lower', lines.lower, 'Lower limit'],
  ] as const) {
    if (!points || points.length === 0) continue;
    series.push({ id, label, x: points.map((p) => p.frequencyHz), y: points.map((p) => p.levelDb), colour: chartFills.maskLine, width: 1.75, spanGaps: true, markers: points.length <= 60 ? 'filled' : 'none' });
  }
  if (lines.derivation && lines.derivation.frequencyHz.length > 0) {
    series.push({ id: 'golden-mean', label: `Mean of ${lines.derivation.curveCount} golden units`, x: lines.derivation.frequencyHz, y: lines.derivation.meanDb, colour: okabeIto.blue, dash: [6, 4], width: 1.25 });
  }
  const frequencies = series.flatMap((s) => Array.from(s.x));
  const xRange: [number, number] = [Math.min(AUDIO_RANGE_HZ[0], ...frequencies.filter((f) => f > 0)), Math.max(AUDIO_RANGE_HZ[1], ...frequencies)];
  return {
    xAxis: 'log-frequency',
    xLabel: 'Frequency (Hz)',
    xRange,
    yLabel: maskLevelLabel(lines),
    minimumYSpan: 12,
    series,
    bands: [{ upperSeriesId: 'mask-upper', lowerSeriesId: 'mask-lower', fill: chartFills.maskBand }],
    formatY: (v) => formatDb(v, { decimals: 2 }),
  };
}
