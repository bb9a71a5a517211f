/**
 * Phase and group delay helpers (phase in radians internally, degrees in results).
 * Group delay τ_g(f) = −(1/2π)·dφ/df (common definition), taken from differences of the unwrapped phase.
 */

/**
 * Unwrap phases (radians) in place starting from `anchor`, outward in both directions, so that consecutive values
 * differ by at most π. The anchor keeps its principal value; starting inside the band keeps noise outside the band
 * from shifting the in-band phase by multiples of 2π.
 */
export function unwrapFromAnchor(phase: Float64Array, anchor: number): void {
  const twoPi = 2 * Math.PI;
  for (let i = anchor + 1; i < phase.length; i++) {
    phase[i] -= twoPi * Math.round((phase[i] - phase[i - 1]) / twoPi);
  }
  for (let i = anchor - 1; i >= 0; i--) {
    phase[i] -= twoPi * Math.round((phase[i] - phase[i + 1]) / twoPi);
  }
}

/** Linear interpolation of bin values (bin k at k·binSpacingHz) at each grid frequency. */
export function interpolateBins(values: Float64Array, binSpacingHz: number, gridHz: Float64Array): Float64Array {
  const out = new Float64Array(gridHz.length);
  for (let i = 0; i < gridHz.length; i++) {
    const position = gridHz[i] / binSpacingHz;
    const k = Math.min(values.length - 2, Math.floor(position));
    const t = position - k;
    out[i] = values[k] + t * (values[k + 1] - values[k]);
  }
  return out;
}

/**
 * Group delay in seconds at each grid point from the phase (radians) on that grid: central differences inside,
 * one-sided at the ends, plus `bulkDelaySeconds` when the phase has had the bulk delay removed.
 */
export function groupDelayFromPhase(frequencyHz: Float64Array, phaseRad: Float64Array, bulkDelaySeconds: number): Float64Array {
  const n = frequencyHz.length;
  const out = new Float64Array(n);
  if (n < 2) {
    out.fill(bulkDelaySeconds);
    return out;
  }
  for (let i = 0; i < n; i++) {
    const lo = Math.max(0, i - 1);
    const hi = Math.min(n - 1, i + 1);
    const slope = (phaseRad[hi] - phaseRad[lo]) / (frequencyHz[hi] - frequencyHz[lo]);
    out[i] = bulkDelaySeconds - slope / (2 * Math.PI);
  }
  return out;
}

export function radiansToDegrees(values: Float64Array): Float64Array {
  const out = new Float64Array(values.length);
  for (let i = 0; i < values.length; i++) out[i] = (values[i] * 180) / Math.PI;
  return out;
}

/**
 * Phase (radians) of a one-sided linear-bin spectrum read at each grid frequency: principal values per bin up to
 * the last grid point, unwrapped from the bin nearest `anchorHz` outward, then interpolated linearly in f.
 */
export function unwrappedPhaseOnGrid(
  re: Float64Array,
  im: Float64Array,
  binSpacingHz: number,
  gridHz: Float64Array,
  anchorHz: number,
): Float64Array {
  const lastBin = Math.min(re.length - 1, Math.ceil(gridHz[gridHz.length - 1] / binSpacingHz) + 1);
  const phase = new Float64Array(lastBin + 1);
  for (let k = 0; k <= lastBin; k++) phase[k] = Math.atan2(im[k], re[k]);
  const anchor = Math.max(1, Math.min(lastBin, Math.round(anchorHz / binSpacingHz)));
  unwrapFromAnchor(phase, anchor);
  return interpolateBins(phase, binSpacingHz, gridHz);
}

/** Unwrap a phase sampled on a grid (radians), from the point nearest `anchorHz`. */
export function unwrapGridPhase(frequencyHz: Float64Array, phaseRad: Float64Array, anchorHz: number): Float64Array {
  let anchor = 0;
  for (let i = 1; i < frequencyHz.length; i++) {
    if (Math.abs(Math.log(frequencyHz[i] / anchorHz)) < Math.abs(Math.log(frequencyHz[anchor] / anchorHz))) anchor = i;
  }
  const out = Float64Array.from(phaseRad);
  unwrapFromAnchor(out, anchor);
  return out;
}
