import { EngineError } from '../errors';
import type { ChunkLocation } from './riff-chunks';
import { readUint16, readUint32 } from './riff-chunks';
import type { WavSampleEncoding } from './wav-types';

/**
 * The fmt chunk: WAVEFORMATEX (Microsoft/IBM RIFF WAVE spec, 1991) and WAVEFORMATEXTENSIBLE (Microsoft,
 * "WAVEFORMATEXTENSIBLE" and "Multiple channel audio data and WAVE files" documentation), where the sub-format
 * GUID carries the real format code in its first two bytes, followed by the fixed KSDATAFORMAT_SUBTYPE tail
 * 00000000-0010-0080-00AA00389B71.
 */
export const WAVE_FORMAT_PCM = 0x0001;
export const WAVE_FORMAT_IEEE_FLOAT = 0x0003;
export const WAVE_FORMAT_EXTENSIBLE = 0xfffe;

/** Bytes 2..15 of KSDATAFORMAT_SUBTYPE_PCM / _IEEE_FLOAT as stored (little-endian GUID fields). */
const SUBFORMAT_GUID_TAIL = [0x00, 0x00, 0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71];

export interface WavFormat {
  formatTag: number;
  extensible: boolean;
  sampleEncoding: WavSampleEncoding;
  channelCount: number;
  sampleRateHz: number;
  blockAlign: number;
  /** Container size of one sample, bits. */
  bitsPerSample: number;
  /** Meaningful bits (extensible wValidBitsPerSample; equals bitsPerSample otherwise). */
  validBitsPerSample: number;
}

const SUPPORTED_BITS: Record<WavSampleEncoding, readonly number[]> = {
  pcm_int: [8, 16, 24, 32],
  float: [32, 64],
};

function readSubFormat(bytes: Uint8Array, offset: number): number {
  const code = readUint16(bytes, offset);
  for (let i = 0; i < SUBFORMAT_GUID_TAIL.length; i++) {
    if (bytes[offset + 2 + i] !== SUBFORMAT_GUID_TAIL[i]) {
      throw new EngineError('wav_unsupported_format', 'The extensible fmt chunk has a sub-format GUID that is neither PCM nor IEEE float.', {
        details: { subFormatCode: code },
      });
    }
  }
  return code;
}

function encodingOf(code: number, formatTag: number): WavSampleEncoding {
  if (code === WAVE_FORMAT_PCM) return 'pcm_int';
  if (code === WAVE_FORMAT_IEEE_FLOAT) return 'float';
  throw new EngineError(
    'wav_unsupported_format',
    `Unsupported WAV format code 0x${code.toString(16).padStart(4, '0')}: only PCM integer (1), IEEE float (3) and extensible (0xFFFE) with those sub-formats are read.`,
    { details: { formatTag, formatCode: code } },
  );
}

/** Parse and validate the fmt chunk; throws EngineError wav_* with a message naming the bad field. */
export function parseWavFormat(bytes: Uint8Array, fmt: ChunkLocation): WavFormat {
  const at = fmt.offset;
  if (fmt.size < 16) {
    throw new EngineError('wav_fmt_too_short', `The fmt chunk is ${fmt.size} bytes; it needs at least 16.`, { details: { fmtBytes: fmt.size } });
  }
  const formatTag = readUint16(bytes, at);
  const channelCount = readUint16(bytes, at + 2);
  const sampleRateHz = readUint32(bytes, at + 4);
  const blockAlign = readUint16(bytes, at + 12);
  const bitsPerSample = readUint16(bytes, at + 14);
  const extensible = formatTag === WAVE_FORMAT_EXTENSIBLE;
  let validBitsPerSample = bitsPerSample;
  let code = formatTag;
  if (extensible) {
    // cbSize (≥ 22) at 16, then wValidBitsPerSample, dwChannelMask and the 16-byte sub-format GUID.
    if (fmt.size < 40 || readUint16(bytes, at + 16) < 22) {
      throw new EngineError('wav_fmt_too_short', `The extensible fmt chunk is ${fmt.size} bytes; it needs 40 (cbSize ≥ 22).`, {
        details: { fmtBytes: fmt.size },
      });
    }
    const declaredValidBits = readUint16(bytes, at + 18);
    validBitsPerSample = declaredValidBits === 0 ? bitsPerSample : declaredValidBits;
    code = readSubFormat(bytes, at + 24);
  }
  const sampleEncoding = encodingOf(code, formatTag);

  if (channelCount === 0) throw new EngineError('wav_zero_channels', 'The fmt chunk declares 0 channels.', { field: 'channelCount' });
  if (sampleRateHz === 0) throw new EngineError('wav_sample_rate_invalid', 'The fmt chunk declares a sample rate of 0 Hz.', { field: 'sampleRateHz' });
  if (!SUPPORTED_BITS[sampleEncoding].includes(bitsPerSample) || validBitsPerSample > bitsPerSample) {
    const allowed = SUPPORTED_BITS[sampleEncoding].join(', ');
    throw new EngineError(
      'wav_unsupported_bit_depth',
      `Unsupported bit depth for ${sampleEncoding === 'float' ? 'IEEE float' : 'PCM integer'} samples: ${bitsPerSample} bits (valid ${validBitsPerSample}); supported: ${allowed}.`,
      { details: { bitsPerSample, validBitsPerSample, sampleEncoding } },
    );
  }
  const expectedBlockAlign = channelCount * (bitsPerSample / 8);
  if (blockAlign !== expectedBlockAlign) {
    throw new EngineError(
      'wav_block_align_invalid',
      `Block align is ${blockAlign} bytes but ${channelCount} channel(s) of ${bitsPerSample} bits need ${expectedBlockAlign}.`,
      { details: { blockAlign, expectedBlockAlign, channelCount, bitsPerSample } },
    );
  }
  return { formatTag, extensible, sampleEncoding, channelCount, sampleRateHz, blockAlign, bitsPerSample, validBitsPerSample };
}
