/**
 * Test-only reference systems built from their published definitions, so the engine is checked against
 * something outside itself. Not used by the engine.
 */
export interface Biquad {
  b: [number, number, number];
  a: [number, number, number];
}

/** Peaking EQ (R. Bristow-Johnson, "Cookbook formulae for audio EQ biquad filter coefficients"): exactly gainDb at f0. */
export function rbjPeaking(f0Hz: number, gainDb: number, q: number, sampleRateHz: number): Biquad {
  const A = 10 ** (gainDb / 40);
  const w0 = (2 * Math.PI * f0Hz) / sampleRateHz;
  const alpha = Math.sin(w0) / (2 * q);
  return {
    b: [1 + alpha * A, -2 * Math.cos(w0), 1 - alpha * A],
    a: [1 + alpha / A, -2 * Math.cos(w0), 1 - alpha / A],
  };
}

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

/** 1st-order low-pass H(s) = 1/(1 + s/ωc), bilinear, pre-warped at fc (a biquad with b2 = a2 = 0). */
export function firstOrderLowPass(fcHz: number, sampleRateHz: number): Biquad {
  const k = Math.tan((Math.PI * fcHz) / sampleRateHz);
  const b0 = k / (1 + k);
  return { b: [b0, b0, 0], a: [1, (k - 1) / (k + 1), 0] };
}

/** Direct form I, y[n] = (Σ b_i·x[n−i] − Σ_{i≥1} a_i·y[n−i]) / a0. */
export function filterBiquad(filter: Biquad, input: Float64Array): Float64Array {
  const { b, a } = filter;
  const out = new Float64Array(input.length);
  let x1 = 0;
  let x2 = 0;
  let y1 = 0;
  let y2 = 0;
  for (let n = 0; n < input.length; n++) {
    const x0 = input[n];
    const y0 = (b[0] * x0 + b[1] * x1 + b[2] * x2 - a[1] * y1 - a[2] * y2) / a[0];
    x2 = x1;
    x1 = x0;
    y2 = y1;
    y1 = y0;
    out[n] = y0;
  }
  return out;
}

export function cascade(input: Float64Array, filters: Biquad[]): Float64Array {
  return filters.reduce((signal, filter) => filterBiquad(filter, signal), input);
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

/** Deterministic white Gaussian noise (mulberry32 + Box–Muller), RMS `rms`. */
export function whiteNoise(length: number, rms: number, seed: number): Float64Array {
  let state = seed >>> 0;
  const uniform = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (((t ^ (t >>> 14)) >>> 0) + 0.5) / 4294967296;
  };
  const out = new Float64Array(length);
  for (let n = 0; n < length; n++) {
    out[n] = rms * Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
  }
  return out;
}

export function addSignals(a: Float64Array, b: Float64Array): Float64Array {
  const out = new Float64Array(a.length);
  for (let n = 0; n < a.length; n++) out[n] = a[n] + b[n];
  return out;
}
