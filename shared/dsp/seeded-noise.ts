/**
 * Deterministic white Gaussian noise of RMS `rms`: the mulberry32 generator feeding the Box–Muller transform,
 * so demo and reference signals repeat exactly for a given seed.
 */
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
