import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { curveThrough } from '../curves/test-curves';
import { deriveMaskFromGolden } from './derive-mask';

describe('mask from golden curves', () => {
  // Hand-computed: at 100 Hz the curves read 0, 1, 2 dB (mean 1, sample σ = 1); at 1 kHz all read 5 dB (σ = 0);
  // at 10 kHz 0, 0, 3 dB (mean 1, σ = √3).
  const golden = [
    curveThrough([[100, 0], [1000, 5], [10000, 0]]),
    curveThrough([[100, 1], [1000, 5], [10000, 0]]),
    curveThrough([[100, 2], [1000, 5], [10000, 3]]),
  ];

  it('gives mean ± max(k·σ, minimum) with the sample standard deviation (n − 1)', () => {
    const derived = deriveMaskFromGolden(golden, { coverageFactor: 2, minHalfWidthDb: 1 });
    expect(Array.from(derived.meanDb)).toEqual([1, 5, 1]);
    expect(derived.standardDeviationDb[0]).toBeCloseTo(1, 15);
    expect(derived.standardDeviationDb[1]).toBe(0);
    expect(derived.standardDeviationDb[2]).toBeCloseTo(Math.sqrt(3), 15);
    expect(derived.mask.upper!.map((p) => p.levelDb)).toEqual([3, 6, 1 + 2 * derived.standardDeviationDb[2]]);
    expect(derived.mask.lower!.map((p) => p.levelDb)).toEqual([-1, 4, 1 - 2 * derived.standardDeviationDb[2]]);
    expect(derived.mask.levelReference).toBe('absolute');
    expect(derived.warnings).toEqual([]);
    expect(derived.description).toContain('n − 1');
  });

  it('warns with two curves and refuses one', () => {
    const two = deriveMaskFromGolden(golden.slice(0, 2), { coverageFactor: 3 });
    expect(two.warnings.map((w) => w.code)).toEqual(['few_golden_curves']);
    // Two curves 0 and 1 dB: σ = 1/√2.
    expect(two.standardDeviationDb[0]).toBeCloseTo(Math.SQRT1_2, 15);
    expect(() => deriveMaskFromGolden(golden.slice(0, 1), { coverageFactor: 3 })).toThrow(EngineError);
  });

  it('resamples curves on different grids onto the common span of the first', () => {
    const shifted = curveThrough([[50, 0], [500, 0], [20000, 0]]);
    const derived = deriveMaskFromGolden([golden[0], shifted, golden[1]], { coverageFactor: 1, minHalfWidthDb: 0 });
    expect(Array.from(derived.frequencyHz)).toEqual([100, 1000, 10000]);
    // At 1 kHz: 5, 0, 5 dB → mean 10/3.
    expect(derived.meanDb[1]).toBeCloseTo(10 / 3, 12);
  });

  it('normalises each curve first for a relative mask', () => {
    const louder = curveThrough([[100, 10], [1000, 15], [10000, 10]]);
    const derived = deriveMaskFromGolden([golden[0], louder, golden[0]], {
      coverageFactor: 3,
      normalisation: { kind: 'at_frequency', frequencyHz: 1000 },
    });
    expect(derived.mask.levelReference).toBe('relative');
    expect(Array.from(derived.meanDb)).toEqual([-5, 0, -5]);
    expect(Array.from(derived.standardDeviationDb)).toEqual([0, 0, 0]);
  });

  it('smoothing the half-width leaves a constant spread unchanged', () => {
    const a = curveThrough([[100, 0], [1000, 0], [10000, 0]]);
    const b = curveThrough([[100, 2], [1000, 2], [10000, 2]]);
    const derived = deriveMaskFromGolden([a, b, a, b], { coverageFactor: 1, minHalfWidthDb: 0, halfWidthSmoothingOctaveFraction: 3 });
    const sigma = Math.sqrt(4 / 3); // four values 0, 2, 0, 2: Σ(x − 1)² = 4, n − 1 = 3
    derived.halfWidthDb.forEach((width) => expect(width).toBeCloseTo(sigma, 12));
  });

  it('rejects bad options with EngineErrors', () => {
    const codeOf = (run: () => unknown) => {
      try {
        run();
        return 'no error';
      } catch (error) {
        return (error as EngineError).code;
      }
    };
    expect(codeOf(() => deriveMaskFromGolden(golden, { coverageFactor: 0 }))).toBe('coverage_factor_invalid');
    expect(codeOf(() => deriveMaskFromGolden(golden, { coverageFactor: 2, minHalfWidthDb: -1 }))).toBe('min_half_width_invalid');
    expect(codeOf(() => deriveMaskFromGolden(golden, { coverageFactor: 2, gridHz: Float64Array.of(50, 100) }))).toBe('frequency_outside_curve');
  });
});
