import { describe, expect, it } from 'vitest';
import { isEngineError } from '../errors';
import { readWav } from './read-wav';
import { pcmCode, writeWav } from './write-wav';
import type { WavWriteEncoding } from './wav-types';

// Header layout checked field by field against the RIFF WAVE spec (Microsoft/IBM 1991) and the
// WAVEFORMATEXTENSIBLE documentation, read with a DataView independent of our reader.

function text(bytes: Uint8Array, offset: number): string {
  return String.fromCharCode(...bytes.subarray(offset, offset + 4));
}

function ramp(length: number, scale: number, phase = 0): Float64Array {
  const out = new Float64Array(length);
  for (let n = 0; n < length; n++) out[n] = scale * Math.sin(0.01 * n + phase);
  return out;
}

describe('writeWav header layout', () => {
  it('writes a 16-byte PCM fmt chunk for pcm16 stereo (tag 1, byte rate, block align)', () => {
    const bytes = writeWav({ sampleRateHz: 48_000, channels: [ramp(10, 0.5), ramp(10, 0.5, 1)], encoding: 'pcm16' });
    const view = new DataView(bytes.buffer);
    expect(text(bytes, 0)).toBe('RIFF');
    expect(view.getUint32(4, true)).toBe(bytes.length - 8);
    expect(text(bytes, 8)).toBe('WAVE');
    expect(text(bytes, 12)).toBe('fmt ');
    expect(view.getUint32(16, true)).toBe(16);
    expect(view.getUint16(20, true)).toBe(1);
    expect(view.getUint16(22, true)).toBe(2);
    expect(view.getUint32(24, true)).toBe(48_000);
    expect(view.getUint32(28, true)).toBe(48_000 * 4);
    expect(view.getUint16(32, true)).toBe(4);
    expect(view.getUint16(34, true)).toBe(16);
    expect(text(bytes, 36)).toBe('data');
    expect(view.getUint32(40, true)).toBe(40);
    expect(bytes.length).toBe(44 + 40);
  });

  it('writes IEEE float (tag 3, cbSize 0) with a fact chunk holding the frame count for float32', () => {
    const bytes = writeWav({ sampleRateHz: 44_100, channels: [ramp(7, 0.9)], encoding: 'float32' });
    const view = new DataView(bytes.buffer);
    expect(view.getUint32(16, true)).toBe(18);
    expect(view.getUint16(20, true)).toBe(3);
    expect(view.getUint16(34, true)).toBe(32);
    expect(view.getUint16(36, true)).toBe(0);
    expect(text(bytes, 38)).toBe('fact');
    expect(view.getUint32(46, true)).toBe(7);
    expect(text(bytes, 50)).toBe('data');
  });

  it('writes WAVE_FORMAT_EXTENSIBLE with the PCM sub-format GUID for more than two channels', () => {
    const channels = [0, 1, 2, 3].map((c) => ramp(5, 0.3, c));
    const bytes = writeWav({ sampleRateHz: 96_000, channels, encoding: 'pcm24' });
    const view = new DataView(bytes.buffer);
    expect(view.getUint32(16, true)).toBe(40);
    expect(view.getUint16(20, true)).toBe(0xfffe);
    expect(view.getUint16(36, true)).toBe(22);
    expect(view.getUint16(38, true)).toBe(24);
    // KSDATAFORMAT_SUBTYPE_PCM = 00000001-0000-0010-8000-00AA00389B71.
    expect(Array.from(bytes.subarray(44, 60))).toEqual([1, 0, 0, 0, 0, 0, 0x10, 0, 0x80, 0, 0, 0xaa, 0, 0x38, 0x9b, 0x71]);
  });

  it('adds the RIFF pad byte after an odd-sized data chunk (pcm24 mono, 3 frames = 9 bytes)', () => {
    const bytes = writeWav({ sampleRateHz: 48_000, channels: [Float64Array.from([0.1, 0.2, 0.3])], encoding: 'pcm24' });
    const view = new DataView(bytes.buffer);
    expect(view.getUint32(40, true)).toBe(9);
    expect(bytes.length).toBe(44 + 9 + 1);
    expect(bytes.length % 2).toBe(0);
  });
});

describe('writeWav → readWav round trip', () => {
  const encodings: WavWriteEncoding[] = ['float32', 'pcm24', 'pcm16'];
  for (const encoding of encodings) {
    for (const channelCount of [1, 2, 5]) {
      it(`${encoding}, ${channelCount} channel(s): every sample comes back as its stored value`, () => {
        const channels = Array.from({ length: channelCount }, (_, c) => ramp(1001, 0.99, c));
        const wav = readWav(writeWav({ sampleRateHz: 48_000, channels, encoding }));
        expect(wav.channelCount).toBe(channelCount);
        expect(wav.frameCount).toBe(1001);
        expect(wav.extensible).toBe(channelCount > 2);
        const bits = encoding === 'pcm16' ? 16 : 24;
        for (let c = 0; c < channelCount; c++) {
          for (let n = 0; n < 1001; n++) {
            const expected = encoding === 'float32' ? Math.fround(channels[c][n]) : pcmCode(channels[c][n], bits) / 2 ** (bits - 1);
            if (wav.channels[c][n] !== expected) throw new Error(`channel ${c} frame ${n}: ${wav.channels[c][n]} ≠ ${expected}`);
          }
        }
      });
    }
  }

  it('PCM codes round-trip exactly: k/2^(n−1) written reads back k/2^(n−1)', () => {
    for (const [encoding, bits] of [['pcm16', 16], ['pcm24', 24]] as const) {
      const full = 2 ** (bits - 1);
      const codes = [-full, -full + 1, -3, -1, 0, 1, 3, full - 2, full - 1];
      const wav = readWav(writeWav({ sampleRateHz: 48_000, channels: [Float64Array.from(codes, (k) => k / full)], encoding }));
      expect(Array.from(wav.channels[0])).toEqual(codes.map((k) => k / full));
    }
  });
});

describe('pcmCode rounding and clamping (symmetric 2^(n−1) scaling, no dither)', () => {
  it('rounds half away from zero so x and −x give opposite codes', () => {
    expect(pcmCode(0.5 / 32768, 16)).toBe(1);
    expect(pcmCode(-0.5 / 32768, 16)).toBe(-1);
    expect(pcmCode(1.49 / 32768, 16)).toBe(1);
    expect(pcmCode(-1.5 / 32768, 16)).toBe(-2);
    expect(pcmCode(0.4999 / 8388608, 24)).toBe(0);
  });

  it('clamps +1 and beyond to the largest code and −1 and beyond to the smallest', () => {
    expect(pcmCode(1, 16)).toBe(32767);
    expect(pcmCode(1.7, 16)).toBe(32767);
    expect(pcmCode(-1, 16)).toBe(-32768);
    expect(pcmCode(-3, 24)).toBe(-8388608);
    expect(pcmCode(1, 24)).toBe(8388607);
  });
});

describe('writeWav validation', () => {
  const base = { sampleRateHz: 48_000, channels: [new Float64Array(4)], encoding: 'pcm16' as WavWriteEncoding };
  const cases: [string, () => unknown, string][] = [
    ['no channels', () => writeWav({ ...base, channels: [] }), 'wav_write_channels_invalid'],
    ['unequal channel lengths', () => writeWav({ ...base, channels: [new Float64Array(4), new Float64Array(3)] }), 'wav_write_channels_invalid'],
    ['a channel that is not a Float64Array', () => writeWav({ ...base, channels: [[0, 0] as unknown as Float64Array] }), 'wav_write_channels_invalid'],
    ['sample rate 0', () => writeWav({ ...base, sampleRateHz: 0 }), 'wav_write_sample_rate_invalid'],
    ['fractional sample rate', () => writeWav({ ...base, sampleRateHz: 44_100.5 }), 'wav_write_sample_rate_invalid'],
    ['unknown encoding', () => writeWav({ ...base, encoding: 'pcm8' as WavWriteEncoding }), 'wav_write_encoding_invalid'],
    ['NaN sample', () => writeWav({ ...base, channels: [Float64Array.from([0, Number.NaN])] }), 'wav_write_non_finite_sample'],
    ['sample beyond float32 range', () => writeWav({ ...base, encoding: 'float32', channels: [Float64Array.from([1e39])] }), 'wav_write_non_finite_sample'],
  ];
  for (const [name, run, code] of cases) {
    it(`refuses ${name} with ${code}`, () => {
      let error: unknown;
      try {
        run();
      } catch (caught) {
        error = caught;
      }
      expect(isEngineError(error) && error.code).toBe(code);
    });
  }
});
