import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { designSynchronizedSweep, harmonicAdvanceSeconds, renderSweep, sweepFrequencyAtHz, type SweepParameters } from './sweep';

const base: SweepParameters = { startHz: 20, stopHz: 20000, approximateDurationSeconds: 5, sampleRateHz: 48000 };

describe('synchronized exponential sweep', () => {
  it('reproduces the worked example f1 = 20 Hz, f2 = 20 kHz, T ≈ 5 s', () => {
    // Novak, Lotton, Simon, JAES 63(10) 2015: L = round(f1·T/ln(f2/f1))/f1, T = L·ln(f2/f1)
    const design = designSynchronizedSweep(base);
    expect(design.rateConstantSeconds).toBe(0.7);
    expect(design.startCycles).toBe(14);
    expect(design.sweepDurationSeconds).toBeCloseTo(4.835429, 6);
    const samples = renderSweep(design);
    // x(0) = sin(2π·f1·L) = sin(2π·14) = 0 (Novak 2015)
    expect(samples[design.leadingSilenceSampleCount]).toBe(0);
  });

  it('follows x(t) = A·sin(2π·f1·L·exp(t/L)) sample by sample', () => {
    // Novak et al. 2015, definition of the synchronized sweep; compared away from the fades.
    const design = designSynchronizedSweep({ ...base, levelDbfs: -6, fadeInSeconds: 0, fadeOutSeconds: 0 });
    const samples = renderSweep(design);
    const A = 10 ** (-6 / 20);
    for (const n of [1, 1000, 50000, 150000, 230000]) {
      const t = n / 48000;
      const expected = A * Math.sin(2 * Math.PI * 20 * 0.7 * Math.exp(t / 0.7));
      expect(samples[design.leadingSilenceSampleCount + n]).toBeCloseTo(expected, 8);
    }
    expect(sweepFrequencyAtHz(design, design.sweepDurationSeconds)).toBeCloseTo(20000, 6);
  });

  it('advances the n-th harmonic by exactly L·ln(n)', () => {
    // Novak et al. 2015: n·φ(t) = φ(t + L·ln n) when f1·L is an integer; values for L = 0.7 s.
    const design = designSynchronizedSweep(base);
    expect(harmonicAdvanceSeconds(design, 2)).toBeCloseTo(0.485203, 6);
    expect(harmonicAdvanceSeconds(design, 3)).toBeCloseTo(0.769029, 6);
    expect(harmonicAdvanceSeconds(design, 5)).toBeCloseTo(1.1266, 4);
    expect(harmonicAdvanceSeconds(design, 10)).toBeCloseTo(1.6118, 4);
    const phi = (t: number) => 2 * Math.PI * 14 * Math.exp(t / 0.7);
    for (const order of [2, 3, 7]) {
      for (const t of [0.1, 1.3, 2.2]) {
        expect(Math.sin(order * phi(t))).toBeCloseTo(Math.sin(phi(t + harmonicAdvanceSeconds(design, order))), 6);
      }
    }
  });

  it('peaks at the stated level and fades in and out with half-Hann ramps', () => {
    const design = designSynchronizedSweep({ ...base, levelDbfs: -12, fadeInSeconds: 0.05, fadeOutSeconds: 0.01 });
    const samples = renderSweep(design);
    let peak = 0;
    for (const v of samples) peak = Math.max(peak, Math.abs(v));
    const A = 10 ** (-12 / 20);
    expect(peak).toBeLessThanOrEqual(A);
    expect(peak).toBeGreaterThan(A * 0.9999);
    const start = design.leadingSilenceSampleCount;
    const end = start + design.sweepSampleCount - 1;
    expect(samples[start - 1]).toBe(0);
    expect(samples[end] === 0).toBe(true); // half-Hann fall reaches 0 at the last sample (definition of the fade)
    expect(samples[end + 1]).toBe(0);
    expect(samples.length).toBe(design.totalSampleCount);
  });

  it('regenerates bit for bit from its parameters', () => {
    const first = designSynchronizedSweep(base);
    const again = designSynchronizedSweep(first.parameters);
    expect(again).toEqual(first);
    const a = renderSweep(first);
    const b = renderSweep(again);
    expect(Buffer.from(a.buffer).equals(Buffer.from(b.buffer))).toBe(true);
  });

  it('lists plain-language cautions with the design', () => {
    const { cautions } = designSynchronizedSweep(base);
    expect(cautions.some((c) => /headphones worn by a person/.test(c))).toBe(true);
    expect(cautions.some((c) => /tweeter/.test(c))).toBe(true);
    expect(cautions.some((c) => /local regulations/.test(c))).toBe(true);
  });

  it('rejects impossible parameters with EngineError and the field path', () => {
    const bad: [Record<string, unknown>, string, string][] = [
      [{ ...base, startHz: 0 }, 'sweep_start_not_positive', 'sweep.startHz'],
      [{ ...base, startHz: -5 }, 'sweep_start_not_positive', 'sweep.startHz'],
      [{ ...base, startHz: 20000, stopHz: 20 }, 'sweep_band_empty', 'sweep.startHz'],
      [{ ...base, startHz: 1000, stopHz: 1000 }, 'sweep_band_empty', 'sweep.startHz'],
      [{ ...base, stopHz: 30000 }, 'sweep_stop_above_nyquist', 'sweep.stopHz'],
      [{ ...base, approximateDurationSeconds: 0.05 }, 'sweep_duration_out_of_range', 'sweep.approximateDurationSeconds'],
      [{ ...base, approximateDurationSeconds: 601 }, 'sweep_duration_out_of_range', 'sweep.approximateDurationSeconds'],
      [{ ...base, levelDbfs: 1 }, 'level_above_full_scale', 'sweep.levelDbfs'],
      [{ ...base, levelDbfs: -200 }, 'level_too_low', 'sweep.levelDbfs'],
      [{ ...base, fadeInSeconds: 3, fadeOutSeconds: 3 }, 'fades_longer_than_sweep', 'sweep.fadeInSeconds'],
      [{ ...base, fadeOutSeconds: -1 }, 'parameter_out_of_range', 'sweep.fadeOutSeconds'],
      [{ ...base, sampleRateHz: 44100.5 }, 'sample_rate_invalid', 'sweep.sampleRateHz'],
      [{ ...base, sampleRateHz: 100 }, 'sample_rate_invalid', 'sweep.sampleRateHz'],
      [{ ...base, startHz: Number.NaN }, 'parameter_not_a_number', 'sweep.startHz'],
      [{ ...base, stopHz: '20000' }, 'parameter_not_a_number', 'sweep.stopHz'],
      [{ ...base, startHz: 1, approximateDurationSeconds: 0.1 }, 'sweep_too_short_for_start_frequency', 'sweep.approximateDurationSeconds'],
      [{ ...base, trailingSilenceSeconds: 100 }, 'parameter_out_of_range', 'sweep.trailingSilenceSeconds'],
      [{ ...base, levelDb: -6 }, 'parameter_unknown', 'sweep.levelDb'],
    ];
    for (const [params, code, field] of bad) {
      let caught: unknown;
      try {
        designSynchronizedSweep(params as unknown as SweepParameters);
      } catch (error) {
        caught = error;
      }
      expect(caught, JSON.stringify(params)).toBeInstanceOf(EngineError);
      expect((caught as EngineError).code, JSON.stringify(params)).toBe(code);
      expect((caught as EngineError).field).toBe(field);
    }
    expect(() => designSynchronizedSweep(null as unknown as SweepParameters)).toThrow(EngineError);
  });
});
