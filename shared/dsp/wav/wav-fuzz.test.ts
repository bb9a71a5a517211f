import { describe, expect, it } from 'vitest';
import { isEngineError } from '../errors';
import { readWav, readWavInfo } from './read-wav';
import { writeWav } from './write-wav';
import type { DecodedWav, WavInfo } from './wav-types';
import { chunk, fmtBody, fmtExtensibleBody, integerSamples, riff, seededRandom, ascii, floatSamples } from './wav-fixture-builder';

// Robustness (common practice, no source): truncations, byte flips and overwritten size fields of valid files
// must either decode to finite samples or be refused with an EngineError, never any other exception.

function validFiles(): Uint8Array[] {
  const tone = (length: number, phase: number) => Float64Array.from({ length }, (_, n) => 0.8 * Math.sin(0.07 * n + phase));
  return [
    writeWav({ sampleRateHz: 48_000, channels: [tone(40, 0)], encoding: 'pcm16' }),
    writeWav({ sampleRateHz: 48_000, channels: [tone(31, 0), tone(31, 1)], encoding: 'pcm24' }),
    writeWav({ sampleRateHz: 96_000, channels: [tone(20, 0), tone(20, 1), tone(20, 2)], encoding: 'float32' }),
    riff([
      chunk('LIST', ascii('INFOKB-M10')),
      chunk('fmt ', fmtExtensibleBody({ channels: 2, sampleRateHz: 48_000, bitsPerSample: 24, subFormatCode: 1 })),
      chunk('JUNK', [1, 2, 3]),
      chunk('data', integerSamples([[1, -1], [8388607, -8388608], [5, 7]], 24)),
    ]),
    riff([chunk('fmt ', fmtBody({ formatTag: 1, channels: 1, sampleRateHz: 8000, bitsPerSample: 8 })), chunk('data', integerSamples([[0], [127], [-128]], 8))]),
    riff([chunk('fmt ', fmtBody({ formatTag: 3, channels: 1, sampleRateHz: 48_000, bitsPerSample: 64 })), chunk('data', floatSamples([[0.5], [-0.5]], 64))]),
  ];
}

function mutate(source: Uint8Array, random: () => number): Uint8Array {
  const kind = Math.floor(random() * 4);
  if (kind === 0) return source.slice(0, Math.floor(random() * source.length));
  const bytes = source.slice();
  if (kind === 1) {
    const flips = 1 + Math.floor(random() * 4);
    for (let i = 0; i < flips; i++) bytes[Math.floor(random() * bytes.length)] ^= 1 << Math.floor(random() * 8);
  } else if (kind === 2) {
    // Overwrite a 32-bit field in the header area with an extreme or random value.
    const offset = 4 * Math.floor((random() * Math.min(bytes.length - 4, 64)) / 4);
    const extremes = [0, 1, 0xffffffff, 0x7fffffff, 0x80000000, Math.floor(random() * 2 ** 32)];
    const value = extremes[Math.floor(random() * extremes.length)];
    new DataView(bytes.buffer).setUint32(offset, value, true);
  } else {
    for (let i = 0; i < 8; i++) bytes[Math.floor(random() * bytes.length)] = Math.floor(random() * 256);
  }
  return bytes;
}

describe('WAV reader fuzz (seeded)', () => {
  it('throws nothing but EngineError on 6000 mutated files, and decodes only finite samples', () => {
    const random = seededRandom(20240611);
    const files = validFiles();
    let refused = 0;
    let decoded = 0;
    for (let iteration = 0; iteration < 6000; iteration++) {
      const bytes = mutate(files[iteration % files.length], random);
      for (const reader of [readWav, readWavInfo]) {
        try {
          const result: WavInfo | DecodedWav = reader(bytes);
          const channels = (result as Partial<DecodedWav>).channels;
          if (channels) {
            for (const channel of channels) {
              for (const value of channel) if (!Number.isFinite(value)) throw new Error('non-finite sample decoded');
            }
            expect(channels.length).toBe(result.channelCount);
            decoded++;
          }
        } catch (error) {
          if (!isEngineError(error)) throw new Error(`iteration ${iteration}: ${String(error)}`);
          refused++;
        }
      }
    }
    // Both outcomes occur, so the mutations reach past the header checks.
    expect(refused).toBeGreaterThan(1000);
    expect(decoded).toBeGreaterThan(500);
  });
});
