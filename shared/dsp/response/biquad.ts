/**
 * Biquads from their published definitions, for building reference and demo systems (the invented loudspeaker
 * model of the simulator, the reference filters of the tests). The analyses themselves do not filter with these.
 * Coefficients are kept unnormalised, as the formulas give them: H(z) = (b0 + b1·z⁻¹ + b2·z⁻²) / (a0 + a1·z⁻¹ + a2·z⁻²).
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

/** 2nd-order high-pass (R. Bristow-Johnson, "Cookbook formulae for audio EQ biquad filter coefficients", HPF). */
export function rbjHighPass(f0Hz: number, q: number, sampleRateHz: number): Biquad {
  const w0 = (2 * Math.PI * f0Hz) / sampleRateHz;
  const alpha = Math.sin(w0) / (2 * q);
  const c = Math.cos(w0);
  return { b: [(1 + c) / 2, -(1 + c), (1 + c) / 2], a: [1 + alpha, -2 * c, 1 - alpha] };
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

/** The filters applied one after the other, in order. */
export function cascade(input: Float64Array, filters: Biquad[]): Float64Array {
  return filters.reduce((signal, filter) => filterBiquad(filter, signal), input);
}
