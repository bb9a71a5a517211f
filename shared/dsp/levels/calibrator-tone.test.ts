import { describe, expect, it } from 'vitest';
import { isEngineError } from '../errors';
import type { EngineError } from '../errors';
import { analyzeCalibratorTone } from './calibrator-tone';

const SAMPLE_RATE_HZ = 48_000;
const STATED = { statedLevelDbSpl: 94.0, statedFrequencyHz: 1000 };

function seededGaussian(seed: number): () => number {
  let state = seed >>> 0;
  const uniform = () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return (state + 0.5) / 2 ** 32;
  };
  return () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
}

/** Peak amplitude of a sine at `levelDbfs` (AES17: a full-scale sine, peak 1, is 0 dBFS). */
const peakForDbfs = (levelDbfs: number) => 10 ** (levelDbfs / 20);

function capture(seconds: number, sample: (t: number, n: number) => number): Float64Array {
  return Float64Array.from({ length: Math.round(seconds * SAMPLE_RATE_HZ) }, (_, n) => sample(n / SAMPLE_RATE_HZ, n));
}

function refusal(samples: Float64Array, stated = STATED): EngineError {
  try {
    analyzeCalibratorTone(samples, SAMPLE_RATE_HZ, stated);
  } catch (error) {
    if (isEngineError(error)) return error;
    throw error;
  }
  throw new Error('expected a refusal');
}

describe('analyzeCalibratorTone: level and chain sensitivity', () => {
  it('reads a −20.00 dBFS tone stated as 94.0 dB SPL as −20.02 dBFS at 1 Pa (1 Pa = 93.98 dB SPL re 20 µPa, ISO 1683)', () => {
    const samples = capture(2, (t) => peakForDbfs(-20) * Math.sin(2 * Math.PI * 1000 * t + 0.4));
    const result = analyzeCalibratorTone(samples, SAMPLE_RATE_HZ, STATED);
    expect(result.toneLevelDbfs).toBeCloseTo(-20.0, 3);
    expect(result.chainSensitivityDbfsAtOnePascal).toBeCloseTo(-20.02, 2);
    expect(result.chainSensitivityDbfsAtOnePascal).toBeCloseTo(-20 - (94 - 20 * Math.log10(1 / 20e-6)), 3);
    expect(result.measuredFrequencyHz).toBeCloseTo(1000, 2);
    expect(result.levelStabilityDb).toBeLessThan(0.01);
    expect(result.signalToNoiseDb).toBeGreaterThan(60);
    expect(result.warnings).toEqual([]);
  });

  it('states the chain factor both ways: p = x_rms·pascalsPerFullScaleRms, k = x_rms/p_cal (94 dB SPL = 1.0024 Pa)', () => {
    const samples = capture(1, (t) => peakForDbfs(-26) * Math.sin(2 * Math.PI * 1000 * t));
    const result = analyzeCalibratorTone(samples, SAMPLE_RATE_HZ, STATED);
    const toneRms = peakForDbfs(-26) / Math.SQRT2;
    expect(result.statedPressurePa).toBeCloseTo(1.0024, 4);
    expect(result.fullScaleRmsPerPascal).toBeCloseTo(toneRms / 1.002374, 5);
    expect(result.pascalsPerFullScaleRms * result.fullScaleRmsPerPascal).toBeCloseTo(1, 12);
  });

  it('is not thrown off by noise, 50 Hz hum, a 2nd harmonic and a 0.4 % frequency offset (within 0.02 dB)', () => {
    const noise = seededGaussian(7);
    const samples = capture(
      3,
      (t) =>
        peakForDbfs(-20) * Math.sin(2 * Math.PI * 1004 * t) +
        peakForDbfs(-60) * Math.SQRT1_2 * noise() +
        peakForDbfs(-50) * Math.sin(2 * Math.PI * 50 * t) +
        peakForDbfs(-55) * Math.sin(2 * Math.PI * 2008 * t),
    );
    const result = analyzeCalibratorTone(samples, SAMPLE_RATE_HZ, STATED);
    expect(Math.abs(result.toneLevelDbfs + 20)).toBeLessThan(0.02);
    expect(result.measuredFrequencyHz).toBeCloseTo(1004, 1);
    expect(result.signalToNoiseDb).toBeGreaterThan(25);
    expect(result.signalToNoiseDb).toBeLessThan(35);
  });

  it('warns (low_snr) but still reads a tone 20 dB above broadband noise within 0.05 dB', () => {
    const noise = seededGaussian(11);
    const samples = capture(4, (t) => peakForDbfs(-30) * Math.sin(2 * Math.PI * 250 * t) + peakForDbfs(-50) * Math.SQRT1_2 * noise());
    const result = analyzeCalibratorTone(samples, SAMPLE_RATE_HZ, { statedLevelDbSpl: 114, statedFrequencyHz: 250 });
    expect(Math.abs(result.toneLevelDbfs + 30)).toBeLessThan(0.05);
    expect(result.signalToNoiseDb).toBeCloseTo(20, 0);
    expect(result.warnings.map((w) => w.code)).toContain('low_snr');
  });

  it('flags clipping of the calibrator capture', () => {
    const samples = capture(1, (t) => Math.max(-1, Math.min(1, 1.05 * Math.sin(2 * Math.PI * 1000 * t))));
    expect(analyzeCalibratorTone(samples, SAMPLE_RATE_HZ, STATED).warnings.map((w) => w.code)).toContain('clipping');
  });
});

describe('analyzeCalibratorTone: refusals', () => {
  it('refuses a two-tone signal (calibrator_multiple_tones)', () => {
    const samples = capture(2, (t) => 0.1 * Math.sin(2 * Math.PI * 1000 * t) + 0.05 * Math.sin(2 * Math.PI * 1500 * t));
    const error = refusal(samples);
    expect(error.code).toBe('calibrator_multiple_tones');
    expect(error.details?.otherFrequencyHz as number).toBeCloseTo(1500, 0);
  });

  it('refuses an exponential sweep (calibrator_tone_not_steady)', () => {
    const durationSeconds = 2;
    const rate = durationSeconds / Math.log(20_000 / 20);
    const samples = capture(durationSeconds, (t) => 0.1 * Math.sin(2 * Math.PI * 20 * rate * (Math.exp(t / rate) - 1)));
    expect(refusal(samples).code).toBe('calibrator_tone_not_steady');
  });

  it('refuses a tone whose level swings by several dB (calibrator_tone_not_steady)', () => {
    const samples = capture(2, (t) => 0.1 * (1 + 0.3 * Math.sin(2 * Math.PI * 2 * t)) * Math.sin(2 * Math.PI * 1000 * t));
    const error = refusal(samples);
    expect(error.code).toBe('calibrator_tone_not_steady');
    expect(error.details?.levelStabilityDb as number).toBeGreaterThan(4);
  });

  it('refuses noise and silence (calibrator_tone_not_found)', () => {
    const noise = seededGaussian(3);
    expect(refusal(capture(1, () => 0.1 * noise())).code).toBe('calibrator_tone_not_found');
    expect(refusal(new Float64Array(SAMPLE_RATE_HZ)).code).toBe('calibrator_tone_not_found');
  });

  it('refuses a tone far from the stated frequency (calibrator_frequency_mismatch)', () => {
    const error = refusal(capture(1, (t) => 0.1 * Math.sin(2 * Math.PI * 250 * t)));
    expect(error.code).toBe('calibrator_frequency_mismatch');
    expect(error.details?.measuredFrequencyHz as number).toBeCloseTo(250, 1);
  });

  it('refuses a capture shorter than three stability blocks and invalid stated values', () => {
    expect(refusal(capture(0.2, (t) => 0.1 * Math.sin(2 * Math.PI * 1000 * t))).code).toBe('calibrator_capture_too_short');
    const tone = capture(1, (t) => 0.1 * Math.sin(2 * Math.PI * 1000 * t));
    expect(refusal(tone, { statedLevelDbSpl: Number.NaN, statedFrequencyHz: 1000 }).code).toBe('calibrator_input_invalid');
    expect(refusal(tone, { statedLevelDbSpl: 94, statedFrequencyHz: 30_000 }).code).toBe('calibrator_input_invalid');
    expect(refusal(Float64Array.from([...tone.subarray(0, 20_000), Number.NaN])).code).toBe('calibrator_input_invalid');
  });
});
