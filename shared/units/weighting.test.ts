import { describe, expect, it } from 'vitest';
import {
  A1000_DB,
  C1000_DB,
  WEIGHTING_POLES_HZ,
  aWeightingDb,
  aWeightingUnnormalisedAtReferenceDb,
  cWeightingDb,
  cWeightingUnnormalisedAtReferenceDb,
} from './weighting';

/** Exact base-10 frequency of one-third-octave band k: 1000·10^(k/10) Hz (IEC 61260-1:2014; IEC 61672-1:2013 tabulates at these). */
const exactHz = (k: number) => 1000 * 10 ** (k / 10);

// IEC 61672-1:2013 Table 3, A and C weightings in dB for nominal 10 Hz … 20 kHz (band k = −20 … 13), to 0.1 dB
// (values from memory; the standard evaluates them at the exact base-10 frequencies).
const TABLE: [k: number, nominalHz: number, aDb: number, cDb: number][] = [
  [-20, 10, -70.4, -14.3], [-19, 12.5, -63.4, -11.2], [-18, 16, -56.7, -8.5], [-17, 20, -50.5, -6.2],
  [-16, 25, -44.7, -4.4], [-15, 31.5, -39.4, -3.0], [-14, 40, -34.6, -2.0], [-13, 50, -30.2, -1.3],
  [-12, 63, -26.2, -0.8], [-11, 80, -22.5, -0.5], [-10, 100, -19.1, -0.3], [-9, 125, -16.1, -0.2],
  [-8, 160, -13.4, -0.1], [-7, 200, -10.9, 0.0], [-6, 250, -8.6, 0.0], [-5, 315, -6.6, 0.0],
  [-4, 400, -4.8, 0.0], [-3, 500, -3.2, 0.0], [-2, 630, -1.9, 0.0], [-1, 800, -0.8, 0.0],
  [0, 1000, 0.0, 0.0], [1, 1250, 0.6, 0.0], [2, 1600, 1.0, -0.1], [3, 2000, 1.2, -0.2],
  [4, 2500, 1.3, -0.3], [5, 3150, 1.2, -0.5], [6, 4000, 1.0, -0.8], [7, 5000, 0.5, -1.3],
  [8, 6300, -0.1, -2.0], [9, 8000, -1.1, -3.0], [10, 10000, -2.5, -4.4], [11, 12500, -4.3, -6.2],
  [12, 16000, -6.6, -8.5], [13, 20000, -9.3, -11.2],
];

// Two-decimal values computed from the analytic form of IEC 61672-1:2013 Annex E (eqs. E.1–E.6) with the exact
// pole frequencies, at the exact base-10 frequencies (computed independently, verified numerically).
const COMPUTED: [k: number, aDb: number, cDb: number][] = [
  [-20, -70.43, -14.33], [-17, -50.45, -6.24], [-15, -39.44, -3.01], [-12, -26.19, -0.82], [-10, -19.14, -0.3],
  [-9, -16.1, -0.17], [-6, -8.63, 0.0], [-3, -3.23, 0.03], [0, 0.0, 0.0], [3, 1.2, -0.17], [6, 0.97, -0.82],
  [9, -1.11, -3.01], [10, -2.49, -4.41], [12, -6.6, -8.53], [13, -9.32, -11.25],
];

describe('A and C weighting, analytic form of IEC 61672-1:2013 Annex E', () => {
  it('derives the pole frequencies from f_r, f_L = 10^1.5, f_H = 10^3.9, f_A = 10^2.45 (eqs. E.2–E.5; values from memory)', () => {
    expect(WEIGHTING_POLES_HZ.f1).toBeCloseTo(20.598997, 5);
    expect(WEIGHTING_POLES_HZ.f2).toBeCloseTo(107.65265, 4);
    expect(WEIGHTING_POLES_HZ.f3).toBeCloseTo(737.86223, 4);
    expect(WEIGHTING_POLES_HZ.f4).toBeCloseTo(12194.217, 2);
  });

  it('has unnormalised 1 kHz responses that round to A1000 = −2.000 dB and C1000 = −0.062 dB (IEC 61672-1:2013 E.6)', () => {
    expect(aWeightingUnnormalisedAtReferenceDb()).toBeCloseTo(A1000_DB, 3);
    expect(cWeightingUnnormalisedAtReferenceDb()).toBeCloseTo(C1000_DB, 3);
  });

  it('is 0 dB at 1 kHz', () => {
    expect(aWeightingDb(1000)).toBe(0);
    expect(cWeightingDb(1000)).toBe(0);
  });

  for (const [k, nominalHz, aDb, cDb] of TABLE) {
    it(`matches IEC 61672-1:2013 Table 3 within 0.1 dB at ${nominalHz} Hz (exact ${exactHz(k).toFixed(3)} Hz)`, () => {
      expect(Math.abs(aWeightingDb(exactHz(k)) - aDb)).toBeLessThanOrEqual(0.1);
      expect(Math.abs(cWeightingDb(exactHz(k)) - cDb)).toBeLessThanOrEqual(0.1);
    });
  }

  it('matches the two-decimal computed values within 0.05 dB', () => {
    for (const [k, aDb, cDb] of COMPUTED) {
      expect(Math.abs(aWeightingDb(exactHz(k)) - aDb)).toBeLessThanOrEqual(0.05);
      expect(Math.abs(cWeightingDb(exactHz(k)) - cDb)).toBeLessThanOrEqual(0.05);
    }
  });

  it('differs at nominal labels from the exact frequencies, which is why tables use the latter', () => {
    // A(12.5 Hz) = −63.58 dB but A(12.589 Hz) = −63.37 dB (computed from eq. E.6).
    expect(aWeightingDb(12.5)).toBeCloseTo(-63.58, 1);
    expect(aWeightingDb(exactHz(-19))).toBeCloseTo(-63.37, 1);
  });

  it('rolls off towards 0 Hz: −Infinity dB at DC', () => {
    expect(aWeightingDb(0)).toBe(Number.NEGATIVE_INFINITY);
    expect(cWeightingDb(0)).toBe(Number.NEGATIVE_INFINITY);
  });
});
