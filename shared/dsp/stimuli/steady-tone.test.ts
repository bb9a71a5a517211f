import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { designSteadyTone, renderSteadyTone, type SteadyToneParameters } from './steady-tone';
import { realDftBin } from './test-dft';

describe('calibrator-check tone', () => {
  it('plays the stated frequency at the stated level', () => {
    // 1 kHz at 48 kHz: 48 samples per period, so 4800 samples hold exactly 100 cycles (DFT bin 100).
    const design = designSteadyTone({ frequencyHz: 1000, durationSeconds: 1, sampleRateHz: 48000, levelDbfs: -20 });
    const samples = renderSteadyTone(design);
    const window = samples.subarray(design.leadingSilenceSampleCount + 9600, design.leadingSilenceSampleCount + 14400);
    const bin = realDftBin(window, 100);
    // AES17: a sine of peak 10^(−20/20) is −20 dBFS
    expect(20 * Math.log10((2 * Math.hypot(bin.re, bin.im)) / 4800)).toBeCloseTo(-20, 10);
    expect(design.cautions.length).toBeGreaterThan(3);
  });

  it('rejects bad tones with EngineError', () => {
    const base: SteadyToneParameters = { frequencyHz: 1000, durationSeconds: 1, sampleRateHz: 48000 };
    const bad = [
      { ...base, frequencyHz: 24000 },
      { ...base, frequencyHz: -1 },
      { ...base, durationSeconds: 0.01 },
      { ...base, durationSeconds: 1000 },
      { ...base, levelDbfs: 0.5 },
      { ...base, fadeSeconds: 0.6 },
    ];
    for (const params of bad) expect(() => designSteadyTone(params), JSON.stringify(params)).toThrow(EngineError);
  });
});
