import { EngineError } from '../errors';
import { warning, type EngineWarning } from '../result/warnings';
import { channelStats } from '../signal-stats';
import { requireSampleRateHz } from '../stimuli/parameter-checks';

/**
 * The capture every analysis takes: one Float64Array per channel, full scale ±1 (what readWav returns).
 * Channel checks raise warnings, not errors: a clipped or offset capture still gives a result, flagged.
 */
export interface CaptureInput {
  sampleRateHz: number;
  channels: readonly Float64Array[];
}

/** |mean| above this (full-scale units, −60 dB re full scale) raises dc_offset (common practice, no source). */
export const DC_OFFSET_WARNING_LINEAR = 1e-3;

export function requireCapture(capture: unknown, field = 'capture'): CaptureInput {
  if (typeof capture !== 'object' || capture === null) {
    throw new EngineError('capture_invalid', `${field} must be an object with sampleRateHz and channels.`, { field });
  }
  const raw = capture as Record<string, unknown>;
  const sampleRateHz = requireSampleRateHz(raw.sampleRateHz, `${field}.sampleRateHz`);
  const channels = raw.channels;
  if (!Array.isArray(channels) || channels.length === 0) {
    throw new EngineError('capture_no_channels', `${field}.channels must hold at least one channel.`, { field: `${field}.channels` });
  }
  channels.forEach((channel, i) => {
    if (!(channel instanceof Float64Array)) {
      throw new EngineError('capture_channel_invalid', `${field}.channels[${i}] must be a Float64Array.`, { field: `${field}.channels[${i}]` });
    }
    if (channel.length !== channels[0].length) {
      throw new EngineError('capture_channel_lengths_differ', `All channels must have the same length.`, { field: `${field}.channels[${i}]` });
    }
  });
  if ((channels[0] as Float64Array).length === 0) {
    throw new EngineError('capture_empty', `${field} holds no samples.`, { field: `${field}.channels` });
  }
  return { sampleRateHz, channels: channels as Float64Array[] };
}

/** Throws unless every sample of the channel is a finite number. */
export function requireFiniteSamples(samples: Float64Array, field: string): void {
  let probe = 0;
  for (let i = 0; i < samples.length; i++) probe += samples[i] * 0;
  if (probe !== 0) {
    const index = samples.findIndex((v) => !Number.isFinite(v));
    throw new EngineError('capture_sample_not_finite', `${field} holds a non-finite sample at index ${index}.`, { field });
  }
}

function statsOf(samples: Float64Array, channelIndex: number) {
  try {
    return channelStats(samples);
  } catch (error) {
    if (error instanceof EngineError && error.code === 'signal_non_finite_sample') {
      throw new EngineError('capture_sample_not_finite', `capture.channels[${channelIndex}]: ${error.message}`, {
        field: `capture.channels[${channelIndex}]`,
        details: error.details,
      });
    }
    throw error;
  }
}

/**
 * Clipping and DC-offset warnings of one channel; `role` names it in the messages ("measurement", "reference").
 * Also the finiteness check: a NaN or infinite sample is refused with the channel's field path.
 */
export function channelWarnings(samples: Float64Array, channelIndex: number, role: string): EngineWarning[] {
  const stats = statsOf(samples, channelIndex);
  const warnings: EngineWarning[] = [];
  if (stats.clippedSampleCount > 0 || stats.flatTopRunCount > 0) {
    warnings.push(
      warning('clipping', `The ${role} channel (${channelIndex}) reaches full scale: the result may hold clipping distortion.`, {
        channel: channelIndex,
        clippedSampleCount: stats.clippedSampleCount,
        flatTopRunCount: stats.flatTopRunCount,
        peakDbfs: Number.isFinite(stats.peakDbfs) ? stats.peakDbfs : null,
      }),
    );
  }
  if (Math.abs(stats.dcOffset) > DC_OFFSET_WARNING_LINEAR) {
    warnings.push(
      warning('dc_offset', `The ${role} channel (${channelIndex}) has a DC offset of ${stats.dcOffset.toPrecision(3)} of full scale.`, {
        channel: channelIndex,
        dcOffset: stats.dcOffset,
      }),
    );
  }
  return warnings;
}
