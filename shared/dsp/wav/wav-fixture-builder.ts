/**
 * Test helper: assembles WAV files byte by byte from the RIFF WAVE layout (Microsoft/IBM RIFF WAVE spec, 1991;
 * WAVEFORMATEXTENSIBLE documentation), independently of the writer under test, so fixtures can be exactly as
 * broken as a test needs.
 */

export type Bytes = Uint8Array | readonly number[];

function toBytes(body: Bytes): Uint8Array {
  return body instanceof Uint8Array ? body : Uint8Array.from(body);
}

/** Bytes of an ASCII string. */
export function ascii(text: string): Uint8Array {
  return Uint8Array.from(text, (ch) => ch.charCodeAt(0));
}

/** Little-endian uint16 bytes. */
export function u16(value: number): number[] {
  return [value & 0xff, (value >>> 8) & 0xff];
}

/** Little-endian uint32 bytes. */
export function u32(value: number): number[] {
  return [value & 0xff, (value >>> 8) & 0xff, (value >>> 16) & 0xff, (value >>> 24) & 0xff];
}

/** Concatenate byte sequences. */
export function concat(...parts: Bytes[]): Uint8Array {
  const arrays = parts.map(toBytes);
  const out = new Uint8Array(arrays.reduce((sum, part) => sum + part.length, 0));
  let offset = 0;
  for (const part of arrays) {
    out.set(part, offset);
    offset += part.length;
  }
  return out;
}

export interface ChunkOptions {
  /** Size written in the header instead of the body length. */
  declaredSize?: number;
  /** Leave out the pad byte after an odd-sized body (a writer bug). */
  omitPad?: boolean;
}

/** One chunk: id, uint32 LE size, body and the pad byte after an odd-sized body. */
export function chunk(id: string, body: Bytes, options: ChunkOptions = {}): Uint8Array {
  const data = toBytes(body);
  const pad = data.length % 2 === 1 && !options.omitPad ? [0] : [];
  return concat(ascii(id.padEnd(4, ' ')), u32(options.declaredSize ?? data.length), data, pad);
}

export interface RiffOptions {
  riffId?: string;
  formType?: string;
  declaredSize?: number;
}

/** RIFF form around the given chunks. */
export function riff(chunks: Bytes[], options: RiffOptions = {}): Uint8Array {
  const body = concat(ascii(options.formType ?? 'WAVE'), ...chunks);
  return concat(ascii(options.riffId ?? 'RIFF'), u32(options.declaredSize ?? body.length), body);
}

export interface PlainFormat {
  formatTag: number;
  channels: number;
  sampleRateHz: number;
  bitsPerSample: number;
  blockAlign?: number;
  byteRate?: number;
  /** Append a cbSize field of this value (WAVEFORMATEX, 18 bytes). */
  cbSize?: number;
}

/** Body of a 16-byte (or 18 with cbSize) fmt chunk. */
export function fmtBody(format: PlainFormat): Uint8Array {
  const blockAlign = format.blockAlign ?? format.channels * Math.ceil(format.bitsPerSample / 8);
  return concat(
    u16(format.formatTag),
    u16(format.channels),
    u32(format.sampleRateHz),
    u32(format.byteRate ?? format.sampleRateHz * blockAlign),
    u16(blockAlign),
    u16(format.bitsPerSample),
    format.cbSize === undefined ? [] : u16(format.cbSize),
  );
}

export const KSDATAFORMAT_TAIL = [0x00, 0x00, 0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71];

export interface ExtensibleFormat {
  channels: number;
  sampleRateHz: number;
  bitsPerSample: number;
  validBitsPerSample?: number;
  channelMask?: number;
  /** 1 = KSDATAFORMAT_SUBTYPE_PCM, 3 = KSDATAFORMAT_SUBTYPE_IEEE_FLOAT. */
  subFormatCode: number;
  guidTail?: readonly number[];
  blockAlign?: number;
}

/** Body of a 40-byte WAVE_FORMAT_EXTENSIBLE fmt chunk. */
export function fmtExtensibleBody(format: ExtensibleFormat): Uint8Array {
  const base = fmtBody({
    formatTag: 0xfffe,
    channels: format.channels,
    sampleRateHz: format.sampleRateHz,
    bitsPerSample: format.bitsPerSample,
    blockAlign: format.blockAlign,
    cbSize: 22,
  });
  return concat(
    base,
    u16(format.validBitsPerSample ?? format.bitsPerSample),
    u32(format.channelMask ?? 0),
    u16(format.subFormatCode),
    format.guidTail ?? KSDATAFORMAT_TAIL,
  );
}

/** Interleave integer codes (frames × channels) as little-endian two's complement (8-bit: offset binary, +128). */
export function integerSamples(frames: readonly (readonly number[])[], bits: number): Uint8Array {
  const bytesPerSample = bits / 8;
  const out: number[] = [];
  for (const frame of frames) {
    for (const code of frame) {
      const stored = bits === 8 ? code + 128 : code;
      for (let b = 0; b < bytesPerSample; b++) out.push(Number((BigInt(stored) >> BigInt(8 * b)) & 0xffn));
    }
  }
  return Uint8Array.from(out);
}

/** Interleave float values (frames × channels) as little-endian IEEE 754 of 32 or 64 bits. */
export function floatSamples(frames: readonly (readonly number[])[], bits: 32 | 64): Uint8Array {
  const values = frames.flat();
  const out = new Uint8Array(values.length * (bits / 8));
  const view = new DataView(out.buffer);
  values.forEach((value, i) => {
    if (bits === 32) view.setFloat32(4 * i, value, true);
    else view.setFloat64(8 * i, value, true);
  });
  return out;
}

/** Small seeded PRNG, so fuzz runs are reproducible. */
export { seededUniform as seededRandom } from '../seeded-noise';
