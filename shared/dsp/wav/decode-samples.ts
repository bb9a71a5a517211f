import { EngineError } from '../errors';
import type { WavFormat } from './wav-format';

/**
 * Interleaved little-endian samples → one Float64Array per channel, full scale ±1.
 *
 * Integer codes are divided by exactly 2^(bits−1) for both signs, where bits is the container size (AES17
 * full-scale convention: a sine whose peaks reach the largest codes reads 0 dBFS). The most negative code reads
 * exactly −1, the most positive (2^(bits−1)−1)/2^(bits−1): +1 itself has no code. 8-bit PCM is unsigned with
 * 128 as zero (RIFF WAVE spec, 1991). Samples with fewer valid bits than the container (extensible
 * wValidBitsPerSample) are left-justified, so the same divisor applies.
 */
export function decodeSamples(bytes: Uint8Array, dataOffset: number, frameCount: number, format: WavFormat): Float64Array[] {
  const { channelCount, blockAlign } = format;
  const channels: Float64Array[] = [];
  for (let c = 0; c < channelCount; c++) channels.push(new Float64Array(frameCount));
  const bytesPerSample = format.bitsPerSample / 8;
  for (let c = 0; c < channelCount; c++) {
    const out = channels[c];
    const start = dataOffset + c * bytesPerSample;
    if (format.sampleEncoding === 'float') decodeFloatChannel(bytes, start, blockAlign, frameCount, format.bitsPerSample, out, c);
    else decodeIntegerChannel(bytes, start, blockAlign, frameCount, format.bitsPerSample, out);
  }
  return channels;
}

function decodeIntegerChannel(
  bytes: Uint8Array,
  start: number,
  stride: number,
  frameCount: number,
  bits: number,
  out: Float64Array,
): void {
  let p = start;
  switch (bits) {
    case 8:
      for (let i = 0; i < frameCount; i++, p += stride) out[i] = (bytes[p] - 128) / 128;
      return;
    case 16:
      for (let i = 0; i < frameCount; i++, p += stride) out[i] = (((bytes[p] | (bytes[p + 1] << 8)) << 16) >> 16) / 32768;
      return;
    case 24:
      for (let i = 0; i < frameCount; i++, p += stride) {
        out[i] = (((bytes[p] | (bytes[p + 1] << 8) | (bytes[p + 2] << 16)) << 8) >> 8) / 8388608;
      }
      return;
    case 32:
      for (let i = 0; i < frameCount; i++, p += stride) {
        out[i] = (bytes[p] | (bytes[p + 1] << 8) | (bytes[p + 2] << 16) | (bytes[p + 3] << 24)) / 2147483648;
      }
      return;
    default:
      throw new EngineError('wav_unsupported_bit_depth', `Unsupported PCM bit depth ${bits}.`, { details: { bitsPerSample: bits } });
  }
}

/** Every `step`-th sample of `samples` into `out` (one channel of interleaved frames). */
function copyStrided(samples: Float32Array | Float64Array, step: number, frameCount: number, out: Float64Array): void {
  if (step === 1) {
    out.set(samples.subarray(0, frameCount));
    return;
  }
  for (let i = 0, j = 0; i < frameCount; i++, j += step) out[i] = samples[j];
}

/** WAV samples are little-endian; a typed-array view reads them directly only on a little-endian host. */
const LITTLE_ENDIAN_HOST = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

function decodeFloatChannel(
  bytes: Uint8Array,
  start: number,
  stride: number,
  frameCount: number,
  bits: number,
  out: Float64Array,
  channel: number,
): void {
  const width = bits / 8;
  if (LITTLE_ENDIAN_HOST && frameCount > 0 && stride % width === 0) {
    // On a little-endian host the samples are read through a typed view, several times faster than a DataView. A
    // view needs its start aligned to the sample width; many float files put the data at byte 58 (18-byte format
    // chunk and a fact chunk), so unaligned samples are first copied to a fresh, aligned buffer.
    const step = stride / width;
    const length = (frameCount - 1) * step + 1;
    const aligned = (bytes.byteOffset + start) % width === 0;
    // A copy through the Uint8Array constructor: a Node Buffer's slice() would share the memory, not copy it.
    const source = aligned ? bytes : new Uint8Array(bytes.subarray(start, start + length * width));
    const offset = aligned ? bytes.byteOffset + start : 0;
    if (bits === 32) copyStrided(new Float32Array(source.buffer, offset, length), step, frameCount, out);
    else copyStrided(new Float64Array(source.buffer, offset, length), step, frameCount, out);
  } else {
    const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    let p = start;
    if (bits === 32) {
      for (let i = 0; i < frameCount; i++, p += stride) out[i] = view.getFloat32(p, true);
    } else {
      for (let i = 0; i < frameCount; i++, p += stride) out[i] = view.getFloat64(p, true);
    }
  }
  for (let i = 0; i < frameCount; i++) {
    const value = out[i];
    // value − value is NaN exactly for NaN and ±Infinity.
    if (value - value !== 0) {
      throw new EngineError(
        'wav_non_finite_sample',
        `Float sample at channel ${channel}, frame ${i} (both counted from 0) is ${String(value)}; captures must hold finite numbers.`,
        { details: { channel, frame: i, value: String(value) } },
      );
    }
  }
}
