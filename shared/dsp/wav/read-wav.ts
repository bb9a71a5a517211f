import { EngineError } from '../errors';
import { decodeSamples } from './decode-samples';
import { findWaveChunks } from './riff-chunks';
import { parseWavFormat } from './wav-format';
import type { WavFormat } from './wav-format';
import { resolveWavLimits } from './wav-limits';
import type { WavLimits } from './wav-limits';
import type { DecodedWav, WavInfo } from './wav-types';

function requireLimits(limits: WavLimits): void {
  for (const [key, value] of Object.entries(limits)) {
    if (value !== undefined && !(typeof value === 'number' && value > 0)) {
      throw new EngineError('wav_limits_invalid', `WAV limit ${key} must be a positive number, got ${String(value)}.`, { field: key });
    }
  }
}

function limitError(code: string, message: string, limit: keyof WavLimits, allowed: number, actual: number): EngineError {
  return new EngineError(code, message, { details: { limit, allowed, actual } });
}

interface ParsedWav {
  info: WavInfo;
  format: WavFormat;
  dataOffset: number;
}

function parseWav(bytes: Uint8Array, partialLimits: Partial<WavLimits> | undefined): ParsedWav {
  if (!(bytes instanceof Uint8Array)) {
    throw new EngineError('wav_invalid_input', 'WAV input must be a Uint8Array of the file bytes.');
  }
  const limits = resolveWavLimits(partialLimits);
  requireLimits(limits);
  if (limits.maxBytes !== undefined && bytes.length > limits.maxBytes) {
    throw limitError('wav_file_too_large', `The file is ${bytes.length} bytes; the limit is ${limits.maxBytes}.`, 'maxBytes', limits.maxBytes, bytes.length);
  }
  const chunks = findWaveChunks(bytes);
  const format = parseWavFormat(bytes, chunks.fmt);
  if (format.channelCount > limits.maxChannels) {
    throw limitError(
      'wav_too_many_channels',
      `The file has ${format.channelCount} channels; the limit is ${limits.maxChannels}.`,
      'maxChannels',
      limits.maxChannels,
      format.channelCount,
    );
  }
  if (format.sampleRateHz > limits.maxSampleRateHz) {
    throw limitError(
      'wav_sample_rate_out_of_range',
      `The sample rate is ${format.sampleRateHz} Hz; the highest accepted is ${limits.maxSampleRateHz} Hz.`,
      'maxSampleRateHz',
      limits.maxSampleRateHz,
      format.sampleRateHz,
    );
  }
  if (format.sampleRateHz < limits.minSampleRateHz) {
    throw limitError(
      'wav_sample_rate_out_of_range',
      `The sample rate is ${format.sampleRateHz} Hz; the lowest accepted is ${limits.minSampleRateHz} Hz.`,
      'minSampleRateHz',
      limits.minSampleRateHz,
      format.sampleRateHz,
    );
  }
  let dataBytes = chunks.data.size;
  if (chunks.data.sizeFromFileLength) {
    // A streaming writer never filled in the size: use the whole frames that are present.
    dataBytes -= dataBytes % format.blockAlign;
  } else if (dataBytes % format.blockAlign !== 0) {
    throw new EngineError(
      'wav_data_partial_frame',
      `The data chunk holds ${dataBytes} bytes, not a whole number of ${format.blockAlign}-byte frames: the file is damaged or truncated.`,
      { details: { dataBytes, blockAlign: format.blockAlign } },
    );
  }
  const frameCount = dataBytes / format.blockAlign;
  const durationSeconds = frameCount / format.sampleRateHz;
  if (durationSeconds > limits.maxDurationSeconds) {
    throw limitError(
      'wav_too_long',
      `The capture lasts ${durationSeconds.toFixed(3)} s; the limit is ${limits.maxDurationSeconds} s.`,
      'maxDurationSeconds',
      limits.maxDurationSeconds,
      durationSeconds,
    );
  }
  const info: WavInfo = {
    sampleRateHz: format.sampleRateHz,
    channelCount: format.channelCount,
    frameCount,
    durationSeconds,
    bitsPerSample: format.bitsPerSample,
    sampleEncoding: format.sampleEncoding,
    formatTag: format.formatTag,
    extensible: format.extensible,
    dataSizeFromFileLength: chunks.data.sizeFromFileLength,
  };
  return { info, format, dataOffset: chunks.data.offset };
}

/**
 * Validate a WAV's container, format and sizes against the limits without decoding samples (fast upload check;
 * NaN/Inf in float data is only found by readWav). Microsoft/IBM RIFF WAVE spec (1991); throws EngineError wav_*.
 */
export function readWavInfo(bytes: Uint8Array, limits?: Partial<WavLimits>): WavInfo {
  return parseWav(bytes, limits).info;
}

/**
 * Decode a WAV (PCM 8/16/24/32, float 32/64, plain or WAVE_FORMAT_EXTENSIBLE) to float64 channels, full scale
 * ±1, integers divided by 2^(bits−1) for both signs (AES17); throws EngineError wav_* for any malformed input.
 */
export function readWav(bytes: Uint8Array, limits?: Partial<WavLimits>): DecodedWav {
  const { info, format, dataOffset } = parseWav(bytes, limits);
  return { ...info, channels: decodeSamples(bytes, dataOffset, info.frameCount, format) };
}
