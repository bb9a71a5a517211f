import { describe, expect, it } from 'vitest';
import { dbFromRatio, thdFFromThdR, thdFromHarmonics, thdRFromThdF } from './thd';

describe('THD definitions and conversions', () => {
  it('converts THD_F to THD_R and back (from the definitions THD_F = V_H/V_1, THD_R = V_H/√(V_1² + V_H²))', () => {
    // Rows: THD_F 1 %, 10 %, 100 % → THD_R 0.99995 %, 9.9504 %, 70.711 % (computed from the definitions).
    const rows = [
      { thdF: 0.01, thdR: 0.0099995, thdRDb: -40.0004 },
      { thdF: 0.1, thdR: 0.099504, thdRDb: -20.0432 },
      { thdF: 1, thdR: Math.SQRT1_2, thdRDb: -3.0103 },
    ];
    for (const row of rows) {
      expect(thdRFromThdF(row.thdF)).toBeCloseTo(row.thdR, 6);
      expect(dbFromRatio(thdRFromThdF(row.thdF))).toBeCloseTo(row.thdRDb, 3);
      expect(thdFFromThdR(thdRFromThdF(row.thdF))).toBeCloseTo(row.thdF, 12);
    }
  });

  it('sums harmonics as RMS and marks a THD containing a bound as a bound', () => {
    // V_1 = 1, V_2 = 0.03, V_3 = 0.04 → V_H = 0.05 (3-4-5 triangle): THD_F = 5 %, THD_R = 0.05/√1.0025.
    const measured = thdFromHarmonics(1, [
      { rms: 0.03, isUpperBound: false },
      { rms: 0.04, isUpperBound: false },
    ]);
    expect(measured.thdF.valuePercent).toBeCloseTo(5, 12);
    expect(measured.thdR.valuePercent).toBeCloseTo(100 * (0.05 / Math.sqrt(1.0025)), 12);
    expect(measured.thdF.isUpperBound).toBe(false);
    const bounded = thdFromHarmonics(1, [
      { rms: 0.03, isUpperBound: false },
      { rms: 0.04, isUpperBound: true },
    ]);
    expect(bounded.thdF.isUpperBound).toBe(true);
    expect(bounded.thdR.isUpperBound).toBe(true);
  });
});
