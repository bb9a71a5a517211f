import { EngineError } from '../errors';
import { rejectUnknownKeys, requireNumberInRange, requireObject } from '../stimuli/parameter-checks';
import { resolveChannelIndex } from './channel-options';
import {
  CURVE_OUTPUT_OPTION_KEYS,
  resolveCurveOutputOptions,
  type CurveOutputOptions,
  type ResolvedCurveOutputOptions,
} from './curve-output-options';

/**
 * Options every response analysis (sweep, stepped sine) takes: measurementChannel (0), referenceChannel (none; the
 * loopback channel's index to divide by it), captureOffsetSeconds (0; where the stimulus file starts in the
 * capture), and the curve outputs (curve-output-options.ts).
 */
export interface ResponseCommonOptions extends CurveOutputOptions {
  measurementChannel?: number;
  referenceChannel?: number | null;
  captureOffsetSeconds?: number;
}

export interface ResolvedResponseCommonOptions extends ResolvedCurveOutputOptions {
  measurementChannel: number;
  referenceChannel: number | null;
  captureOffsetSeconds: number;
}

const COMMON_KEYS = ['measurementChannel', 'referenceChannel', 'captureOffsetSeconds', ...CURVE_OUTPUT_OPTION_KEYS] as const;

/**
 * Opens a response analysis' options object and resolves the common part; `ownKeys` are the analysis' other
 * options, which it resolves itself from the returned raw object. A channel divided by itself would give a flat
 * 0 dB curve that hides the device, so the reference must differ from the measurement channel.
 */
export function resolveResponseCommonOptions(
  options: unknown,
  channelCount: number,
  field: string,
  ownKeys: readonly string[],
): { raw: Record<string, unknown>; common: ResolvedResponseCommonOptions } {
  const raw = options === undefined ? {} : requireObject(options, field);
  rejectUnknownKeys(raw, field, [...COMMON_KEYS, ...ownKeys]);
  const measurementChannel = resolveChannelIndex(raw.measurementChannel, `${field}.measurementChannel`, channelCount, 0) as number;
  const referenceChannel = resolveChannelIndex(raw.referenceChannel, `${field}.referenceChannel`, channelCount, null);
  if (referenceChannel === measurementChannel) {
    throw new EngineError('reference_is_measurement_channel', `${field}.referenceChannel must differ from the measurement channel.`, {
      field: `${field}.referenceChannel`,
    });
  }
  const common = {
    ...resolveCurveOutputOptions(raw, field),
    measurementChannel,
    referenceChannel,
    captureOffsetSeconds: requireNumberInRange(raw.captureOffsetSeconds ?? 0, `${field}.captureOffsetSeconds`, 0, 600, 's'),
  };
  return { raw, common };
}
