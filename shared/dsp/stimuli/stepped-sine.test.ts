import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { realDftBin } from './test-dft';
import { designSteppedSine, renderSteppedSine, type SteppedSineParameters } from './stepped-sine';

const base: SteppedSineParameters = { startHz: 20, stopHz: 20000, bandsPerOctave: 3, sampleRateHz: 48000 };

describe('stepped-sine plan', () => {
  it('steps on the exact base-10 1/3-octave frequencies with ISO 266 labels', () => {
    const plan = designSteppedSine(base);
    // IEC 61260-1:2014 base-10 system, odd b: f = 1000·10^(3x/(10·3)) = 1000·10^(x/10); ISO 266 nominal labels
    expect(plan.steps.length).toBe(31);
    plan.steps.forEach((step) => expect(step.exactHz).toBeCloseTo(1000 * 10 ** (step.bandIndex / 10), 9));
    const labels = plan.steps.map((s) => s.nominalLabel);
    expect(labels.slice(0, 4)).toEqual(['20', '25', '31.5', '40']);
    expect(labels).toContain('1000');
    expect(labels[labels.length - 1]).toBe('20000');
  });

  it('puts the 1/6-octave steps half a step off 1 kHz (even b)', () => {
    // IEC 61260-1:2014 eq. 3, even b: f = 1000·G^((2x+1)/(2b)), G = 10^(3/10)
    const plan = designSteppedSine({ ...base, startHz: 900, stopHz: 1200, bandsPerOctave: 6 });
    const G = 10 ** 0.3;
    plan.steps.forEach((step) => expect(step.exactHz).toBeCloseTo(1000 * G ** ((2 * step.bandIndex + 1) / 12), 9));
    expect(plan.steps.some((s) => Math.abs(s.exactHz - 1000) < 1e-6)).toBe(false);
  });

  it('chooses whole-cycle analysis windows and reports the analysed frequency', () => {
    // Coherent sampling: k = round(f·N/fs) cycles in N samples, f' = k·fs/N (IEEE Std 1241 practice, from memory)
    const plan = designSteppedSine(base);
    for (const step of plan.steps) {
      expect(Number.isInteger(step.analysisCycles)).toBe(true);
      expect(step.analysedFrequencyHz).toBe((step.analysisCycles * 48000) / step.analysisSampleCount);
      expect(Math.abs(step.analysedFrequencyHz - step.exactHz) / step.exactHz).toBeLessThanOrEqual(1 / (2 * step.analysisSampleCount) + 1e-12);
      expect(step.analysisCycles).toBeGreaterThanOrEqual(20);
      expect(step.analysisSampleCount).toBeGreaterThanOrEqual(0.1 * 48000 - 48000 / step.exactHz);
      expect(step.analysisStartSample).toBeGreaterThanOrEqual(step.startSample + step.rampSampleCount + 0.05 * 48000);
    }
  });

  it('renders steps whose analysis window holds exactly k cycles: no leakage into other bins', () => {
    // Definition of the DFT: a sine with k whole cycles in N samples occupies bin k only.
    const plan = designSteppedSine({ ...base, startHz: 100, stopHz: 5000, levelDbfs: -10 });
    const samples = renderSteppedSine(plan);
    const A = 10 ** (-10 / 20);
    for (const step of [plan.steps[0], plan.steps[7], plan.steps[plan.steps.length - 1]]) {
      const n = step.analysisSampleCount;
      const window = samples.subarray(step.analysisStartSample, step.analysisStartSample + n);
      const tone = realDftBin(window, step.analysisCycles);
      expect((2 * Math.hypot(tone.re, tone.im)) / n).toBeCloseTo(A, 12);
      for (const other of [step.analysisCycles - 1, step.analysisCycles + 1, 2 * step.analysisCycles]) {
        const leak = realDftBin(window, other);
        expect((2 * Math.hypot(leak.re, leak.im)) / n).toBeLessThan(1e-12);
      }
    }
  });

  it('regenerates bit for bit', () => {
    const a = renderSteppedSine(designSteppedSine(base));
    const b = renderSteppedSine(designSteppedSine(designSteppedSine(base).parameters));
    expect(Buffer.from(a.buffer).equals(Buffer.from(b.buffer))).toBe(true);
  });

  it('rejects impossible plans with EngineError and the field path', () => {
    const bad: [Record<string, unknown>, string, string][] = [
      [{ ...base, bandsPerOctave: 5 }, 'bands_per_octave_invalid', 'steppedSine.bandsPerOctave'],
      [{ ...base, bandsPerOctave: 48 }, 'bands_per_octave_invalid', 'steppedSine.bandsPerOctave'],
      [{ ...base, startHz: 0 }, 'step_frequency_out_of_range', 'steppedSine.startHz'],
      [{ ...base, stopHz: 30000 }, 'step_frequency_out_of_range', 'steppedSine.stopHz'],
      [{ ...base, startHz: 5000, stopHz: 100 }, 'step_band_empty', 'steppedSine.startHz'],
      [{ ...base, levelDbfs: 3 }, 'level_above_full_scale', 'steppedSine.levelDbfs'],
      [{ ...base, analysisCycles: 2.5 }, 'parameter_out_of_range', 'steppedSine.analysisCycles'],
      [{ ...base, settleSeconds: -1 }, 'parameter_out_of_range', 'steppedSine.settleSeconds'],
      [{ ...base, bandsPerOctave: 24, analysisSeconds: 60, settleSeconds: 60 }, 'step_plan_too_long', 'steppedSine'],
      [{ ...base, sampleRate: 48000 }, 'parameter_unknown', 'steppedSine.sampleRate'],
    ];
    for (const [params, code, field] of bad) {
      let caught: unknown;
      try {
        designSteppedSine(params as unknown as SteppedSineParameters);
      } catch (error) {
        caught = error;
      }
      expect(caught, JSON.stringify(params)).toBeInstanceOf(EngineError);
      expect((caught as EngineError).code, JSON.stringify(params)).toBe(code);
      expect((caught as EngineError).field).toBe(field);
    }
  });
});
