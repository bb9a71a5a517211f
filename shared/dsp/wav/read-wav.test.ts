import { describe, expect, it } from 'vitest';
import { dbfsFromRms } from '@shared/units/levels';
import { readWav, readWavInfo } from './read-wav';
import {
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

// Layouts: Microsoft/IBM "Multimedia Programming Interface and Data Specifications 1.0" (1991), RIFF WAVE;
// Microsoft WAVEFORMATEXTENSIBLE documentation (sub-format GUIDs KSDATAFORMAT_SUBTYPE_PCM / _IEEE_FLOAT).

function pcmFile(bits: number, frames: number[][], sampleRateHz = 48_000): Uint8Array {
  return riff([chunk('fmt ', fmtBody({ formatTag: 1, channels: frames[0].length, sampleRateHz, bitsPerSample: bits })), chunk('data', integerSamples(frames, bits))]);
}

describe('readWav: integer PCM, hand-built fixtures', () => {
  it('reads 8-bit unsigned PCM with 128 as zero, divided by 128 (RIFF WAVE spec 1991: 8-bit is unsigned)', () => {
    const wav = readWav(pcmFile(8, [[-128], [-64], [0], [1], [127]], 8000));
    expect(Array.from(wav.channels[0])).toEqual([-1, -0.5, 0, 1 / 128, 127 / 128]);
    expect(wav).toMatchObject({ bitsPerSample: 8, sampleEncoding: 'pcm_int', formatTag: 1, extensible: false, frameCount: 5 });
  });

  for (const bits of [16, 24, 32]) {
    it(`reads ${bits}-bit PCM codes k as exactly k/2^${bits - 1} for both signs (AES17 full scale)`, () => {
      const full = 2 ** (bits - 1);
      const codes = [-full, -full + 1, -12345, -1, 0, 1, 12345, full - 1];
      const wav = readWav(pcmFile(bits, codes.map((code) => [code, -code - 1])));
      expect(Array.from(wav.channels[0])).toEqual(codes.map((code) => code / full));
      expect(Array.from(wav.channels[1])).toEqual(codes.map((code) => (-code - 1) / full));
      // The negative full-scale code reads exactly −1; the positive extreme is one code short of +1.
      expect(wav.channels[0][0]).toBe(-1);
      expect(wav.channels[0][codes.length - 1]).toBe((full - 1) / full);
    });
  }

  it('reads a full-scale sine (peaks at the extreme codes) as 0 dBFS within the quantisation of one code (AES17)', () => {
    for (const bits of [16, 24]) {
      const full = 2 ** (bits - 1);
      const period = 48;
      const frames: number[][] = [];
      for (let n = 0; n < 480; n++) {
        const x = Math.sin((2 * Math.PI * n) / period + Math.PI / 2);
        frames.push([Math.max(-full, Math.min(full - 1, Math.round(x * full)))]);
      }
      const samples = readWav(pcmFile(bits, frames)).channels[0];
      let sumSquares = 0;
      for (const value of samples) sumSquares += value * value;
      const levelDbfs = dbfsFromRms(Math.sqrt(sumSquares / samples.length));
      // The +1 → (2^(n−1)−1)/2^(n−1) clamp costs at most ~20·log10(1 − 2^(1−n))/2 dB.
      expect(Math.abs(levelDbfs)).toBeLessThan(bits === 16 ? 3e-4 : 2e-6);
    }
  });

  it('reads a 4-channel 32-bit file with the channels de-interleaved in order', () => {
    const frames = [
      [1, 2, 3, 4],
      [-5, -6, -7, -8],
    ];
    const wav = readWav(pcmFile(32, frames));
    expect(wav.channelCount).toBe(4);
    expect(wav.channels.map((channel) => Array.from(channel))).toEqual([
      [1 / 2 ** 31, -5 / 2 ** 31],
      [2 / 2 ** 31, -6 / 2 ** 31],
      [3 / 2 ** 31, -7 / 2 ** 31],
      [4 / 2 ** 31, -8 / 2 ** 31],
    ]);
  });
});

describe('readWav: IEEE float, hand-built fixtures', () => {
  it('reads 32-bit float samples exactly as stored, values beyond ±1 kept', () => {
    const values = [0, 0.5, -0.25, 1.5, -2, Math.fround(0.1)];
    const file = riff([
      chunk('fmt ', fmtBody({ formatTag: 3, channels: 1, sampleRateHz: 44_100, bitsPerSample: 32, cbSize: 0 })),
      chunk('fact', u32(values.length)),
      chunk('data', floatSamples(values.map((v) => [v]), 32)),
    ]);
    const wav = readWav(file);
    expect(Array.from(wav.channels[0])).toEqual(values);
    expect(wav).toMatchObject({ sampleEncoding: 'float', bitsPerSample: 32, formatTag: 3, sampleRateHz: 44_100 });
  });

  it('reads 64-bit float samples bit-exactly', () => {
    const values = [Math.PI / 4, -1 / 3, 1e-300, -0.999999999999];
    const file = riff([
      chunk('fmt ', fmtBody({ formatTag: 3, channels: 2, sampleRateHz: 96_000, bitsPerSample: 64 })),
      chunk('data', floatSamples([values.slice(0, 2), values.slice(2)], 64)),
    ]);
    const wav = readWav(file);
    expect(Array.from(wav.channels[0])).toEqual([values[0], values[2]]);
    expect(Array.from(wav.channels[1])).toEqual([values[1], values[3]]);
  });

  // Samples are read through a typed view, straight from the file's bytes when aligned to the sample width, else from
  // an aligned copy: every placement must give the stored values.
  for (const bits of [32, 64] as const) {
    it(`reads ${bits}-bit float stereo the same whether the samples sit aligned in memory or not`, () => {
      const left = [0.5, Math.fround(-0.1), 3, -1e-6];
      const right = [-0.5, 0.25, Math.fround(1 / 3), 0];
      const expected = (values: number[]) => (bits === 32 ? values.map(Math.fround) : values);
      const file = riff([
        chunk('fmt ', fmtBody({ formatTag: 3, channels: 2, sampleRateHz: 48_000, bitsPerSample: bits })),
        // 12 + 24 + 12 + 8 bytes before the samples: offset 56, a multiple of both 4 and 8.
        chunk('fact', u32(left.length)),
        chunk('data', floatSamples(left.map((v, i) => [v, right[i]]), bits)),
      ]);
      const shifted = new Uint8Array(file.length + 1).subarray(1);
      shifted.set(file);
      // A Node Buffer at an odd offset in a larger buffer, as an upload read from disk can be.
      const pooled = Buffer.concat([Buffer.from([0x55]), Buffer.from(file)]).subarray(1);
      for (const bytes of [file, shifted, pooled]) {
        const wav = readWav(bytes);
        expect(Array.from(wav.channels[0])).toEqual(expected(left));
        expect(Array.from(wav.channels[1])).toEqual(expected(right));
      }
    });
  }
});

describe('readWav: WAVE_FORMAT_EXTENSIBLE', () => {
  it('reads 24-bit PCM extensible (KSDATAFORMAT_SUBTYPE_PCM) with symmetric scaling', () => {
    const full = 2 ** 23;
    const frames = [
      [-full, full - 1],
      [4096, -4096],
      [0, 1],
    ];
    const file = riff([
      chunk('fmt ', fmtExtensibleBody({ channels: 2, sampleRateHz: 48_000, bitsPerSample: 24, channelMask: 0x3, subFormatCode: 1 })),
      chunk('data', integerSamples(frames, 24)),
    ]);
    const wav = readWav(file);
    expect(wav).toMatchObject({ formatTag: 0xfffe, extensible: true, sampleEncoding: 'pcm_int', bitsPerSample: 24, channelCount: 2, frameCount: 3 });
    expect(Array.from(wav.channels[0])).toEqual([-1, 4096 / full, 0]);
    expect(Array.from(wav.channels[1])).toEqual([(full - 1) / full, -4096 / full, 1 / full]);
  });

  it('reads 20 valid bits left-justified in a 24-bit container with the container divisor', () => {
    // wValidBitsPerSample < wBitsPerSample: the low 4 bits are zero, so the value is code/2^23 as for 24 bits.
    const code = 0x7ffff0; // largest 20-bit value, left-justified
    const file = riff([
      chunk('fmt ', fmtExtensibleBody({ channels: 1, sampleRateHz: 48_000, bitsPerSample: 24, validBitsPerSample: 20, subFormatCode: 1 })),
      chunk('data', integerSamples([[code], [-0x800000]], 24)),
    ]);
    expect(Array.from(readWav(file).channels[0])).toEqual([code / 2 ** 23, -1]);
  });

  it('reads 32-bit float extensible (KSDATAFORMAT_SUBTYPE_IEEE_FLOAT) and a 6-channel 16-bit file', () => {
    const floatFile = riff([
      chunk('fmt ', fmtExtensibleBody({ channels: 1, sampleRateHz: 48_000, bitsPerSample: 32, subFormatCode: 3 })),
      chunk('data', floatSamples([[0.25], [-0.75]], 32)),
    ]);
    expect(Array.from(readWav(floatFile).channels[0])).toEqual([0.25, -0.75]);

    const six = [[1, 2, 3, 4, 5, -32768]];
    const sixFile = riff([
      chunk('fmt ', fmtExtensibleBody({ channels: 6, sampleRateHz: 48_000, bitsPerSample: 16, channelMask: 0x3f, subFormatCode: 1 })),
      chunk('data', integerSamples(six, 16)),
    ]);
    const wav = readWav(sixFile);
    expect(wav.channelCount).toBe(6);
    expect(wav.channels.map((channel) => channel[0])).toEqual(six[0].map((code) => code / 32768));
  });
});

describe('readWav: chunk walking', () => {
  const fmt16 = chunk('fmt ', fmtBody({ formatTag: 1, channels: 1, sampleRateHz: 48_000, bitsPerSample: 16 }));
  const data16 = chunk('data', integerSamples([[100], [-100], [7]], 16));
  const expected = [100 / 32768, -100 / 32768, 7 / 32768];

  it('reads a LIST chunk placed before fmt', () => {
    const list = chunk('LIST', concat(ascii('INFOISFT'), u32(6), ascii('KB-65\0')));
    expect(Array.from(readWav(riff([list, fmt16, data16])).channels[0])).toEqual(expected);
  });

  it('skips an odd-sized chunk and its RIFF pad byte (RIFF 1991: chunks are word-aligned)', () => {
    const oddJunk = chunk('JUNK', [1, 2, 3, 4, 5]);
    expect(oddJunk.length).toBe(8 + 5 + 1);
    const bext = chunk('bext', new Uint8Array(603));
    expect(Array.from(readWav(riff([fmt16, oddJunk, bext, data16])).channels[0])).toEqual(expected);
  });

  it('skips fact, cue and unknown chunks after the data chunk', () => {
    const file = riff([fmt16, chunk('fact', u32(3)), data16, chunk('cue ', new Uint8Array(28)), chunk('zzzz', [9])]);
    expect(readWav(file).frameCount).toBe(3);
  });

  it('reads an odd-sized data chunk (24-bit mono, 3 frames = 9 bytes) followed by its pad byte and another chunk', () => {
    const data = chunk('data', integerSamples([[1], [2], [3]], 24));
    expect(data.length).toBe(8 + 9 + 1);
    const file = riff([chunk('fmt ', fmtBody({ formatTag: 1, channels: 1, sampleRateHz: 48_000, bitsPerSample: 24 })), data, chunk('LIST', ascii('INFO'))]);
    expect(Array.from(readWav(file).channels[0])).toEqual([1, 2, 3].map((code) => code / 2 ** 23));
  });

  it('accepts a final odd data chunk whose pad byte is missing at the end of the file', () => {
    const data = chunk('data', integerSamples([[1], [2], [3]], 8), { omitPad: true });
    const file = riff([chunk('fmt ', fmtBody({ formatTag: 1, channels: 1, sampleRateHz: 8000, bitsPerSample: 8 })), data]);
    expect(readWav(file).frameCount).toBe(3);
  });

  it('accepts a fmt chunk with extra trailing bytes (cbSize and extension) and ignores a wrong byte rate', () => {
    const fmt = chunk('fmt ', concat(fmtBody({ formatTag: 1, channels: 1, sampleRateHz: 48_000, bitsPerSample: 16, byteRate: 1, cbSize: 2 }), [0, 0]));
    expect(readWav(riff([fmt, data16])).frameCount).toBe(3);
  });

  it('reads a streaming writer’s 0xFFFFFFFF data size as "to the end of the file", whole frames only', () => {
    const samples = integerSamples([[1], [2], [3]], 16);
    const file = riff([fmt16, concat(ascii('data'), u32(0xffffffff), samples, [0x55])], { declaredSize: 0xffffffff });
    const wav = readWav(file);
    expect(Array.from(wav.channels[0])).toEqual([1, 2, 3].map((code) => code / 32768));
    expect(wav.dataSizeFromFileLength).toBe(true);
  });

  it('tolerates a RIFF size that overstates the file when every chunk is complete', () => {
    expect(readWav(riff([fmt16, data16], { declaredSize: 1_000_000 })).frameCount).toBe(3);
  });

  it('reads an empty data chunk as zero frames', () => {
    const wav = readWav(riff([fmt16, chunk('data', [])]));
    expect(wav.frameCount).toBe(0);
    expect(wav.channels[0].length).toBe(0);
  });
});

describe('readWavInfo', () => {
  it('returns the header facts without samples, equal to readWav’s', () => {
    const file = pcmFile(24, [[1, 2], [3, 4], [5, 6]], 96_000);
    const info = readWavInfo(file);
    const { channels, ...decodedInfo } = readWav(file);
    expect(channels.length).toBe(2);
    expect(info).toEqual(decodedInfo);
    expect(info).toEqual({
      sampleRateHz: 96_000,
      channelCount: 2,
      frameCount: 3,
      durationSeconds: 3 / 96_000,
      bitsPerSample: 24,
      sampleEncoding: 'pcm_int',
      formatTag: 1,
      extensible: false,
      dataSizeFromFileLength: false,
    });
  });
});
