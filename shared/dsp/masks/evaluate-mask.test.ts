import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { curveThrough } from '../curves/test-curves';
import { evaluateMask } from './evaluate-mask';
import type { ToleranceMask } from './mask-types';

function codeOf(run: () => unknown): string {
  try {
    run();
    return 'no error';
  } catch (error) {
    expect(error).toBeInstanceOf(EngineError);
    return (error as EngineError).code;
  }
}

// Constructed: 0 dB with a 2 dB peak at 2 kHz rising/falling 2 dB per octave (linear in log f).
const peaked = curveThrough([[100, 0], [1000, 0], [2000, 2], [4000, 0], [10000, 0]]);
const flatMask: ToleranceMask = {
  levelReference: 'absolute',
  upper: [{ frequencyHz: 100, levelDb: 1 }, { frequencyHz: 10000, levelDb: 1 }],
  lower: [{ frequencyHz: 100, levelDb: -1 }, { frequencyHz: 10000, levelDb: -1 }],
};

describe('mask verdict', () => {
  it('finds the worst margin, its frequency and the failing region (hand-computed)', () => {
    const result = evaluateMask(peaked, flatMask);
    expect(result.verdict).toBe('fail');
    const upper = result.upper!;
    expect(upper.pass).toBe(false);
    expect(upper.worstMarginDb).toBeCloseTo(-1, 12);
    expect(upper.worstMarginFrequencyHz).toBe(2000);
    // The curve passes 1 dB half an octave either side of the peak's start and end.
    expect(upper.failingRegionsHz.length).toBe(1);
    expect(upper.failingRegionsHz[0][0]).toBeCloseTo(1000 * Math.SQRT2, 9);
    expect(upper.failingRegionsHz[0][1]).toBeCloseTo(2000 * Math.SQRT2, 9);
    const lower = result.lower!;
    expect(lower.pass).toBe(true);
    expect(lower.worstMarginDb).toBeCloseTo(1, 12);
    expect(lower.worstMarginFrequencyHz).toBe(100); // ties resolve to the lowest frequency
    expect(lower.failingRegionsHz).toEqual([]);
  });

  it('finds a worst margin at a mask breakpoint between curve points (hand-computed)', () => {
    // Upper limit dips to 0 dB at 1500 Hz and is back at 3 dB by 1600 Hz; the curve at 1500 Hz is
    // 2·log2(1.5) = 1.1699 dB, so the worst margin is −1.1699 dB there (elsewhere the margin is positive).
    const mask: ToleranceMask = {
      levelReference: 'absolute',
      upper: [
        { frequencyHz: 100, levelDb: 3 },
        { frequencyHz: 1500, levelDb: 0 },
        { frequencyHz: 1600, levelDb: 3 },
        { frequencyHz: 10000, levelDb: 3 },
      ],
    };
    const result = evaluateMask(peaked, mask);
    expect(result.upper!.worstMarginDb).toBeCloseTo(-2 * Math.log2(1.5), 12);
    expect(result.upper!.worstMarginFrequencyHz).toBe(1500);
    expect(result.lower).toBeNull();
  });

  it('applies a guard band and a relative reference', () => {
    const guarded = evaluateMask(peaked, flatMask, { guardBandDb: 0.5 });
    expect(guarded.lower!.worstMarginDb).toBeCloseTo(0.5, 12);
    expect(guarded.guardBandDb).toBe(0.5);
    const absolute = curveThrough([[100, 80], [1000, 80], [2000, 82], [4000, 80], [10000, 80]]);
    const relative = evaluateMask(absolute, { ...flatMask, levelReference: 'relative' }, { referenceLevelDb: 80 });
    expect(relative.upper!.worstMarginDb).toBeCloseTo(-1, 12);
    expect(codeOf(() => evaluateMask(absolute, { ...flatMask, levelReference: 'relative' }))).toBe('mask_reference_level_missing');
  });

  it('evaluates only the overlap and says so: "incomplete" when the curve does not cover the mask', () => {
    const wide: ToleranceMask = {
      levelReference: 'absolute',
      upper: [{ frequencyHz: 20, levelDb: 3 }, { frequencyHz: 20000, levelDb: 3 }],
    };
    const result = evaluateMask(peaked, wide);
    expect(result.verdict).toBe('incomplete');
    expect(result.upper!.coversLimitSpan).toBe(false);
    expect(result.upper!.evaluatedFromHz).toBe(100);
    expect(result.upper!.evaluatedToHz).toBe(10000);
    expect(result.upper!.pass).toBe(true);
    expect(evaluateMask(peaked, { ...flatMask, lower: undefined, upper: [{ frequencyHz: 100, levelDb: 3 }, { frequencyHz: 10000, levelDb: 3 }] }).verdict).toBe('pass');
  });

  it('rejects malformed masks, each with its own code', () => {
    const point = (frequencyHz: number, levelDb: number) => ({ frequencyHz, levelDb });
    const cases: [ToleranceMask, string][] = [
      [{ levelReference: 'absolute' }, 'mask_empty'],
      [{ levelReference: 'sideways' as never, upper: [point(100, 0), point(200, 0)] }, 'mask_reference_invalid'],
      [{ levelReference: 'absolute', upper: [point(100, 0)] }, 'mask_limit_too_short'],
      [{ levelReference: 'absolute', upper: [point(200, 0), point(100, 0)] }, 'mask_frequency_not_ascending'],
      [{ levelReference: 'absolute', upper: [point(-1, 0), point(100, 0)] }, 'mask_frequency_invalid'],
      [{ levelReference: 'absolute', upper: [point(100, Number.NaN), point(200, 0)] }, 'mask_level_invalid'],
      [{ levelReference: 'absolute', upper: [point(100, 0), point(1000, 0)], lower: [point(100, -1), point(1000, 1)] }, 'mask_limits_crossed'],
      [{ levelReference: 'absolute', upper: [point(20000, 0), point(30000, 0)] }, 'mask_outside_curve'],
    ];
    for (const [mask, code] of cases) expect(codeOf(() => evaluateMask(peaked, mask))).toBe(code);
    expect(codeOf(() => evaluateMask(peaked, flatMask, { guardBandDb: -1 }))).toBe('guard_band_invalid');
  });
});
