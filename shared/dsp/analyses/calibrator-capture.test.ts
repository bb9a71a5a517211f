import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { designSteadyTone, renderSteadyTone } from '../stimuli/steady-tone';
import { designSynchronizedSweep, renderSweep } from '../stimuli/sweep';
import { analyzeCalibratorCapture } from './calibrator-capture';
import { whiteNoise } from './test-support/published-filters';

const fs = 48000;
const tone = renderSteadyTone(
  designSteadyTone({ frequencyHz: 1000, durationSeconds: 3, sampleRateHz: fs, levelDbfs: -20, fadeSeconds: 0, leadingSilenceSeconds: 0, trailingSilenceSeconds: 0 }),
);

describe('calibrator capture', () => {
  it('turns a −20.00 dBFS tone stated as 94.0 dB SPL into −20.02 dBFS at 1 Pa', () => {
    // ISO 1683: 20·log10(1 Pa / 20 µPa) = 93.979 dB SPL, so the chain reads −20 − (94 − 93.979) dBFS at 1 Pa.
    const result = analyzeCalibratorCapture({ sampleRateHz: fs, channels: [whiteNoise(tone.length, 1e-4, 1), tone] }, { channel: 1, statedLevelDbSpl: 94 });
    expect(result.kind).toBe('calibrator');
    expect(result.figures.channel).toBe(1);
    expect(result.figures.toneLevelDbfs).toBeCloseTo(-20, 2);
    expect(result.figures.chainSensitivityDbfsAtOnePascal).toBeCloseTo(-20.0206, 2);
    expect(result.figures.measuredFrequencyHz).toBeCloseTo(1000, 1);
    expect(result.conventions.dbfsConvention).toBe('aes17_sine');
    expect(result.conventions.calibration).toMatch(/94 dB SPL at 1000 Hz/);
  });

  it('refuses a sweep and throws only EngineError for bad options', () => {
    const sweep = renderSweep(designSynchronizedSweep({ startHz: 100, stopHz: 10000, approximateDurationSeconds: 2, sampleRateHz: fs }));
    expect(() => analyzeCalibratorCapture({ sampleRateHz: fs, channels: [sweep] }, { statedLevelDbSpl: 94 })).toThrow(EngineError);
    const bad: unknown[] = [{}, { statedLevelDbSpl: 'loud' }, { statedLevelDbSpl: 94, channel: 3 }, { statedLevelDbSpl: 94, statedFrequencyHz: 0 }, { statedLevelDbSpl: 94, level: 1 }, null];
    for (const options of bad) {
      expect(() => analyzeCalibratorCapture({ sampleRateHz: fs, channels: [tone] }, options as never), JSON.stringify(options)).toThrow(EngineError);
    }
  });
});
