import { seededUniform } from '../seeded-noise';

/**
 * Signal builders for the distortion tests (test-only helpers; nothing in the engine imports this file).
 * Each builder follows a closed-form identity named beside it.
 */

/** Chebyshev polynomial T_n(u) by the recurrence T_(k+1) = 2u·T_k − T_(k−1) (standard identity). */
export function chebyshev(order: number, u: number): number {
  if (order === 0) return 1;
  let previous = 1;
  let current = u;
  for (let k = 1; k < order; k++) {
    const next = 2 * u * current - previous;
    previous = current;
    current = next;
  }
  return current;
}

export { seededUniform };

/** White Gaussian noise of RMS `rms` (Box–Muller transform). */
export function whiteNoise(length: number, rms: number, seed: number): Float64Array {
  const uniform = seededUniform(seed);
  const out = new Float64Array(length);
  for (let n = 0; n < length; n += 2) {
    const radius = Math.sqrt(-2 * Math.log(1 - uniform())) * rms;
    const angle = 2 * Math.PI * uniform();
    out[n] = radius * Math.cos(angle);
    if (n + 1 < length) out[n + 1] = radius * Math.sin(angle);
  }
  return out;
}

/** Cosine of amplitude A at f Hz with phase φ, sampled at fs. */
export function cosine(length: number, frequencyHz: number, sampleRateHz: number, amplitude: number, phaseRad = 0): Float64Array {
  return Float64Array.from({ length }, (_, n) => amplitude * Math.cos((2 * Math.PI * frequencyHz * n) / sampleRateHz + phaseRad));
}

/** y = x + a2·x² + a3·x³ applied sample by sample (memoryless polynomial). */
export function polynomial(x: Float64Array, a2: number, a3: number): Float64Array {
  return x.map((v) => v + a2 * v * v + a3 * v * v * v);
}

/**
 * HD2 and HD3 of y = x + a2·x² + a3·x³ driven by A·cos θ: cos² θ = (1 + cos 2θ)/2 and cos³ θ = (3 cos θ + cos 3θ)/4
 * give a fundamental A + 3·a3·A³/4, a 2nd harmonic a2·A²/2 and a 3rd a3·A³/4 (trigonometric power identities).
 */
export function polynomialHarmonics(amplitude: number, a2: number, a3: number): { hd2: number; hd3: number } {
  const fundamental = 1 + (3 * a3 * amplitude * amplitude) / 4;
  return { hd2: (a2 * amplitude) / 2 / fundamental, hd3: (a3 * amplitude * amplitude) / 4 / fundamental };
}

/** Additive Fourier synthesis Σ b_n·sin(nθ) for n = 1..K (coefficients b_n given per order). */
export function fourierSeries(length: number, frequencyHz: number, sampleRateHz: number, coefficient: (order: number) => number, maxOrder: number): Float64Array {
  const out = new Float64Array(length);
  for (let order = 1; order <= maxOrder; order++) {
    const b = coefficient(order);
    if (b === 0) continue;
    const step = (2 * Math.PI * order * frequencyHz) / sampleRateHz;
    for (let n = 0; n < length; n++) out[n] += b * Math.sin(step * n);
  }
  return out;
}
