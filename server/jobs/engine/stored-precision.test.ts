import { describe, expect, it } from 'vitest';
import { roundToStoredPrecision, STORED_SIGNIFICANT_DIGITS, withStoredPrecision } from './stored-precision';

/** Significant digits of a number as JSON prints it (shortest round-trip form, ECMAScript Number::toString). */
function significantDigits(x: number): number {
  const mantissa = Math.abs(x).toExponential().split('e')[0]!.replace('.', '');
  return mantissa.replace(/0+$/, '').length;
}

// Reference: ECMAScript Number.prototype.toPrecision (ECMA-262 §21.1.3.5), the language's own definition of rounding
// to p significant digits; a float32 mantissa of 24 bits carries log10(2^24) ≈ 7.22 digits (IEEE 754-2019).
describe('stored precision: 7 significant digits', () => {
  it('matches Number.prototype.toPrecision(7) on known values', () => {
    const cases: Array<[number, number]> = [
      [Math.PI, 3.141593],
      [-Math.E * 1e-9, -2.718282e-9],
      [1059.2537251772889, 1059.254],
      [-0.051979166666666666, -0.05197917],
      [343.21464668794145, 343.2146],
      [0.1 + 0.2, 0.3],
      [1234567.89, 1234568],
    ];
    for (const [x, expected] of cases) {
      expect(roundToStoredPrecision(x)).toBe(expected);
      expect(roundToStoredPrecision(x)).toBe(Number(x.toPrecision(STORED_SIGNIFICANT_DIGITS)));
    }
  });

  it('keeps integers, zero, non-finite values and large numbers exactly', () => {
    for (const x of [0, -0, 48_000, 65_536, 2 ** 40, -17, 12_345_678.5, Number.POSITIVE_INFINITY]) expect(Object.is(roundToStoredPrecision(x), x)).toBe(true);
    expect(roundToStoredPrecision(Number.NaN)).toBeNaN();
  });

  it('rounds random doubles of every magnitude to at most 7 digits, within half a unit of the 7th digit', () => {
    // Deterministic pseudo-random values (a fixed linear congruential sequence) over 1e-30 … 1e6.
    let state = 12345;
    const next = () => (state = (state * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    for (let i = 0; i < 20_000; i++) {
      const x = (next() < 0.5 ? -1 : 1) * next() * 10 ** Math.floor(next() * 36 - 30);
      if (x === 0) continue;
      const rounded = roundToStoredPrecision(x);
      expect(significantDigits(rounded)).toBeLessThanOrEqual(STORED_SIGNIFICANT_DIGITS);
      const unit = 10 ** (Math.floor(Math.log10(Math.abs(x))) - (STORED_SIGNIFICANT_DIGITS - 1));
      expect(Math.abs(rounded - x)).toBeLessThanOrEqual(0.5 * unit * (1 + 1e-9));
    }
  });

  it('rounds every number in a nested result and leaves strings, booleans and null alone', () => {
    const result = { kind: 'frequency_response', figures: { delayMs: 2.4504081e-7, samples: 4895, gated: false, lot: null }, curves: { magnitudeDb: [-11.317763012, 0.000123456789] } };
    expect(withStoredPrecision(result)).toEqual({ kind: 'frequency_response', figures: { delayMs: 2.450408e-7, samples: 4895, gated: false, lot: null }, curves: { magnitudeDb: [-11.31776, 0.0001234568] } });
  });
});
