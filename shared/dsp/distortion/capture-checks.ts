import { EngineError } from '../errors';
import { warning, type EngineWarning } from '../result/warnings';
import { channelStats } from '../signal-stats';
import { rejectUnknownKeys, requireNumberInRange, requireObject } from '../stimuli/parameter-checks';

/** A capture channel must be a Float64Array of finite samples. */
export function requireChannel(value: unknown, field: string, minimumLength = 16): Float64Array {
  if (!(value instanceof Float64Array)) {
    throw new EngineError('channel_invalid', `${field} must be a Float64Array of samples (full scale ±1).`, { field });
  }
  if (value.length < minimumLength) {
    throw new EngineError('channel_too_short', `${field} has ${value.length} samples; at least ${minimumLength} are needed.`, { field });
  }
  for (let n = 0; n < value.length; n++) {
    if (!Number.isFinite(value[n])) {
      throw new EngineError('channel_not_finite', `${field} holds a non-finite sample at index ${n}.`, { field });
    }
  }
  return value;
}

export interface SegmentSpec {
  startSeconds?: number;
  durationSeconds?: number;
}

/** The part of a channel a segment spec names (default: all of it), as a view. */
export function selectSegment(channel: Float64Array, sampleRateHz: number, value: unknown, field: string): Float64Array {
  if (value === undefined) return channel;
  const raw = requireObject(value, field);
  rejectUnknownKeys(raw, field, ['startSeconds', 'durationSeconds']);
  const totalSeconds = channel.length / sampleRateHz;
  const startSeconds = requireNumberInRange(raw.startSeconds ?? 0, `${field}.startSeconds`, 0, totalSeconds, 's');
  const durationSeconds = requireNumberInRange(
    raw.durationSeconds ?? totalSeconds - startSeconds,
    `${field}.durationSeconds`,
    0,
    totalSeconds,
    's',
  );
  const start = Math.round(startSeconds * sampleRateHz);
  const length = Math.round(durationSeconds * sampleRateHz);
  if (start + length > channel.length || length < 16) {
    throw new EngineError('segment_outside_capture', `${field} must lie inside the capture and hold at least 16 samples.`, { field });
  }
  return channel.subarray(start, start + length);
}

/** A clipping warning when the channel touches full scale (flat-topped peaks or samples at the clip threshold). */
export function clippingWarnings(channel: Float64Array, label: string): EngineWarning[] {
  const stats = channelStats(channel);
  if (stats.clippedSampleCount === 0 && stats.flatTopRunCount === 0) return [];
  return [
    warning(
      'clipping',
      `${label}: ${stats.clippedSampleCount} samples at or near full scale; harmonic figures describe the clipping, not the device.`,
      { clippedSampleCount: stats.clippedSampleCount, flatTopRunCount: stats.flatTopRunCount },
    ),
  ];
}
