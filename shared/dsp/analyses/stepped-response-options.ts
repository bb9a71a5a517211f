import { EngineError } from '../errors';
import { rejectUnknownKeys, requireNumberInRange, requireObject } from '../stimuli/parameter-checks';
import {
  CURVE_OUTPUT_OPTION_KEYS,
  resolveChannelIndex,
  resolveCurveOutputOptions,
  type CurveOutputOptions,
  type ResolvedCurveOutputOptions,
} from './curve-output-options';

/**
 * Options of the stepped-sine response analysis: measurementChannel (0), referenceChannel (none),
 * captureOffsetSeconds (0; where the plan's file starts in the capture; any further latency must stay below the
 * settle time), lowSnrThresholdDb (20; per-step tone-to-residual ratio below which low_snr is raised), and the
 * shared curve outputs (curve-output-options.ts).
 */
export interface SteppedResponseOptions extends CurveOutputOptions {
  measurementChannel?: number;
  referenceChannel?: number | null;
  captureOffsetSeconds?: number;
  lowSnrThresholdDb?: number;
}

export interface ResolvedSteppedResponseOptions extends ResolvedCurveOutputOptions {
  measurementChannel: number;
  referenceChannel: number | null;
  captureOffsetSeconds: number;
  lowSnrThresholdDb: number;
}

const KEYS = ['measurementChannel', 'referenceChannel', 'captureOffsetSeconds', 'lowSnrThresholdDb', ...CURVE_OUTPUT_OPTION_KEYS] as const;

export function resolveSteppedResponseOptions(options: unknown, channelCount: number, field = 'options'): ResolvedSteppedResponseOptions {
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
    lowSnrThresholdDb: requireNumberInRange(raw.lowSnrThresholdDb ?? 20, `${field}.lowSnrThresholdDb`, 0, 200, 'dB'),
  };
}
