import type { CircularImpulseResponse } from './deconvolve';

/**
 * Arrival of the linear impulse response: the largest |h| in the searched span, refined to a fraction of a sample
 * by fitting a parabola through |h| at the peak and its two neighbours (common practice, no source):
 * δ = ½·(a − c)/(a − 2b + c), with a, b, c = |h[k−1]|, |h[k]|, |h[k+1]|, |δ| ≤ ½.
 */
export interface ImpulsePeak {
  /** Buffer index of the largest |h|. */
  index: number;
  /** Signed time of that index, in samples (negative when the peak lies in the wrapped negative-time part). */
  sampleOffset: number;
  /** Sub-sample position of the peak, in samples from t = 0 (sampleOffset + δ). */
  delaySamples: number;
  delaySeconds: number;
  /** h at the peak index (its sign gives the polarity). */
  value: number;
}

/** Circular read of the buffer. */
function at(samples: Float64Array, index: number): number {
  const n = samples.length;
  return samples[((index % n) + n) % n];
}

/**
 * Find the peak of the linear IR over t ∈ [−searchBeforeSamples, searchAfterSamples) (samples from t = 0).
 * Ties keep the earliest index, so the result never depends on iteration order.
 */
export function findImpulsePeak(ir: CircularImpulseResponse, searchBeforeSamples: number, searchAfterSamples: number): ImpulsePeak {
  const { samples, fftSize, sampleRateHz } = ir;
  let bestOffset = 0;
  let bestMagnitude = -1;
  for (let offset = -searchBeforeSamples; offset < searchAfterSamples; offset++) {
    const magnitude = Math.abs(at(samples, offset));
    if (magnitude > bestMagnitude) {
      bestMagnitude = magnitude;
      bestOffset = offset;
    }
  }
  const a = Math.abs(at(samples, bestOffset - 1));
  const b = bestMagnitude;
  const c = Math.abs(at(samples, bestOffset + 1));
  const curvature = a - 2 * b + c;
  const fraction = curvature < 0 ? Math.max(-0.5, Math.min(0.5, (0.5 * (a - c)) / curvature)) : 0;
  const delaySamples = bestOffset + fraction;
  return {
    index: ((bestOffset % fftSize) + fftSize) % fftSize,
    sampleOffset: bestOffset,
    delaySamples,
    delaySeconds: delaySamples / sampleRateHz,
    value: at(samples, bestOffset),
  };
}

/** Copy `length` samples of the circular buffer starting at signed offset `start` (samples from t = 0). */
export function circularSlice(samples: Float64Array, start: number, length: number, out = new Float64Array(length)): Float64Array {
  const n = samples.length;
  let index = ((start % n) + n) % n;
  for (let i = 0; i < length; i++) {
    out[i] = samples[index];
    index++;
    if (index === n) index = 0;
  }
  return out;
}
