import { EngineError } from '../errors';
import type { WindowShape } from '../response/time-window';
import {
  rejectUnknownKeys,
  requireInteger,
  requireNumberInRange,
  requireObject,
  requireOneOf,
} from '../stimuli/parameter-checks';
import {
  CURVE_OUTPUT_OPTION_KEYS,
  resolveChannelIndex,
  resolveCurveOutputOptions,
  type CurveOutputOptions,
  type ResolvedCurveOutputOptions,
} from './curve-output-options';

/**
 * Options of the sweep frequency-response analysis, with their defaults:
 * - measurementChannel 0; referenceChannel none (give the loopback channel's index to divide by it);
 * - captureOffsetSeconds 0: where the stimulus file starts in the capture;
 * - gate none; with a gate: preRollSeconds 0.001, shape 'half_hann', taperFraction 0.25 (fall share) or 0.5 (Tukey α);
 * - without a gate the IR is windowed from max(5 ms, 2/f1) (at most ¼·L·ln 2) before its peak to
 *   analysisWindowSeconds (default 1 s, cut to what the capture holds) after it;
 * - smoothing none (or 1/N octave, N = 1…48, 'power' or 'complex' averaging, 'hann' or 'rectangular' window);
 * - grid 48 points per octave over the sweep band (startHz/stopHz to change it);
 * - impulseResponseOutputSeconds 0.05 of windowed IR in the result after the peak (0 to omit);
 * - lowSnrThresholdDb 20 (estimated SNR per grid point, inside the sweep band, below which low_snr is raised);
 * - normalisation, band limits, 1/3-octave table, calibration, conditions: see curve-output-options.ts.
 */
export interface SweepGateOptions {
  /** Gate length from the IR peak to the end of the gate, seconds (before the first reflection). */
  lengthSeconds: number;
  preRollSeconds?: number;
  shape?: WindowShape;
  taperFraction?: number;
}

export interface SweepSmoothingOptions {
  /** 'none' or N for 1/N octave (1…48). */
  octaveFraction: 'none' | number;
  averaging?: 'power' | 'complex';
  window?: 'hann' | 'rectangular';
}

export interface SweepResponseOptions extends CurveOutputOptions {
  measurementChannel?: number;
  referenceChannel?: number | null;
  captureOffsetSeconds?: number;
  gate?: SweepGateOptions | null;
  analysisWindowSeconds?: number;
  smoothing?: SweepSmoothingOptions;
  grid?: { pointsPerOctave?: number; startHz?: number; stopHz?: number };
  impulseResponseOutputSeconds?: number;
  lowSnrThresholdDb?: number;
}

export interface ResolvedSweepResponseOptions extends ResolvedCurveOutputOptions {
  measurementChannel: number;
  referenceChannel: number | null;
  captureOffsetSeconds: number;
  gate: Required<SweepGateOptions> | null;
  analysisWindowSeconds: number;
  smoothing: Required<SweepSmoothingOptions>;
  grid: { pointsPerOctave: number; startHz: number | null; stopHz: number | null };
  impulseResponseOutputSeconds: number;
  lowSnrThresholdDb: number;
}

const KEYS = [
  'measurementChannel',
  'referenceChannel',
  'captureOffsetSeconds',
  'gate',
  'analysisWindowSeconds',
  'smoothing',
  'grid',
  'impulseResponseOutputSeconds',
  'lowSnrThresholdDb',
  ...CURVE_OUTPUT_OPTION_KEYS,
] as const;

function resolveGate(value: unknown, field: string): Required<SweepGateOptions> | null {
  if (value === undefined || value === null) return null;
  const raw = requireObject(value, field);
  rejectUnknownKeys(raw, field, ['lengthSeconds', 'preRollSeconds', 'shape', 'taperFraction']);
  const shape = requireOneOf(raw.shape ?? 'half_hann', `${field}.shape`, ['half_hann', 'tukey'] as const);
  return {
    lengthSeconds: requireNumberInRange(raw.lengthSeconds, `${field}.lengthSeconds`, 0.0002, 10, 's', 'gate_length_out_of_range'),
    preRollSeconds: requireNumberInRange(raw.preRollSeconds ?? 0.001, `${field}.preRollSeconds`, 0, 0.1, 's'),
    shape,
    taperFraction: requireNumberInRange(raw.taperFraction ?? (shape === 'tukey' ? 0.5 : 0.25), `${field}.taperFraction`, 0, 1, ''),
  };
}

function resolveSmoothing(value: unknown, field: string): Required<SweepSmoothingOptions> {
  if (value === undefined) return { octaveFraction: 'none', averaging: 'power', window: 'hann' };
  const raw = requireObject(value, field);
  rejectUnknownKeys(raw, field, ['octaveFraction', 'averaging', 'window']);
  const octaveFraction = raw.octaveFraction === 'none' ? 'none' : requireInteger(raw.octaveFraction, `${field}.octaveFraction`, 1, 48);
  return {
    octaveFraction,
    averaging: requireOneOf(raw.averaging ?? 'power', `${field}.averaging`, ['power', 'complex'] as const),
    window: requireOneOf(raw.window ?? 'hann', `${field}.window`, ['hann', 'rectangular'] as const),
  };
}

function resolveGrid(value: unknown, field: string): ResolvedSweepResponseOptions['grid'] {
  const raw = value === undefined ? {} : requireObject(value, field);
  rejectUnknownKeys(raw, field, ['pointsPerOctave', 'startHz', 'stopHz']);
  const startHz = raw.startHz === undefined ? null : requireNumberInRange(raw.startHz, `${field}.startHz`, 0.01, 1e6, 'Hz');
  const stopHz = raw.stopHz === undefined ? null : requireNumberInRange(raw.stopHz, `${field}.stopHz`, 0.01, 1e6, 'Hz');
  if (startHz !== null && stopHz !== null && !(stopHz > startHz)) {
    throw new EngineError('grid_range_invalid', `${field}.stopHz must be above ${field}.startHz.`, { field: `${field}.stopHz` });
  }
  return { pointsPerOctave: requireInteger(raw.pointsPerOctave ?? 48, `${field}.pointsPerOctave`, 1, 96), startHz, stopHz };
}

/** Validate and complete the options for a capture with `channelCount` channels. */
export function resolveSweepResponseOptions(options: unknown, channelCount: number, field = 'options'): ResolvedSweepResponseOptions {
  const raw = options === undefined ? {} : requireObject(options, field);
  rejectUnknownKeys(raw, field, KEYS);
  const measurementChannel = resolveChannelIndex(raw.measurementChannel, `${field}.measurementChannel`, channelCount, 0) as number;
  const referenceChannel = resolveChannelIndex(raw.referenceChannel, `${field}.referenceChannel`, channelCount, null);
  if (referenceChannel === measurementChannel) {
    throw new EngineError('reference_is_measurement_channel', `${field}.referenceChannel must differ from the measurement channel.`, {
      field: `${field}.referenceChannel`,
    });
  }
  return {
    ...resolveCurveOutputOptions(raw, field),
    measurementChannel,
    referenceChannel,
    captureOffsetSeconds: requireNumberInRange(raw.captureOffsetSeconds ?? 0, `${field}.captureOffsetSeconds`, 0, 600, 's'),
    gate: resolveGate(raw.gate, `${field}.gate`),
    analysisWindowSeconds: requireNumberInRange(raw.analysisWindowSeconds ?? 1, `${field}.analysisWindowSeconds`, 0.001, 60, 's'),
    smoothing: resolveSmoothing(raw.smoothing, `${field}.smoothing`),
    grid: resolveGrid(raw.grid, `${field}.grid`),
    impulseResponseOutputSeconds: requireNumberInRange(raw.impulseResponseOutputSeconds ?? 0.05, `${field}.impulseResponseOutputSeconds`, 0, 2, 's'),
    lowSnrThresholdDb: requireNumberInRange(raw.lowSnrThresholdDb ?? 20, `${field}.lowSnrThresholdDb`, 0, 200, 'dB'),
  };
}
