import { describe, expect, it } from 'vitest';
import { isEngineError } from '../errors';
import { dbSplPerMilliwattFromPerVolt, dbSplPerVoltFromPerMilliwatt, headphoneSensitivity } from './headphone-sensitivity';
import {
  FAR_FIELD_CAVEAT,
  loudspeakerSensitivity,
  nominalDriveWatts,
  sensitivityPer2p83VoltsFromPerWatt,
  sensitivityPerWattFromPer2p83Volts,
  splAtReferenceDistanceDbSpl,
  voltsForOneWatt,
} from './loudspeaker-sensitivity';
import { microphoneSensitivity } from './microphone-sensitivity';

describe('microphone sensitivity (IEC 60268-4 terms, from memory)', () => {
  it('1.0 V RMS full scale (RMS of a 0 dBFS sine), −26.00 dBFS at 94 dB SPL → 50.0 mV/Pa = −26.02 dBV/Pa', () => {
    const result = microphoneSensitivity({ toneLevelDbfs: -26, statedLevelDbSpl: 94, adcFullScaleVoltsRms: 1 });
    expect(result.millivoltsPerPascal).toBeCloseTo(50.0, 2);
    expect(result.dbvPerPascal).toBeCloseTo(-26.02, 2);
    expect(result.fullScaleConvention).toBe('rms_of_full_scale_sine');
  });

  it('reads the same 1.0 V as a peak full scale as 1/√2 of that: 35.36 mV/Pa (−29.03 dBV/Pa)', () => {
    const result = microphoneSensitivity({ toneLevelDbfs: -26, statedLevelDbSpl: 94, adcFullScaleVoltsPeak: 1 });
    expect(result.millivoltsPerPascal).toBeCloseTo(50.0 / Math.SQRT2, 2);
    expect(result.dbvPerPascal).toBeCloseTo(-26.0206 - 3.0103, 3);
  });

  it('12.5 mV/Pa is −38.06 dBV/Pa (definition 20·log10(M / 1 V/Pa))', () => {
    // 12.5 mV/Pa at 114 dB SPL (10.024 Pa) and 2.0 V RMS full scale: tone = 0.1253 V → −24.05 dBFS.
    const toneLevelDbfs = 20 * Math.log10((0.0125 * 20e-6 * 10 ** (114 / 20)) / 2);
    const result = microphoneSensitivity({ toneLevelDbfs, statedLevelDbSpl: 114, adcFullScaleVoltsRms: 2 });
    expect(result.millivoltsPerPascal).toBeCloseTo(12.5, 6);
    expect(result.dbvPerPascal).toBeCloseTo(-38.06, 2);
  });

  it('needs exactly one full-scale convention', () => {
    for (const input of [
      { toneLevelDbfs: -26, statedLevelDbSpl: 94 },
      { toneLevelDbfs: -26, statedLevelDbSpl: 94, adcFullScaleVoltsRms: 1, adcFullScaleVoltsPeak: 1.4 },
      { toneLevelDbfs: -26, statedLevelDbSpl: 94, adcFullScaleVoltsRms: -1 },
    ]) {
      let error: unknown;
      try {
        microphoneSensitivity(input as never);
      } catch (caught) {
        error = caught;
      }
      expect(isEngineError(error) && error.code).toBe('level_input_invalid');
    }
  });
});

describe('loudspeaker sensitivity (IEC 60268-5 terms, from memory)', () => {
  it('2.83 V into 8 Ω ≈ 1.0 W (1.0011 W); 1 W into 8 Ω needs √8 = 2.828 V, into 4 Ω 2.000 V (P = V²/Z)', () => {
    expect(nominalDriveWatts(2.83, 8)).toBeCloseTo(1.0011, 4);
    expect(voltsForOneWatt(8)).toBeCloseTo(2.8284, 4);
    expect(voltsForOneWatt(4)).toBe(2);
  });

  it('0.5 m → 1 m is −6.02 dB and 2 m → 1 m is +6.02 dB (inverse-square law)', () => {
    expect(splAtReferenceDistanceDbSpl(90, 0.5) - 90).toBeCloseTo(-6.02, 2);
    expect(splAtReferenceDistanceDbSpl(84, 2) - 84).toBeCloseTo(6.02, 2);
  });

  it('per 2.83 V equals per 1 W at 8 Ω within 0.005 dB; a 4 Ω speaker reads 3.01 dB higher per 2.83 V', () => {
    expect(sensitivityPerWattFromPer2p83Volts(87, 8)).toBeCloseTo(87 - 10 * Math.log10((2.83 * 2.83) / 8), 10);
    expect(87 - sensitivityPerWattFromPer2p83Volts(87, 8)).toBeLessThan(0.005);
    expect(sensitivityPer2p83VoltsFromPerWatt(87, 4) - 87).toBeCloseTo(10 * Math.log10((2.83 * 2.83) / 4), 10);
    expect(Math.abs(sensitivityPer2p83VoltsFromPerWatt(87, 4) - 87 - 3.01)).toBeLessThan(0.01);
    expect(sensitivityPerWattFromPer2p83Volts(sensitivityPer2p83VoltsFromPerWatt(88.5, 6), 6)).toBeCloseTo(88.5, 12);
  });

  it('refers a KB-65 woofer reading at 0.5 m and 2.0 V into 4 Ω to 1 m, 2.83 V and 1 W', () => {
    const result = loudspeakerSensitivity({ measuredLevelDbSpl: 92, measuredDistanceM: 0.5, driveVoltsRms: 2, nominalImpedanceOhms: 4 });
    expect(result.levelAtOneMetreDbSpl).toBeCloseTo(92 - 6.0206, 4);
    expect(result.dbSplAtOneWattOneMetre).toBeCloseTo(92 - 6.0206, 4); // 2.0 V into 4 Ω is exactly 1 W
    expect(result.dbSplAt2p83VoltsOneMetre).toBeCloseTo(92 - 6.0206 + 20 * Math.log10(2.83 / 2), 4);
    expect(result.driveWattsIntoNominal).toBe(1);
    expect(result.caveat).toBe(FAR_FIELD_CAVEAT);
    expect(FAR_FIELD_CAVEAT).toMatch(/far field/);
  });

  it('refuses zero or negative distances, voltages and impedances', () => {
    for (const run of [() => splAtReferenceDistanceDbSpl(90, 0), () => nominalDriveWatts(2.83, -8), () => voltsForOneWatt(Number.NaN)]) {
      let error: unknown;
      try {
        run();
      } catch (caught) {
        error = caught;
      }
      expect(isEngineError(error) && error.code).toBe('level_input_invalid');
    }
  });
});

describe('headphone sensitivity (IEC 60268-7 terms, from memory)', () => {
  it('100 dB SPL/mW at 32 Ω = 114.95 dB SPL/V; offsets +17.96 / +11.94 / +5.23 dB at 16 / 64 / 300 Ω (S_V = S_mW + 10·log10(1000/Z))', () => {
    expect(dbSplPerVoltFromPerMilliwatt(100, 32)).toBeCloseTo(114.95, 2);
    expect(dbSplPerVoltFromPerMilliwatt(0, 16)).toBeCloseTo(17.96, 2);
    expect(dbSplPerVoltFromPerMilliwatt(0, 64)).toBeCloseTo(11.94, 2);
    expect(dbSplPerVoltFromPerMilliwatt(0, 300)).toBeCloseTo(5.23, 2);
    expect(dbSplPerMilliwattFromPerVolt(114.95, 32)).toBeCloseTo(100, 2);
  });

  it('derives both ratings from one KB-H40 reading: 0.1 V into 32 Ω (0.3125 mW) giving 94 dB SPL', () => {
    const result = headphoneSensitivity({ measuredLevelDbSpl: 94, driveVoltsRms: 0.1, impedanceOhms: 32 });
    expect(result.dbSplPerVolt).toBeCloseTo(114, 10);
    expect(result.driveMilliwatts).toBeCloseTo(0.3125, 12);
    expect(result.dbSplPerMilliwatt).toBeCloseTo(94 - 10 * Math.log10(0.3125), 10);
  });
});
