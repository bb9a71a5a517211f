/**
 * Test-only reference systems built from their published definitions, so the engine is checked against
 * something outside itself. Not used by the engine. The biquads and the seeded noise that the demo simulator
 * shares live in response/biquad.ts and seeded-noise.ts.
 */
import type { Biquad } from '../../response/biquad';

export { cascade, filterBiquad, firstOrderLowPass, rbjPeaking, type Biquad } from '../../response/biquad';
export { whiteNoise } from '../../seeded-noise';

/** 2nd-order Butterworth low-pass H(s) = 1/(s² + √2·s + 1) by the bilinear transform pre-warped at fc (|H(fc)| = 1/√2). */
export function butterworthLowPass2(fcHz: number, sampleRateHz: number): Biquad {
  const k = Math.tan((Math.PI * fcHz) / sampleRateHz);
  const norm = 1 + Math.SQRT2 * k + k * k;
  const b0 = (k * k) / norm;
  return { b: [b0, 2 * b0, b0], a: [1, (2 * (k * k - 1)) / norm, (1 - Math.SQRT2 * k + k * k) / norm] };
}

/** 2nd-order Butterworth high-pass H(s) = s²/(s² + √2·s + 1), bilinear, pre-warped at fc. */
export function butterworthHighPass2(fcHz: number, sampleRateHz: number): Biquad {
  const k = Math.tan((Math.PI * fcHz) / sampleRateHz);
  const norm = 1 + Math.SQRT2 * k + k * k;
  const b0 = 1 / norm;
  return { b: [b0, -2 * b0, b0], a: [1, (2 * (k * k - 1)) / norm, (1 - Math.SQRT2 * k + k * k) / norm] };
}

function polynomialAt(c: readonly number[], omega: number): { re: number; im: number; dre: number; dim: number } {
  let re = 0;
  let im = 0;
  let dre = 0;
  let dim = 0;
  c.forEach((value, n) => {
    re += value * Math.cos(omega * n);
    im -= value * Math.sin(omega * n);
    dre += n * value * Math.cos(omega * n);
    dim -= n * value * Math.sin(omega * n);
  });
  return { re, im, dre, dim };
}

/** H(e^jω) evaluated directly from the coefficients: magnitude in dB and phase in radians. */
export function biquadResponse(filters: Biquad[], frequencyHz: number, sampleRateHz: number): { magnitudeDb: number; phaseRad: number } {
  const omega = (2 * Math.PI * frequencyHz) / sampleRateHz;
  let magnitudeDb = 0;
  let phaseRad = 0;
  for (const { b, a } of filters) {
    const B = polynomialAt(b, omega);
    const A = polynomialAt(a, omega);
    magnitudeDb += 10 * Math.log10((B.re ** 2 + B.im ** 2) / (A.re ** 2 + A.im ** 2));
    phaseRad += Math.atan2(B.im, B.re) - Math.atan2(A.im, A.re);
  }
  return { magnitudeDb, phaseRad };
}

/**
 * Exact group delay in seconds of a rational H(z): Re{Σ n·b_n e^(−jωn) / Σ b_n e^(−jωn)} minus the same for a,
 * in samples, divided by fs (the usual closed form, as in scipy.signal.group_delay).
 */
export function biquadGroupDelaySeconds(filters: Biquad[], frequencyHz: number, sampleRateHz: number): number {
  const omega = (2 * Math.PI * frequencyHz) / sampleRateHz;
  let samples = 0;
  for (const { b, a } of filters) {
    for (const [c, sign] of [
      [b, 1],
      [a, -1],
    ] as const) {
      const P = polynomialAt(c, omega);
      const denominator = P.re * P.re + P.im * P.im;
      samples += (sign * (P.dre * P.re + P.dim * P.im)) / denominator;
    }
  }
  return samples / sampleRateHz;
}

export function delaySamples(input: Float64Array, delay: number): Float64Array {
  const out = new Float64Array(input.length);
  for (let n = delay; n < input.length; n++) out[n] = input[n - delay];
  return out;
}

export function addSignals(a: Float64Array, b: Float64Array): Float64Array {
  const out = new Float64Array(a.length);
  for (let n = 0; n < a.length; n++) out[n] = a[n] + b[n];
  return out;
}
