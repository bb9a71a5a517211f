import type { WindowShape } from '../response/time-window';
import { rejectUnknownKeys, requireNumberInRange, requireObject, requireOneOf } from '../stimuli/parameter-checks';
import { resolveResponseCommonOptions, type ResolvedResponseCommonOptions, type ResponseCommonOptions } from './response-common-options';
import { resolveGridOptions, resolveSmoothingOptions, type ResolvedGridOptions } from './smoothing-and-grid-options';

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

export interface SweepResponseOptions extends ResponseCommonOptions {
  gate?: SweepGateOptions | null;
  analysisWindowSeconds?: number;
  smoothing?: SweepSmoothingOptions;
  grid?: { pointsPerOctave?: number; startHz?: number; stopHz?: number };
  impulseResponseOutputSeconds?: number;
  lowSnrThresholdDb?: number;
}

export interface ResolvedSweepResponseOptions extends ResolvedResponseCommonOptions {
  gate: Required<SweepGateOptions> | null;
  analysisWindowSeconds: number;
  smoothing: Required<SweepSmoothingOptions>;
  grid: ResolvedGridOptions;
  impulseResponseOutputSeconds: number;
  lowSnrThresholdDb: number;
}

const OWN_KEYS = [
  'gate',
  'analysisWindowSeconds',
  'smoothing',
  'grid',
  'impulseResponseOutputSeconds',
  'lowSnrThresholdDb',
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

/** Validate and complete the options for a capture with `channelCount` channels. */
export function resolveSweepResponseOptions(options: unknown, channelCount: number, field = 'options'): ResolvedSweepResponseOptions {
  const { raw, common } = resolveResponseCommonOptions(options, channelCount, field, OWN_KEYS);
  return {
    ...common,
    gate: resolveGate(raw.gate, `${field}.gate`),
    analysisWindowSeconds: requireNumberInRange(raw.analysisWindowSeconds ?? 1, `${field}.analysisWindowSeconds`, 0.001, 60, 's'),
    smoothing: resolveSmoothingOptions(raw.smoothing, `${field}.smoothing`),
    grid: resolveGridOptions(raw.grid, `${field}.grid`),
    impulseResponseOutputSeconds: requireNumberInRange(raw.impulseResponseOutputSeconds ?? 0.05, `${field}.impulseResponseOutputSeconds`, 0, 2, 's'),
    lowSnrThresholdDb: requireNumberInRange(raw.lowSnrThresholdDb ?? 20, `${field}.lowSnrThresholdDb`, 0, 200, 'dB'),
  };
}
