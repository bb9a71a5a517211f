import { EngineError } from '../errors';
import { WAVE_FORMAT_EXTENSIBLE, WAVE_FORMAT_IEEE_FLOAT, WAVE_FORMAT_PCM } from './wav-format';
import type { WavWriteEncoding, WavWriteInput } from './wav-types';

/**
 * RIFF WAVE writer for stimuli (Microsoft/IBM RIFF WAVE spec, 1991; WAVEFORMATEXTENSIBLE documentation).
 *
 * - float32: IEEE float (tag 3) with a fact chunk, samples stored as Math.fround(x).
 * - pcm16 / pcm24: code = x·2^(bits−1) rounded half away from zero, then clamped to [−2^(bits−1), 2^(bits−1)−1];
 *   the same symmetric divisor as the reader, so every code round-trips exactly. +1.0 clamps to the largest
 *   code. No dither is added (TPDF or otherwise): a stimulus generated in float64 is quantised plainly, and a
 *   caller who wants dither adds it before writing.
 * - More than two channels are written as WAVE_FORMAT_EXTENSIBLE with a channel mask of 0 (no speaker
 *   positions: measurement channels are not loudspeaker feeds), as the extensible documentation recommends.
 */
const BITS: Record<WavWriteEncoding, number> = { float32: 32, pcm24: 24, pcm16: 16 };

/** Largest data chunk a RIFF file can describe (32-bit sizes, minus the headers). */
const MAX_DATA_BYTES = 0xffffffff - 100;

function validate(input: WavWriteInput): void {
  const { sampleRateHz, channels, encoding } = input;
  if (!(encoding in BITS)) {
    throw new EngineError('wav_write_encoding_invalid', `Encoding must be float32, pcm24 or pcm16, got "${String(encoding)}".`, { field: 'encoding' });
  }
  if (!Number.isInteger(sampleRateHz) || sampleRateHz < 1 || sampleRateHz > 0xffffffff) {
    throw new EngineError('wav_write_sample_rate_invalid', `Sample rate must be a positive integer in Hz, got ${sampleRateHz}.`, {
      field: 'sampleRateHz',
    });
  }
  if (!Array.isArray(channels) || channels.length < 1 || channels.length > 0xffff) {
    throw new EngineError('wav_write_channels_invalid', 'A WAV needs between 1 and 65535 channels.', { field: 'channels' });
  }
  const frameCount = channels[0]?.length;
  channels.forEach((channel, index) => {
    if (!(channel instanceof Float64Array) || channel.length !== frameCount) {
      throw new EngineError('wav_write_channels_invalid', `Channel ${index} must be a Float64Array of ${frameCount} samples like channel 0.`, {
        field: `channels.${index}`,
      });
    }
  });
  if (frameCount * channels.length * (BITS[encoding] / 8) > MAX_DATA_BYTES) {
    throw new EngineError('wav_write_too_large', 'The samples do not fit a RIFF WAVE file (4 GiB limit).', { field: 'channels' });
  }
}

function requireFinite(value: number, channel: number, frame: number): void {
  if (value - value !== 0) {
    throw new EngineError('wav_write_non_finite_sample', `Sample at channel ${channel}, frame ${frame} is ${String(value)}; only finite samples can be written.`, {
      field: `channels.${channel}`,
      details: { channel, frame },
    });
  }
}

/** PCM code of x for `bits`: round half away from zero of x·2^(bits−1), clamped to the integer range. */
export function pcmCode(x: number, bits: number): number {
  const scale = 2 ** (bits - 1);
  const scaled = x * scale;
  const rounded = scaled < 0 ? -Math.round(-scaled) : Math.round(scaled);
  return Math.min(scale - 1, Math.max(-scale, rounded));
}

function writeAscii(bytes: Uint8Array, offset: number, text: string): void {
  for (let i = 0; i < text.length; i++) bytes[offset + i] = text.charCodeAt(i);
}

/** Encode channels (full scale ±1) as a RIFF WAVE: float32 (tag 3), or PCM 16/24 bit, symmetric 2^(bits−1) scaling, no dither. */
export function writeWav(input: WavWriteInput): Uint8Array {
  validate(input);
  const { sampleRateHz, channels, encoding } = input;
  const channelCount = channels.length;
  const frameCount = channels[0].length;
  const bits = BITS[encoding];
  const bytesPerSample = bits / 8;
  const blockAlign = channelCount * bytesPerSample;
  const dataBytes = frameCount * blockAlign;
  const extensible = channelCount > 2;
  const isFloat = encoding === 'float32';
  const fmtBytes = extensible ? 40 : isFloat ? 18 : 16;
  const factBytes = isFloat ? 12 : 0;
  const headerBytes = 12 + 8 + fmtBytes + factBytes + 8;
  const padByte = dataBytes & 1;
  const bytes = new Uint8Array(headerBytes + dataBytes + padByte);
  const view = new DataView(bytes.buffer);

  writeAscii(bytes, 0, 'RIFF');
  view.setUint32(4, bytes.length - 8, true);
  writeAscii(bytes, 8, 'WAVE');
  writeAscii(bytes, 12, 'fmt ');
  view.setUint32(16, fmtBytes, true);
  const formatCode = isFloat ? WAVE_FORMAT_IEEE_FLOAT : WAVE_FORMAT_PCM;
  view.setUint16(20, extensible ? WAVE_FORMAT_EXTENSIBLE : formatCode, true);
  view.setUint16(22, channelCount, true);
  view.setUint32(24, sampleRateHz, true);
  view.setUint32(28, sampleRateHz * blockAlign, true);
  view.setUint16(32, blockAlign, true);
  view.setUint16(34, bits, true);
  let position = 36;
  if (extensible) {
    view.setUint16(36, 22, true);
    view.setUint16(38, bits, true);
    view.setUint32(40, 0, true);
    // Sub-format GUID: format code, then the KSDATAFORMAT_SUBTYPE tail.
    view.setUint16(44, formatCode, true);
    bytes.set([0x00, 0x00, 0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71], 46);
    position = 60;
  } else if (isFloat) {
    view.setUint16(36, 0, true);
    position = 38;
  }
  if (isFloat) {
    writeAscii(bytes, position, 'fact');
    view.setUint32(position + 4, 4, true);
    view.setUint32(position + 8, frameCount, true);
    position += 12;
  }
  writeAscii(bytes, position, 'data');
  view.setUint32(position + 4, dataBytes, true);
  const dataOffset = position + 8;

  for (let c = 0; c < channelCount; c++) {
    const samples = channels[c];
    let p = dataOffset + c * bytesPerSample;
    for (let i = 0; i < frameCount; i++, p += blockAlign) {
      const x = samples[i];
      requireFinite(x, c, i);
      if (isFloat) {
        const single = Math.fround(x);
        requireFinite(single, c, i);
        view.setFloat32(p, single, true);
      } else {
        const code = pcmCode(x, bits);
        bytes[p] = code & 0xff;
        bytes[p + 1] = (code >> 8) & 0xff;
        if (bits === 24) bytes[p + 2] = (code >> 16) & 0xff;
      }
    }
  }
  return bytes;
}
