import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { bandMeanLevelDb, normaliseCurve, referenceLevel } from './reference-level';
import { curveThrough } from './test-curves';

describe('reference level and normalisation', () => {
  it('normalises at 1 kHz on a grid without 1 kHz, interpolating in dB on log f (hand-computed)', () => {
    // 80 dB at 900 Hz, 86 dB at 1100 Hz: L(1000) = 80 + 6·ln(1000/900)/ln(1100/900) = 83.150 25 dB.
    const curve = curveThrough([[500, 70], [900, 80], [1100, 86], [2000, 90]]);
    const expected = 80 + (6 * Math.log(1000 / 900)) / Math.log(1100 / 900);
    expect(expected).toBeCloseTo(83.15025, 5);
    const result = normaliseCurve(curve, { kind: 'at_frequency', frequencyHz: 1000 });
    expect(result.reference!.levelDb).toBeCloseTo(expected, 12);
    expect(Array.from(result.curve.magnitudeDb)).toEqual([70, 80, 86, 90].map((level) => level - result.reference!.levelDb));
    expect(result.description).toContain('1000 Hz');
  });

  it('band mean of a ramp 0 → 10 dB: 5 dB as a mean of dB, 10·log10(9/ln 10) dB as a power mean (closed form)', () => {
    // L rises linearly in log f from 0 dB at 100 Hz to 10 dB at 1 kHz; with t uniform on [0, 1], mean L = 5 dB and
    // mean 10^(L/10) = ∫10^t dt = 9/ln 10.
    const curve = curveThrough([[50, 0], [100, 0], [1000, 10], [2000, 10]]);
    expect(bandMeanLevelDb(curve, 100, 1000, 'db')).toBeCloseTo(5, 12);
    expect(bandMeanLevelDb(curve, 100, 1000, 'power')).toBeCloseTo(10 * Math.log10(9 / Math.LN10), 12);
    const reference = referenceLevel(curve, { kind: 'band_mean', fromHz: 100, toHz: 1000, average: 'power' });
    expect(reference.bandHz).toEqual([100, 1000]);
    expect(reference.description).toContain('power mean');
  });

  it('returns the curve unchanged and no reference for "none"', () => {
    const curve = curveThrough([[100, 1], [1000, 2]]);
    const result = normaliseCurve(curve, { kind: 'none' });
    expect(result.reference).toBeNull();
    expect(result.curve).toBe(curve);
  });

  it('rejects references outside the curve with EngineErrors', () => {
    const curve = curveThrough([[100, 0], [800, 0]]);
    const codeOf = (run: () => unknown) => {
      try {
        run();
        return 'no error';
      } catch (error) {
        return (error as EngineError).code;
      }
    };
    expect(codeOf(() => normaliseCurve(curve, { kind: 'at_frequency', frequencyHz: 1000 }))).toBe('frequency_outside_curve');
    expect(codeOf(() => bandMeanLevelDb(curve, 300, 3000, 'db'))).toBe('band_outside_curve');
    expect(codeOf(() => bandMeanLevelDb(curve, 500, 300, 'db'))).toBe('band_invalid');
  });
});
