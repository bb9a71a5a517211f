import { chartFills, okabeIto } from '@console/components/charts/chart-palette';
import type { ChartRegion, ChartSeries, ChartSpec } from '@console/components/charts/chart-spec';
import { formatDb, formatMilliseconds, withMinus } from '@console/components/charts/format-units';
import { bandMeanLevelDb, levelAtFrequencyDb } from '@shared/dsp/curves';
import type { MaskVersion } from '@shared/schemas/masks';
import { levelAxisLabel } from './conventions-words';
import type { ImpulseView, MaskFigure, ResponseView } from './result-view';

export const AUDIO_RANGE_HZ: [number, number] = [20, 20_000];

type MaskLines = Pick<MaskVersion, 'levelReference' | 'referenceLevel' | 'upper' | 'lower'>;

/**
 * Where a relative mask's 0 dB sits on the curve: the mask's own reference level when it states one, else the
 * normalisation reference (0 dB when the curve is normalised) or the level at 1 kHz, as the verdict reads it.
 */
export function maskOffsetDb(view: ResponseView, lines: Pick<MaskLines, 'levelReference' | 'referenceLevel'>): number {
  if (lines.levelReference === 'absolute') return 0;
  const points = view.frequencyHz.flatMap((f, i) => (view.magnitudeDb[i] === null ? [] : [[f, view.magnitudeDb[i] as number]]));
  if (points.length < 2) return 0;
  const curve = { frequencyHz: Float64Array.from(points, (p) => p[0]), magnitudeDb: Float64Array.from(points, (p) => p[1]) };
  try {
    const reference = lines.referenceLevel;
    if (reference?.kind === 'band_mean') return bandMeanLevelDb(curve, reference.fromHz, reference.toHz, reference.average);
    if (reference?.kind === 'at_frequency') return levelAtFrequencyDb(curve, reference.frequencyHz);
    return view.normalisationReferenceLevelDb !== null ? 0 : levelAtFrequencyDb(curve, 1000);
  } catch {
    return 0;
  }
}

function failingRegions(mask: MaskFigure | null): ChartRegion[] {
  if (!mask) return [];
  return [mask.upper, mask.lower].flatMap((limit, side) =>
    (limit?.failingRegionsHz ?? []).map(([fromX, toX]) => ({
      fromX,
      toX,
      fill: chartFills.failingRegion,
      edge: chartFills.failingEdge,
      label: side === 0 ? 'Above the upper limit' : 'Below the lower limit',
    })),
  );
}

/** Response magnitude, with the mask's limits as a band and its failing spans marked when the analysis has one. */
export function responseSpec(view: ResponseView, magnitudeReference: string | number | undefined, mask: MaskFigure | null, lines: MaskLines | null): ChartSpec {
  const series: ChartSeries[] = [{ id: 'magnitude', label: 'Response', x: view.frequencyHz, y: view.magnitudeDb, colour: okabeIto.blue, width: 2 }];
  const offset = lines ? maskOffsetDb(view, lines) : 0;
  for (const [id, points, label] of [
    ['mask-upper', lines?.upper, 'Upper limit'],
    ['mask-lower', lines?.lower, 'Lower limit'],
  ] as const) {
    if (!points || points.length === 0) continue;
    series.push({ id, label, x: points.map((p) => p.frequencyHz), y: points.map((p) => p.levelDb + offset), colour: chartFills.maskLine, dash: [6, 4], width: 1.5, spanGaps: true });
  }
  const regions = failingRegions(mask);
  const lowestValid = view.belowLowestValidFrequency?.lastIndexOf(true) ?? -1;
  if (lowestValid >= 0) {
    regions.unshift({ fromX: AUDIO_RANGE_HZ[0], toX: view.frequencyHz[lowestValid], fill: chartFills.invalidRegion, label: 'Below the lowest valid frequency of the window' });
  }
  return {
    xAxis: 'log-frequency',
    xLabel: 'Frequency (Hz)',
    xRange: AUDIO_RANGE_HZ,
    yLabel: levelAxisLabel(magnitudeReference),
    series,
    regions,
    bands: [{ upperSeriesId: 'mask-upper', lowerSeriesId: 'mask-lower', fill: chartFills.maskBand }],
    formatY: (v) => formatDb(v, { decimals: 2 }),
  };
}

export function phaseSpec(view: ResponseView): ChartSpec | null {
  if (!view.phaseDeg) return null;
  return {
    xAxis: 'log-frequency',
    xLabel: 'Frequency (Hz)',
    xRange: AUDIO_RANGE_HZ,
    yLabel: 'Phase (°)',
    minimumYSpan: 90,
    series: [{ id: 'phase', label: 'Phase', x: view.frequencyHz, y: view.phaseDeg, colour: okabeIto.reddishPurple }],
    formatY: (v) => `${withMinus(v.toFixed(1))}°`,
  };
}

export function groupDelaySpec(view: ResponseView): ChartSpec | null {
  if (!view.groupDelayMs) return null;
  return {
    xAxis: 'log-frequency',
    xLabel: 'Frequency (Hz)',
    xRange: AUDIO_RANGE_HZ,
    yLabel: 'Group delay (ms)',
    minimumYSpan: 1,
    series: [{ id: 'group-delay', label: 'Group delay', x: view.frequencyHz, y: view.groupDelayMs, colour: okabeIto.bluishGreen }],
    formatY: formatMilliseconds,
  };
}

/**
 * The impulse response scaled to its peak, with the window the spectrum was taken through. The time axis
 * centres on the peak (a few ms before it; with a gate up to just past its end, at most 50 ms), where the detail is.
 */
export function impulseSpec(view: ImpulseView): ChartSpec {
  const peak = view.amplitude.reduce((max, v) => Math.max(max, Math.abs(v)), 0) || 1;
  const first = view.timeMs[0];
  const last = view.timeMs[view.timeMs.length - 1];
  const peakMs = view.peakMs ?? first;
  // Ungated, the analysis window spans the whole record; the first 20 ms after the peak hold what matters.
  const gate = view.gated ? view.gateMs : null;
  const beforeMs = gate ? Math.max(1, 1.5 * (peakMs - gate[0])) : 2;
  const afterMs = gate ? Math.min(50, Math.max(5, 1.2 * (gate[1] - peakMs))) : 20;
  const fromMs = Math.max(first, peakMs - beforeMs);
  const toMs = Math.min(last, peakMs + afterMs);
  return {
    xAxis: 'linear',
    xLabel: 'Time from the sweep start (ms)',
    xRange: [fromMs, toMs > fromMs ? toMs : fromMs + 1],
    yLabel: 'Amplitude (re peak)',
    yRange: [-1.1, 1.1],
    series: [{ id: 'impulse', label: 'Impulse response', x: view.timeMs, y: view.amplitude.map((v) => v / peak), colour: okabeIto.blue, width: 1.25 }],
    regions: view.gateMs
      ? [{ fromX: view.gateMs[0], toX: view.gateMs[1], fill: chartFills.gate, edge: chartFills.gateEdge, label: view.gated ? 'Gate' : 'Analysis window' }]
      : [],
    formatY: (v) => withMinus(v.toFixed(3)),
  };
}
