/**
 * Deterministic uniform numbers in [0, 1): the mulberry32 generator (public domain), so demo signals, reference
 * signals and fuzz runs repeat exactly for a given seed.
 */
export function seededUniform(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Half a step of the generator: keeps the Box–Muller logarithm away from ln 0 (the sum stays exact in float64). */
const HALF_STEP = 0.5 / 4294967296;

/** Deterministic white Gaussian noise of RMS `rms`: seededUniform feeding the Box–Muller transform. */
export function whiteNoise(length: number, rms: number, seed: number): Float64Array {
  const next = seededUniform(seed);
  const uniform = () => next() + HALF_STEP;
  const out = new Float64Array(length);
  for (let n = 0; n < length; n++) {
    out[n] = rms * Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
  }
  return out;
}
