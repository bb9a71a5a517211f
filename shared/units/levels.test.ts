import { describe, expect, it } from 'vitest';
import {
  DBU_REFERENCE_VOLTS,
  REFERENCE_PRESSURE_PA,
  amplitudeRatioFromDb,
  dbFromAmplitudeRatio,
  dbFromPowerRatio,
  dbSplFromPascals,
  dbfsFromPeak,
  dbfsFromRms,
  dbuFromVolts,
  dbvFromVolts,
  inverseSquareCorrectionDb,
  pascalsFromDbSpl,
  powerRatioFromDb,
  rmsFromDbfs,
  voltsFromDbu,
  voltsFromDbv,
  voltsFromWatts,
  wattsFromVolts,
} from './levels';

describe('dB constants (arithmetic)', () => {
  it('20·log10 2 = 6.0206, 10·log10 2 = 3.0103, 20·log10 √2 = 3.0103, 20·log10(1/20e-6) = 93.9794', () => {
    expect(dbFromAmplitudeRatio(2)).toBeCloseTo(6.0206, 4);
    expect(dbFromPowerRatio(2)).toBeCloseTo(3.0103, 4);
    expect(dbFromAmplitudeRatio(Math.SQRT2)).toBeCloseTo(3.0103, 4);
    expect(dbFromAmplitudeRatio(1 / 20e-6)).toBeCloseTo(93.9794, 4);
  });

  it('inverts exactly enough: ratio → dB → ratio', () => {
    for (const ratio of [1e-6, 0.5, 1, 3.7, 1e5]) {
      expect(amplitudeRatioFromDb(dbFromAmplitudeRatio(ratio)) / ratio).toBeCloseTo(1, 13);
      expect(powerRatioFromDb(dbFromPowerRatio(ratio)) / ratio).toBeCloseTo(1, 13);
    }
  });
});

describe('sound pressure level re 20 µPa (ISO 1683)', () => {
  it('uses 20 µPa as the reference', () => {
    expect(REFERENCE_PRESSURE_PA).toBe(20e-6);
    expect(dbSplFromPascals(20e-6)).toBe(0);
  });

  it('1 Pa = 93.979 dB SPL; 94.0 dB SPL = 1.0024 Pa; 114.0 dB SPL = 10.024 Pa (computed from the definition)', () => {
    expect(dbSplFromPascals(1)).toBeCloseTo(93.9794, 4);
    expect(pascalsFromDbSpl(94)).toBeCloseTo(1.0024, 4);
    expect(pascalsFromDbSpl(114)).toBeCloseTo(10.024, 3);
  });
});

describe('voltage levels', () => {
  it('dBV is re 1 V RMS', () => {
    expect(dbvFromVolts(1)).toBe(0);
    expect(dbvFromVolts(0.05)).toBeCloseTo(-26.0206, 4);
    expect(voltsFromDbv(-26.0206)).toBeCloseTo(0.05, 6);
  });

  it('dBu is re √0.6 V = 0.774597 V (1 mW into 600 Ω, common practice, no source); 0 dBu = −2.2185 dBV', () => {
    expect(DBU_REFERENCE_VOLTS).toBeCloseTo(0.774597, 6);
    expect(wattsFromVolts(DBU_REFERENCE_VOLTS, 600)).toBeCloseTo(0.001, 12);
    expect(dbvFromVolts(voltsFromDbu(0))).toBeCloseTo(-2.2185, 4);
    expect(dbuFromVolts(1)).toBeCloseTo(2.2185, 4);
    expect(voltsFromDbu(4)).toBeCloseTo(1.2277, 4);
  });
});

describe('dBFS, AES17 convention (full-scale sine = 0 dBFS)', () => {
  it('reads a full-scale sine (RMS 1/√2) as 0 dBFS and a full-scale square (RMS 1) as +3.01 dBFS', () => {
    expect(dbfsFromRms(Math.SQRT1_2)).toBeCloseTo(0, 14);
    expect(dbfsFromRms(1)).toBeCloseTo(3.0103, 4);
  });

  it('differs from the plain RMS-re-peak convention by exactly 20·log10 √2 = 3.0103 dB', () => {
    const rms = 0.1234;
    expect(dbfsFromRms(rms) - dbFromAmplitudeRatio(rms)).toBeCloseTo(3.0103, 4);
  });

  it('round-trips and reads peaks re full scale', () => {
    expect(rmsFromDbfs(-20)).toBeCloseTo(0.1 / Math.SQRT2, 14);
    expect(dbfsFromRms(rmsFromDbfs(-37.5))).toBeCloseTo(-37.5, 12);
    expect(dbfsFromPeak(-0.5)).toBeCloseTo(-6.0206, 4);
  });
});

describe('power and distance', () => {
  it('2.83 V into 8 Ω = 1.0011 W; 2.00 V into 4 Ω = 1.000 W; √8 = 2.8284 V gives 1 W (P = V²/R)', () => {
    expect(wattsFromVolts(2.83, 8)).toBeCloseTo(1.0011, 4);
    expect(wattsFromVolts(2, 4)).toBe(1);
    expect(voltsFromWatts(1, 8)).toBeCloseTo(2.8284, 4);
  });

  it('inverse-square correction: 2 m → 1 m is +6.02 dB, 0.5 m → 1 m is −6.02 dB', () => {
    expect(inverseSquareCorrectionDb(2, 1)).toBeCloseTo(6.0206, 4);
    expect(inverseSquareCorrectionDb(0.5, 1)).toBeCloseTo(-6.0206, 4);
    expect(inverseSquareCorrectionDb(1, 1)).toBe(0);
  });
});
