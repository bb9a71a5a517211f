import { describe, expect, it } from 'vitest';
import { isEngineError } from '../errors';
import type { EngineError } from '../errors';
import { readWav, readWavInfo } from './read-wav';
import type { WavLimits } from './wav-limits';
import {
  KSDATAFORMAT_TAIL,
  ascii,
  chunk,
  concat,
  floatSamples,
  fmtBody,
  fmtExtensibleBody,
  integerSamples,
  riff,
  u32,
} from './wav-fixture-builder';

// Each malformed case from the RIFF WAVE layout (Microsoft/IBM 1991; WAVEFORMATEXTENSIBLE documentation) must be
// refused with its own stable EngineError code.

function caught(run: () => unknown): EngineError {
  try {
    run();
  } catch (error) {
    if (isEngineError(error)) return error;
    throw new Error(`expected an EngineError, got ${String(error)}`);
  }
  throw new Error('expected an EngineError, nothing was thrown');
}

const fmt16 = (overrides: Partial<Parameters<typeof fmtBody>[0]> = {}) =>
  chunk('fmt ', fmtBody({ formatTag: 1, channels: 1, sampleRateHz: 48_000, bitsPerSample: 16, ...overrides }));
const data16 = chunk('data', integerSamples([[1], [2], [3], [4]], 16));

interface Case {
  name: string;
  bytes: () => Uint8Array;
  code: string;
  limits?: Partial<WavLimits>;
  details?: Record<string, unknown>;
}

const cases: Case[] = [
  { name: 'empty input', bytes: () => new Uint8Array(0), code: 'wav_not_riff' },
  { name: 'shorter than a RIFF header', bytes: () => ascii('RIFF\x04\0\0\0WAV'), code: 'wav_not_riff' },
  { name: 'not RIFF at all', bytes: () => ascii('ID3\x04 this is an mp3 file, not a wav'), code: 'wav_not_riff' },
  { name: 'RIFF of another form type (AVI)', bytes: () => riff([fmt16(), data16], { formType: 'AVI ' }), code: 'wav_not_riff' },
  { name: 'RF64 container', bytes: () => riff([chunk('ds64', new Uint8Array(28)), fmt16(), data16], { riffId: 'RF64', declaredSize: 0xffffffff }), code: 'wav_rf64_unsupported' },
  { name: 'big-endian RIFX container', bytes: () => riff([fmt16(), data16], { riffId: 'RIFX' }), code: 'wav_rifx_unsupported' },
  { name: 'missing fmt chunk', bytes: () => riff([chunk('LIST', ascii('INFO')), data16]), code: 'wav_missing_fmt' },
  { name: 'missing data chunk', bytes: () => riff([fmt16(), chunk('LIST', ascii('INFO'))]), code: 'wav_missing_data' },
  { name: 'two fmt chunks', bytes: () => riff([fmt16(), fmt16(), data16]), code: 'wav_duplicate_chunk', details: { chunk: 'fmt' } },
  { name: 'two data chunks', bytes: () => riff([fmt16(), data16, data16]), code: 'wav_duplicate_chunk', details: { chunk: 'data' } },
  { name: 'fmt chunk shorter than 16 bytes', bytes: () => riff([chunk('fmt ', fmtBody({ formatTag: 1, channels: 1, sampleRateHz: 48_000, bitsPerSample: 16 }).subarray(0, 14)), data16]), code: 'wav_fmt_too_short' },
  {
    name: 'extensible fmt chunk of 18 bytes',
    bytes: () => riff([chunk('fmt ', fmtBody({ formatTag: 0xfffe, channels: 1, sampleRateHz: 48_000, bitsPerSample: 16, cbSize: 0 })), data16]),
    code: 'wav_fmt_too_short',
  },
  { name: '0 channels', bytes: () => riff([fmt16({ channels: 0, blockAlign: 2 }), data16]), code: 'wav_zero_channels' },
  { name: 'sample rate 0 Hz', bytes: () => riff([fmt16({ sampleRateHz: 0 }), data16]), code: 'wav_sample_rate_invalid' },
  { name: 'sample rate above the limit', bytes: () => riff([fmt16({ sampleRateHz: 768_000 }), data16]), code: 'wav_sample_rate_out_of_range', details: { limit: 'maxSampleRateHz', allowed: 384_000, actual: 768_000 } },
  { name: 'sample rate below the limit', bytes: () => riff([fmt16({ sampleRateHz: 4000 }), data16]), code: 'wav_sample_rate_out_of_range', details: { limit: 'minSampleRateHz', allowed: 8000, actual: 4000 } },
  { name: 'format tag 2 (MS ADPCM)', bytes: () => riff([fmt16({ formatTag: 2 }), data16]), code: 'wav_unsupported_format', details: { formatTag: 2 } },
  { name: 'format tag 0x55 (MPEG layer 3)', bytes: () => riff([fmt16({ formatTag: 0x55 }), data16]), code: 'wav_unsupported_format' },
  {
    name: 'extensible with a foreign sub-format GUID',
    bytes: () => riff([chunk('fmt ', fmtExtensibleBody({ channels: 1, sampleRateHz: 48_000, bitsPerSample: 16, subFormatCode: 1, guidTail: [...KSDATAFORMAT_TAIL.slice(0, 13), 0x72] })), data16]),
    code: 'wav_unsupported_format',
  },
  {
    name: 'extensible with sub-format code 2 (ADPCM)',
    bytes: () => riff([chunk('fmt ', fmtExtensibleBody({ channels: 1, sampleRateHz: 48_000, bitsPerSample: 16, subFormatCode: 2 })), data16]),
    code: 'wav_unsupported_format',
  },
  { name: '12-bit PCM', bytes: () => riff([fmt16({ bitsPerSample: 12, blockAlign: 2 }), data16]), code: 'wav_unsupported_bit_depth' },
  { name: '64-bit integer PCM', bytes: () => riff([fmt16({ bitsPerSample: 64 }), chunk('data', new Uint8Array(16))]), code: 'wav_unsupported_bit_depth' },
  { name: '16-bit float', bytes: () => riff([fmt16({ formatTag: 3 }), data16]), code: 'wav_unsupported_bit_depth' },
  {
    name: 'extensible with more valid bits than the container',
    bytes: () => riff([chunk('fmt ', fmtExtensibleBody({ channels: 1, sampleRateHz: 48_000, bitsPerSample: 16, validBitsPerSample: 20, subFormatCode: 1 })), data16]),
    code: 'wav_unsupported_bit_depth',
  },
  { name: 'block align 0', bytes: () => riff([fmt16({ blockAlign: 0 }), data16]), code: 'wav_block_align_invalid', details: { blockAlign: 0, expectedBlockAlign: 2 } },
  { name: 'block align inconsistent with channels × bits', bytes: () => riff([fmt16({ channels: 2, blockAlign: 3 }), data16]), code: 'wav_block_align_invalid' },
  {
    name: 'data chunk larger than the file (truncated)',
    bytes: () => riff([fmt16(), concat(ascii('data'), u32(1000), integerSamples([[1], [2]], 16))]),
    code: 'wav_truncated',
    details: { declaredBytes: 1000, availableBytes: 4 },
  },
  { name: 'fmt chunk cut off by the end of the file', bytes: () => riff([concat(ascii('fmt '), u32(16), [1, 0, 1, 0])]), code: 'wav_truncated' },
  { name: 'data not a whole number of frames', bytes: () => riff([fmt16(), chunk('data', [1, 2, 3])]), code: 'wav_data_partial_frame' },
  {
    name: 'NaN in 32-bit float data',
    bytes: () => riff([fmt16({ formatTag: 3, channels: 2, bitsPerSample: 32 }), chunk('data', floatSamples([[0, 0], [0.5, 0.5], [0.1, Number.NaN]], 32))]),
    code: 'wav_non_finite_sample',
    details: { channel: 1, frame: 2, value: 'NaN' },
  },
  {
    name: '+Infinity in 64-bit float data',
    bytes: () => riff([fmt16({ formatTag: 3, bitsPerSample: 64 }), chunk('data', floatSamples([[0], [Number.POSITIVE_INFINITY]], 64))]),
    code: 'wav_non_finite_sample',
    details: { channel: 0, frame: 1, value: 'Infinity' },
  },
  { name: 'more channels than the limit', bytes: () => riff([fmt16({ channels: 4 }), chunk('data', new Uint8Array(8))]), limits: { maxChannels: 2 }, code: 'wav_too_many_channels', details: { limit: 'maxChannels', allowed: 2, actual: 4 } },
  { name: 'longer than the duration limit', bytes: () => riff([fmt16(), data16]), limits: { maxDurationSeconds: 1 / 48_000 }, code: 'wav_too_long', details: { limit: 'maxDurationSeconds' } },
  { name: 'larger than the byte limit', bytes: () => riff([fmt16(), data16]), limits: { maxBytes: 40 }, code: 'wav_file_too_large', details: { limit: 'maxBytes', allowed: 40 } },
  { name: 'a limit that is not a positive number', bytes: () => riff([fmt16(), data16]), limits: { maxChannels: 0 }, code: 'wav_limits_invalid' },
];

describe('readWav refuses malformed files, each with its own code', () => {
  for (const testCase of cases) {
    it(`${testCase.name} → ${testCase.code}`, () => {
      const error = caught(() => readWav(testCase.bytes(), testCase.limits));
      expect(error.code).toBe(testCase.code);
      expect(error.message.length).toBeGreaterThan(10);
      if (testCase.details) expect(error.details).toMatchObject(testCase.details);
    });
  }

  it('refuses input that is not a Uint8Array with wav_invalid_input', () => {
    expect(caught(() => readWav('RIFF' as unknown as Uint8Array)).code).toBe('wav_invalid_input');
    expect(caught(() => readWavInfo(new ArrayBuffer(44) as unknown as Uint8Array)).code).toBe('wav_invalid_input');
  });
});

describe('readWavInfo', () => {
  it('refuses the same header defects as readWav', () => {
    for (const testCase of cases.filter((c) => c.code !== 'wav_non_finite_sample')) {
      expect(caught(() => readWavInfo(testCase.bytes(), testCase.limits)).code).toBe(testCase.code);
    }
  });

  it('does not decode samples, so NaN in float data is found only by readWav', () => {
    const nanCase = cases.find((c) => c.code === 'wav_non_finite_sample');
    expect(readWavInfo(nanCase!.bytes()).frameCount).toBe(3);
  });
});
