import { buildPiecewiseIntegral, type PiecewiseIntegral } from './piecewise-integral';

/**
 * Integrals over log frequency (d(ln f) = df/f) of curve data, exact for the curve's interpolant: dB is a
 * straight line in ln f (so power is exponential in ln f); re/im and dB values are straight lines in ln f.
 * (FFT bins: see bin-integral.ts.)
 */

/** ∫ P d(ln f) where P = 10^(L/10) and L is linear in ln f between curve points. */
export function curvePowerIntegral(frequencyHz: Float64Array, levelDb: Float64Array): PiecewiseIntegral {
  const power = new Float64Array(levelDb.length);
  for (let i = 0; i < levelDb.length; i++) power[i] = 10 ** (levelDb[i] / 10);
  const logF = frequencyHz.map(Math.log);
  return buildPiecewiseIntegral(frequencyHz, (k, aHz, bHz) => {
    const rate = ((levelDb[k + 1] - levelDb[k]) * (Math.LN10 / 10)) / (logF[k + 1] - logF[k]);
    const logA = Math.log(aHz);
    const width = Math.log(bHz) - logA;
    const powerAtA = power[k] * Math.exp(rate * (logA - logF[k]));
    const exponent = rate * width;
    return powerAtA * width * (exponent === 0 ? 1 : Math.expm1(exponent) / exponent);
  });
}

/** ∫ y d(ln f) where y is linear in ln f between curve points (trapezoid, exact). */
export function curveLinearIntegral(frequencyHz: Float64Array, values: Float64Array): PiecewiseIntegral {
  const logF = frequencyHz.map(Math.log);
  return buildPiecewiseIntegral(frequencyHz, (k, aHz, bHz) => {
    const slope = (values[k + 1] - values[k]) / (logF[k + 1] - logF[k]);
    const logA = Math.log(aHz);
    const logB = Math.log(bHz);
    const valueAtA = values[k] + slope * (logA - logF[k]);
    const valueAtB = values[k] + slope * (logB - logF[k]);
    return 0.5 * (valueAtA + valueAtB) * (logB - logA);
  });
}
