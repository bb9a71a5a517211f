import { describe, expect, it } from 'vitest';
import { isEngineError } from './errors';
import { captureStats, channelStats, signalStatsWarnings } from './signal-stats';

function sine(amplitude: number, cycles: number, length: number, offset = 0): Float64Array {
  return Float64Array.from({ length }, (_, n) => offset + amplitude * Math.sin((2 * Math.PI * cycles * n) / length));
}

describe('channelStats levels', () => {
  it('reads a full-scale sine as 0 dBFS RMS (AES17) with peak 1 and no DC (integer cycles: closed form)', () => {
    const stats = channelStats(sine(1, 10, 4800).map((x) => x * 0.998)); // stay under the clip threshold
    expect(stats.rmsLinear).toBeCloseTo(0.998 / Math.SQRT2, 12);
    expect(stats.rmsDbfs!).toBeCloseTo(20 * Math.log10(0.998), 10);
    expect(stats.peakLinear).toBeCloseTo(0.998, 6);
    expect(stats.dcOffset).toBeCloseTo(0, 14);
    expect(stats.clippedSampleCount).toBe(0);
    expect(stats.flatTopRunCount).toBe(0);
  });

  it('reads a −20 dBFS sine as −20 dBFS and its peak as −20 dB re full scale', () => {
    const stats = channelStats(sine(0.1, 7, 4800));
    expect(stats.rmsDbfs!).toBeCloseTo(-20, 10);
    expect(stats.peakDbfs!).toBeCloseTo(-20, 5);
  });

  it('reads a full-scale square wave as +3.01 dBFS (AES17: RMS 1 re a sine’s 1/√2)', () => {
    const square = Float64Array.from({ length: 1000 }, (_, n) => (n % 100 < 50 ? 0.9 : -0.9));
    expect(channelStats(square).rmsDbfs!).toBeCloseTo(20 * Math.log10(0.9 * Math.SQRT2), 10);
  });

  it('measures the DC offset as the mean', () => {
    expect(channelStats(sine(0.2, 5, 1000, 0.01)).dcOffset).toBeCloseTo(0.01, 12);
  });

  it('gives null levels and zeros for digital silence and for an empty channel', () => {
    for (const silent of [new Float64Array(64), new Float64Array(0)]) {
      const stats = channelStats(silent);
      expect(stats).toMatchObject({ peakLinear: 0, peakDbfs: null, rmsLinear: 0, rmsDbfs: null, dcOffset: 0, flatTopRunCount: 0 });
    }
  });
});

describe('channelStats clipping', () => {
  it('counts samples at or above the clip threshold', () => {
    const clipped = sine(1.5, 4, 4000).map((x) => Math.max(-1, Math.min(1, x)));
    const stats = channelStats(clipped);
    // |1.5·sin θ| ≥ 0.999 on the fraction (π − 2·asin(0.999/1.5))/π of each half-cycle.
    const fraction = (Math.PI - 2 * Math.asin(0.999 / 1.5)) / Math.PI;
    expect(stats.clippedSampleCount / 4000).toBeCloseTo(fraction, 2);
    expect(stats.flatTopRunCount).toBe(8); // 4 positive and 4 negative flat tops
  });

  it('finds flat-topped runs below digital full scale (analogue clipping before the converter)', () => {
    const limited = sine(0.9, 3, 3000).map((x) => Math.max(-0.6, Math.min(0.6, x)));
    const stats = channelStats(limited);
    expect(stats.clippedSampleCount).toBe(0);
    expect(stats.flatTopRunCount).toBe(6);
    expect(stats.longestFlatTopRun).toBeGreaterThan(50);
  });

  it('does not call coarse quantisation of a quiet signal clipping', () => {
    const quiet = sine(3 / 32768, 2, 2000).map((x) => Math.round(x * 32768) / 32768);
    expect(channelStats(quiet).flatTopRunCount).toBe(0);
  });

  it('raises clipping and dc_offset warnings per channel', () => {
    const stats = captureStats([sine(0.5, 3, 900), sine(1.2, 3, 900).map((x) => Math.max(-1, Math.min(1, x)) + 0), sine(0.1, 3, 900, 0.01)]);
    const warnings = signalStatsWarnings(stats);
    expect(warnings.map((w) => [w.code, w.details?.channel])).toEqual([
      ['clipping', 1],
      ['dc_offset', 2],
    ]);
  });

  it('refuses non-finite samples and bad options with EngineError', () => {
    const attempts = [
      () => channelStats(Float64Array.from([0, Number.NaN])),
      () => channelStats(new Float64Array(4), { minFlatTopRun: 1 }),
      () => channelStats([0, 1] as unknown as Float64Array),
    ];
    for (const attempt of attempts) {
      let error: unknown;
      try {
        attempt();
      } catch (caught) {
        error = caught;
      }
      expect(isEngineError(error)).toBe(true);
    }
  });
});
