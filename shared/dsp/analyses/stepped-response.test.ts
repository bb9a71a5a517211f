import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { designSteppedSine, renderSteppedSine, type SteppedSineParameters } from '../stimuli/stepped-sine';
import { analyzeSteppedResponse } from './stepped-response';
import type { SteppedResponseOptions } from './stepped-response-options';
import { addSignals, biquadResponse, cascade, delaySamples, firstOrderLowPass, rbjPeaking, whiteNoise } from './test-support/published-filters';

const fs = 48000;
const params: SteppedSineParameters = { startHz: 50, stopHz: 16000, bandsPerOctave: 3, sampleRateHz: fs, levelDbfs: -10 };
const plan = designSteppedSine(params);
const stimulus = renderSteppedSine(plan);

function capture(...channels: Float64Array[]) {
  return { sampleRateHz: fs, channels };
}

describe('stepped-sine response', () => {
  it('reads the level of a known filter at every step within 0.05 dB, with the phase', () => {
    // RBJ Audio EQ Cookbook peaking biquad; H(e^jω) evaluated directly at the analysed frequency f' = k·fs/N.
    const filters = [rbjPeaking(1000, 8, 1.4, fs), firstOrderLowPass(8000, fs)];
    const result = analyzeSteppedResponse(capture(addSignals(cascade(stimulus, filters), whiteNoise(stimulus.length, 1e-5, 9))), params);
    expect(result.kind).toBe('stepped_sine');
    expect(result.curves.frequencyHz.length).toBe(plan.steps.length);
    result.curves.frequencyHz.forEach((f, i) => {
      const expected = biquadResponse(filters, f, fs);
      expect(Math.abs(result.curves.magnitudeDb[i] - expected.magnitudeDb)).toBeLessThan(0.05);
      // AES17: level of the fundamental = gain + stimulus level (−10 dBFS)
      expect(result.curves.levelDbfs[i]).toBeCloseTo(expected.magnitudeDb - 10, 2);
      const phaseError = ((result.curves.phaseDeg[i] - (expected.phaseRad * 180) / Math.PI + 540) % 360) - 180;
      expect(Math.abs(phaseError)).toBeLessThan(0.5);
    });
  });

  it('analyses the exact coherent frequency and labels the steps', () => {
    const result = analyzeSteppedResponse(capture(stimulus), params);
    plan.steps.forEach((step, i) => {
      expect(result.curves.frequencyHz[i]).toBe((step.analysisCycles * fs) / step.analysisSampleCount);
      expect(result.curves.exactHz[i]).toBe(step.exactHz);
      expect(result.curves.magnitudeDb[i]).toBeCloseTo(0, 9);
      expect(result.curves.toneToResidualDb[i]).toBeGreaterThan(120); // float64 rounding of the energy difference
    });
    expect(result.curves.nominalLabel).toContain('1000');
  });

  it('divides out a loopback interface, latency included (latency below the settle time)', () => {
    const interfaceFilters = [rbjPeaking(3000, -6, 2, fs)];
    const played = delaySamples(cascade(stimulus, interfaceFilters), 50);
    const dut = [rbjPeaking(300, 5, 2, fs)];
    const result = analyzeSteppedResponse(capture(cascade(played, dut), played), params, { referenceChannel: 1 });
    result.curves.frequencyHz.forEach((f, i) => {
      const expected = biquadResponse(dut, f, fs);
      expect(Math.abs(result.curves.magnitudeDb[i] - expected.magnitudeDb)).toBeLessThan(0.05);
      const phaseError = ((result.curves.phaseDeg[i] - (expected.phaseRad * 180) / Math.PI + 540) % 360) - 180;
      expect(Math.abs(phaseError)).toBeLessThan(0.5);
    });
  });

  it('warns about a short capture and low tone-to-residual ratio', () => {
    const short = stimulus.subarray(0, plan.steps[5].analysisStartSample);
    const result = analyzeSteppedResponse(capture(short), params);
    expect(result.figures.analysedStepCount).toBe(5);
    expect(result.warnings.map((w) => w.code)).toContain('capture_shorter_than_stimulus');
    const noisy = analyzeSteppedResponse(capture(addSignals(stimulus, whiteNoise(stimulus.length, 0.1, 4))), params);
    expect(noisy.warnings.map((w) => w.code)).toContain('low_snr');
  });

  it('gives the same result bit for bit on a second run', () => {
    const input = cascade(stimulus, [rbjPeaking(2000, 3, 1, fs)]);
    const options: SteppedResponseOptions = { normalisation: { kind: 'at_1khz' } };
    const first = JSON.stringify(analyzeSteppedResponse(capture(input), params, options));
    expect(JSON.stringify(analyzeSteppedResponse(capture(Float64Array.from(input)), params, options))).toBe(first);
  });

  it('throws only EngineError for bad options and inputs', () => {
    const bad: unknown[] = [
      { measurementChannel: 2 },
      { referenceChannel: 0 },
      { captureOffsetSeconds: -0.1 },
      { normalisation: { kind: 'at_frequency' } },
      { calibration: { dbfsAtOnePascal: Number.POSITIVE_INFINITY } },
      { lowSnrThresholdDb: -5 },
      { smoothing: { octaveFraction: 3 } },
    ];
    for (const options of bad) {
      expect(() => analyzeSteppedResponse(capture(stimulus), params, options as SteppedResponseOptions), JSON.stringify(options)).toThrow(EngineError);
    }
    expect(() => analyzeSteppedResponse({ sampleRateHz: 44100, channels: [stimulus] }, params)).toThrow(EngineError);
    expect(() => analyzeSteppedResponse(capture(stimulus.subarray(0, 100)), params)).toThrow(EngineError);
    expect(() => analyzeSteppedResponse(capture(stimulus), { ...params, bandsPerOctave: 7 })).toThrow(EngineError);
  });
});
