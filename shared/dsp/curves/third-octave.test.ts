import { describe, expect, it } from 'vitest';
import { thirdOctaveBandValues, thirdOctaveBandValuesFromSpectrum } from './third-octave';
import { sampledCurve } from './test-curves';

describe('1/3-octave table', () => {
  it('lists the 31 bands 20 Hz – 20 kHz with exact IEC 61260-1 centres/edges and ISO 266 labels', () => {
    const table = thirdOctaveBandValues(sampledCurve(() => 70, 10, 40000, 24));
    expect(table.length).toBe(31);
    expect(table[0].nominalLabel).toBe('20');
    expect(table[17].exactHz).toBe(1000);
    // IEC 61260-1: 1 kHz band edges 891.251 and 1122.018 Hz.
    expect(table[17].lowerEdgeHz).toBeCloseTo(891.251, 3);
    expect(table[17].upperEdgeHz).toBeCloseTo(1122.018, 3);
    for (const row of table) {
      expect(row.bandLevelDb).toBeCloseTo(70, 10);
      expect(row.centreLevelDb).toBeCloseTo(70, 10);
    }
  });

  it('band level of a dB-linear slope = centre level + 10·log10(sinh x / x), x = β·ln(G)/6 (closed form)', () => {
    // L = s·log2(f/1 kHz), P = e^(β·ln f), β = s·ln10/(10·ln2); band edges f_m·G^(±1/6), G = 10^0.3.
    const slope = 6;
    const level = (f: number) => slope * Math.log2(f / 1000);
    const beta = (slope * Math.LN10) / (10 * Math.LN2);
    const x = (beta * 0.3 * Math.LN10) / 6;
    const table = thirdOctaveBandValues(sampledCurve(level, 10, 40000, 12));
    for (const row of table) {
      expect(row.centreLevelDb).toBeCloseTo(level(row.exactHz), 10);
      expect(row.bandLevelDb! - level(row.exactHz)).toBeCloseTo(10 * Math.log10(Math.sinh(x) / x), 10);
    }
  });

  it('gives null where a band is not fully inside the curve', () => {
    const table = thirdOctaveBandValues(sampledCurve(() => 0, 100, 1000, 12));
    const row100 = table.find((row) => row.nominalLabel === '100')!;
    expect(row100.bandLevelDb).toBeNull();
    expect(row100.centreLevelDb).toBeCloseTo(0, 12);
    expect(table.find((row) => row.nominalLabel === '50')!.centreLevelDb).toBeNull();
    expect(table.find((row) => row.nominalLabel === '500')!.bandLevelDb).toBeCloseTo(0, 12);
  });

  it('works from linear FFT bins: a flat |H| = 0.1 gives −20 dB in every band (closed form)', () => {
    const bins = 65537;
    const re = new Float64Array(bins).fill(0.06);
    const im = new Float64Array(bins).fill(0.08);
    const table = thirdOctaveBandValuesFromSpectrum({ re, im, binSpacingHz: 48000 / 131072 });
    for (const row of table) {
      expect(row.bandLevelDb).toBeCloseTo(-20, 10);
      expect(row.centreLevelDb).toBeCloseTo(-20, 10);
    }
  });
});
