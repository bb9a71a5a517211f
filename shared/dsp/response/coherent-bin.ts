/**
 * One DFT bin of a record with an integer number of cycles: X[k] = Σ x[start + m]·e^(−j2πkm/N), m = 0..N−1
 * (numpy sign convention, no scaling). The twiddle angle is reduced exactly through (k·m) mod N, so it does not
 * drift over long records. For a coherent tone A·sin(2πkm/N + θ), |X[k]| = A·N/2 and the rest of the bins are
 * empty (no leakage, even with a rectangular window).
 */
export function coherentBin(samples: Float64Array, start: number, length: number, bin: number): { re: number; im: number } {
  let re = 0;
  let im = 0;
  let phaseIndex = 0;
  const step = (2 * Math.PI) / length;
  for (let m = 0; m < length; m++) {
    const angle = step * phaseIndex;
    const value = samples[start + m];
    re += value * Math.cos(angle);
    im -= value * Math.sin(angle);
    phaseIndex += bin;
    if (phaseIndex >= length) phaseIndex -= length;
  }
  return { re, im };
}

/** Σ x² over the record (for the residual after the fundamental). */
export function recordEnergy(samples: Float64Array, start: number, length: number): number {
  let sum = 0;
  for (let m = 0; m < length; m++) sum += samples[start + m] * samples[start + m];
  return sum;
}
