import { EngineError } from '../errors';
import type { MagnitudeCurve } from './curve';

/**
 * Index i of the segment [x_i, x_{i+1}] holding `value` (x ascending, length ≥ 2): the largest i with
 * x_i ≤ value, capped to length − 2 so the last point belongs to the last segment. Values below x_0 give 0.
 */
export function segmentIndex(x: Float64Array, value: number): number {
  let low = 0;
  let high = x.length - 2;
  if (value >= x[high]) return high;
  while (low < high) {
    const mid = (low + high + 1) >> 1;
    if (x[mid] <= value) low = mid;
    else high = mid - 1;
  }
  return low;
}

/** y at `frequencyHz` on the straight line through (ln f_i, y_i), (ln f_{i+1}, y_{i+1}). */
export function interpolateOnLogFrequency(
  frequencyHz: Float64Array,
  values: Float64Array,
  atHz: number,
  segment = segmentIndex(frequencyHz, atHz),
): number {
  const f0 = frequencyHz[segment];
  const f1 = frequencyHz[segment + 1];
  // Exact at the points themselves, so resampling onto a curve's own frequencies returns it bit for bit.
  if (atHz === f0) return values[segment];
  if (atHz === f1) return values[segment + 1];
  const t = Math.log(atHz / f0) / Math.log(f1 / f0);
  return values[segment] + t * (values[segment + 1] - values[segment]);
}

function requireInsideCurve(curve: MagnitudeCurve, atHz: number, field: string): void {
  const first = curve.frequencyHz[0];
  const last = curve.frequencyHz[curve.frequencyHz.length - 1];
  if (!Number.isFinite(atHz) || atHz < first || atHz > last) {
    throw new EngineError(
      'frequency_outside_curve',
      `${atHz} Hz lies outside the curve's span ${first}–${last} Hz.`,
      { field, details: { frequencyHz: atHz, curveFromHz: first, curveToHz: last } },
    );
  }
}

/** The curve's level at `frequencyHz`, interpolated linearly in dB against log frequency (no extrapolation). */
export function levelAtFrequencyDb(curve: MagnitudeCurve, frequencyHz: number, field = 'frequencyHz'): number {
  requireInsideCurve(curve, frequencyHz, field);
  return interpolateOnLogFrequency(curve.frequencyHz, curve.magnitudeDb, frequencyHz);
}

/**
 * The curve read at every grid frequency (dB and phase linear against log f). Every grid point must lie inside
 * the curve's span: resampling never extrapolates.
 */
export function resampleCurve(curve: MagnitudeCurve, gridHz: Float64Array): MagnitudeCurve {
  const magnitudeDb = new Float64Array(gridHz.length);
  const phaseDeg = curve.phaseDeg ? new Float64Array(gridHz.length) : undefined;
  for (let i = 0; i < gridHz.length; i++) {
    requireInsideCurve(curve, gridHz[i], `gridHz[${i}]`);
    const segment = segmentIndex(curve.frequencyHz, gridHz[i]);
    magnitudeDb[i] = interpolateOnLogFrequency(curve.frequencyHz, curve.magnitudeDb, gridHz[i], segment);
    if (phaseDeg && curve.phaseDeg) {
      phaseDeg[i] = interpolateOnLogFrequency(curve.frequencyHz, curve.phaseDeg, gridHz[i], segment);
    }
  }
  return phaseDeg ? { frequencyHz: Float64Array.from(gridHz), magnitudeDb, phaseDeg } : { frequencyHz: Float64Array.from(gridHz), magnitudeDb };
}

/** The grid points that lie inside the curve's span (for callers that want the overlap rather than an error). */
export function gridInsideCurve(curve: MagnitudeCurve, gridHz: Float64Array): Float64Array {
  const first = curve.frequencyHz[0];
  const last = curve.frequencyHz[curve.frequencyHz.length - 1];
  return gridHz.filter((f) => f >= first && f <= last);
}
