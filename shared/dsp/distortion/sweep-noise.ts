import { nextPowerOfTwo, realFft } from '../fft';
import { windowSamples } from '../windows';

/**
 * Noise floor of a sweep's harmonic spectra, predicted from the capture noise instead of searched for in the
 * impulse-response buffer (which holds harmonic IRs of every order almost everywhere).
 *
 * Deconvolution multiplies the capture spectrum by G(f) = X̃(f)/(fs·A), |G(f)| = 2·√(f/L)/(fs·A) (analytic
 * inverse, Novak et al., JAES 63(10) 2015). Stationary capture noise of per-sample power spectral density s(f)
 * (E|Y[k]|² = N·s for N samples) therefore leaves noise of density s(f)·|G(f)|² in the impulse response wherever
 * the sweep passed frequency f inside the capture, which holds for every harmonic window in the sweep band. A window
 * w laid over it gives E|N_w(f)|² = Σw²·s(f)·|G(f)|² (Parseval; derivation). s(f) is measured on a stimulus-off
 * part of the capture (Welch: periodic Hann segments, 50 % overlap, |Z|²/Σv² averaged), then averaged over 1/3
 * octave so the floor is a level, not a noisy trace.
 */
export interface NoiseDensity {
  /** Per-sample PSD s(f) at bins k·binHz. */
  density: Float64Array;
  binHz: number;
  segmentCount: number;
  description: string;
  /** Running sum of `density`, built on first use. */
  cumulative?: Float64Array;
}

export const FLOOR_SMOOTHING_FRACTION = 3;
const MAX_SEGMENT_SAMPLES = 8192;
const MIN_SEGMENT_SAMPLES = 256;

/** Welch estimate of s(f) from a noise-only record; null when the record is too short. */
export function noiseDensity(record: Float64Array, sampleRateHz: number, description: string): NoiseDensity | null {
  if (record.length < MIN_SEGMENT_SAMPLES) return null;
  let segment = Math.min(MAX_SEGMENT_SAMPLES, nextPowerOfTwo(record.length));
  if (segment > record.length) segment /= 2;
  const window = windowSamples('hann', segment);
  let sumSquares = 0;
  for (let n = 0; n < segment; n++) sumSquares += window[n] * window[n];
  const density = new Float64Array(segment / 2 + 1);
  const piece = new Float64Array(segment);
  let count = 0;
  for (let start = 0; start + segment <= record.length; start += segment / 2) {
    for (let n = 0; n < segment; n++) piece[n] = record[start + n] * window[n];
    const { re, im } = realFft(piece, segment);
    for (let k = 0; k < density.length; k++) density[k] += re[k] * re[k] + im[k] * im[k];
    count++;
  }
  for (let k = 0; k < density.length; k++) density[k] /= count * sumSquares;
  return { density, binHz: sampleRateHz / segment, segmentCount: count, description };
}

/**
 * s(f) averaged over the bins of f·2^(±1/(2·3)) (a rectangular 1/3-octave mean, at least the nearest bin), read
 * through a running sum so every frequency costs the same. Frequencies past the last bin read the top band.
 */
export function densityAt(noise: NoiseDensity, frequenciesHz: Float64Array): Float64Array {
  const { density, binHz } = noise;
  let cumulative = noise.cumulative;
  if (!cumulative) {
    cumulative = new Float64Array(density.length + 1);
    for (let k = 0; k < density.length; k++) cumulative[k + 1] = cumulative[k] + density[k];
    noise.cumulative = cumulative;
  }
  const halfBand = 2 ** (1 / (2 * FLOOR_SMOOTHING_FRACTION));
  const last = density.length - 1;
  return frequenciesHz.map((f) => {
    const centre = Math.min(Math.max(Math.round(f / binHz), 1), last);
    const from = Math.min(Math.max(1, Math.ceil(f / halfBand / binHz)), centre);
    const to = Math.max(Math.min(last, Math.floor((f * halfBand) / binHz)), centre);
    return (cumulative[to + 1] - cumulative[from]) / (to - from + 1);
  });
}

/** Expected |N_w(f)| of a window with Σw² = windowSumSquares in the deconvolved buffer. */
export function windowedNoiseAmplitude(
  density: Float64Array,
  frequenciesHz: Float64Array,
  windowSumSquares: number,
  design: { rateConstantSeconds: number; sampleRateHz: number; amplitude: number },
): Float64Array {
  const scale = 2 / (Math.sqrt(design.rateConstantSeconds) * design.sampleRateHz * design.amplitude);
  return frequenciesHz.map((f, i) => Math.sqrt(windowSumSquares * density[i]) * scale * Math.sqrt(f));
}
