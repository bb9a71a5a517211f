import { describe, expect, it } from 'vitest';
import { binLogIntegral } from './bin-integral';
import { curveLinearIntegral, curvePowerIntegral } from './integrands';

describe('octave-block prefix integrals', () => {
  it('integrates y = ln f over ln f exactly across many octave blocks (closed form: (ln²b − ln²a)/2)', () => {
    const frequencyHz = new Float64Array(500);
    for (let i = 0; i < frequencyHz.length; i++) frequencyHz[i] = 10 * 1.02 ** i;
    const integral = curveLinearIntegral(frequencyHz, frequencyHz.map(Math.log));
    for (const [a, b] of [[10.5, 11], [12, 150], [33.3, 150000], [10, frequencyHz[499]]]) {
      expect(integral.integrate(a, b)).toBeCloseTo((Math.log(b) ** 2 - Math.log(a) ** 2) / 2, 9);
    }
    expect(integral.integrate(200, 100)).toBe(0);
  });

  it('integrates P = f² (dB linear in ln f) exactly: (b² − a²)/2 (closed form)', () => {
    const frequencyHz = Float64Array.of(20, 50, 64, 200, 1000, 5000, 20000);
    const integral = curvePowerIntegral(frequencyHz, frequencyHz.map((f) => 20 * Math.log10(f)));
    expect(integral.integrate(30, 15000) / ((15000 ** 2 - 30 ** 2) / 2)).toBeCloseTo(1, 12);
  });

  it('integrates linear-in-f bins over ln f exactly: ∫ (c + s·f)/f df = c·ln(b/a) + s·(b − a) (closed form)', () => {
    const binHz = 2.5;
    const values = new Float64Array(100000);
    for (let k = 0; k < values.length; k++) values[k] = 3 + 0.01 * k * binHz;
    const integral = binLogIntegral(values, binHz);
    for (const [a, b] of [[0.3, 1.1], [1, 2.5], [7.77, 8000], [100, 249990]]) {
      expect(integral.integrate(a, b) / (3 * Math.log(b / a) + 0.01 * (b - a))).toBeCloseTo(1, 12);
    }
  });
});
