import { EngineError } from '../errors';
import { rejectUnknownKeys, requireInteger, requireNumberInRange, requireObject } from '../stimuli/parameter-checks';
import type { OctaveFraction } from '../curves/curve';
import type { SegmentSpec } from './capture-checks';
import { DEFAULT_PRE_PEAK_SECONDS } from './harmonic-windows';
import {
  COMMON_OPTION_KEYS,
  requireOptionsObject,
  resolveCommonOptions,
  type CommonDistortionOptions,
  type ResolvedCommonOptions,
} from './options';

/**
 * Options of harmonic distortion from a synchronized sweep, with defaults: measurementChannel 0, loopbackChannel
 * none, captureOffsetSeconds 0, grid 48 points per octave over [f1, min(f2, upperLimitHz)], octaveFraction 'none'
 * (or 1/N-octave power smoothing of every harmonic spectrum), includePhase false, prePeakSeconds 0.05 (capped at a
 * quarter of the shortest harmonic window), linearWindowSeconds L·ln 2 (capped by the recorded decay), noise
 * 'auto' (second half of the trailing silence, else the leading silence), minSnrDb 40, plus the shared options.
 */
export interface SweepDistortionOptions extends CommonDistortionOptions {
  measurementChannel?: number;
  /** Loopback channel: analysed the same way as the chain's own residual. */
  loopbackChannel?: number | null;
  captureOffsetSeconds?: number;
  grid?: { pointsPerOctave?: number; startHz?: number; stopHz?: number };
  octaveFraction?: OctaveFraction;
  includePhase?: boolean;
  prePeakSeconds?: number;
  linearWindowSeconds?: number;
  /** Stimulus-off part of the capture for the noise floor; 'auto' or null (no floor check). */
  noiseSegment?: SegmentSpec | 'auto' | null;
  minSnrDb?: number;
}

export interface ResolvedSweepDistortionOptions {
  common: ResolvedCommonOptions;
  measurementChannel: number;
  loopbackChannel: number | null;
  captureOffsetSeconds: number;
  grid: { pointsPerOctave: number; startHz: number | null; stopHz: number | null };
  octaveFraction: OctaveFraction;
  includePhase: boolean;
  prePeakSeconds: number;
  linearWindowSeconds: number | null;
  noiseSegment: SegmentSpec | 'auto' | null;
  minSnrDb: number;
}

export const SWEEP_DISTORTION_OPTION_KEYS = [
  ...COMMON_OPTION_KEYS,
  'measurementChannel',
  'loopbackChannel',
  'captureOffsetSeconds',
  'grid',
  'octaveFraction',
  'includePhase',
  'prePeakSeconds',
  'linearWindowSeconds',
  'noiseSegment',
  'minSnrDb',
] as const;

function channelIndex(value: unknown, field: string, channelCount: number): number {
  return requireInteger(value, field, 0, channelCount - 1);
}

export function resolveSweepDistortionOptions(value: unknown, channelCount: number, field = 'options'): ResolvedSweepDistortionOptions {
  const raw = requireOptionsObject(value, field);
  rejectUnknownKeys(raw, field, SWEEP_DISTORTION_OPTION_KEYS);
  const measurementChannel = channelIndex(raw.measurementChannel ?? 0, `${field}.measurementChannel`, channelCount);
  const loopbackChannel = raw.loopbackChannel == null ? null : channelIndex(raw.loopbackChannel, `${field}.loopbackChannel`, channelCount);
  if (loopbackChannel === measurementChannel) {
    throw new EngineError('loopback_is_measurement_channel', `${field}.loopbackChannel must differ from the measurement channel.`, {
      field: `${field}.loopbackChannel`,
    });
  }
  const gridRaw = raw.grid === undefined ? {} : requireObject(raw.grid, `${field}.grid`);
  rejectUnknownKeys(gridRaw, `${field}.grid`, ['pointsPerOctave', 'startHz', 'stopHz']);
  const octaveFraction = raw.octaveFraction ?? 'none';
  if (octaveFraction !== 'none') requireInteger(octaveFraction, `${field}.octaveFraction`, 1, 48);
  if (raw.includePhase !== undefined && typeof raw.includePhase !== 'boolean') {
    throw new EngineError('parameter_not_a_boolean', `${field}.includePhase must be true or false.`, { field: `${field}.includePhase` });
  }
  const noise = raw.noiseSegment === undefined ? 'auto' : raw.noiseSegment;
  if (noise !== 'auto' && noise !== null) requireObject(noise, `${field}.noiseSegment`);
  return {
    common: resolveCommonOptions(raw, field),
    measurementChannel,
    loopbackChannel,
    captureOffsetSeconds: requireNumberInRange(raw.captureOffsetSeconds ?? 0, `${field}.captureOffsetSeconds`, 0, 600, 's'),
    grid: {
      pointsPerOctave: requireInteger(gridRaw.pointsPerOctave ?? 48, `${field}.grid.pointsPerOctave`, 1, 96),
      startHz: gridRaw.startHz === undefined ? null : requireNumberInRange(gridRaw.startHz, `${field}.grid.startHz`, 0.1, 1e6, 'Hz'),
      stopHz: gridRaw.stopHz === undefined ? null : requireNumberInRange(gridRaw.stopHz, `${field}.grid.stopHz`, 0.1, 1e6, 'Hz'),
    },
    octaveFraction: octaveFraction as OctaveFraction,
    includePhase: raw.includePhase === true,
    prePeakSeconds: requireNumberInRange(raw.prePeakSeconds ?? DEFAULT_PRE_PEAK_SECONDS, `${field}.prePeakSeconds`, 0.0001, 1, 's'),
    linearWindowSeconds:
      raw.linearWindowSeconds === undefined ? null : requireNumberInRange(raw.linearWindowSeconds, `${field}.linearWindowSeconds`, 0.001, 60, 's'),
    noiseSegment: noise as ResolvedSweepDistortionOptions['noiseSegment'],
    minSnrDb: requireNumberInRange(raw.minSnrDb ?? 40, `${field}.minSnrDb`, 0, 200, 'dB'),
  };
}
