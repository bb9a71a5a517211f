import { nextPowerOfTwo, realFft } from '../fft';
import { WINDOW_DEFINITIONS, windowSamples } from '../windows';
import type { WindowName } from '../windows';

/**
 * Windowed power spectrum scaled so that summing the bins of a tone's main lobe gives the tone's mean square:
 * P[k] = 2·|X[k]|² / (M·Σw²) for an M-point (zero-padded) FFT of the windowed record (Harris, Proc. IEEE 66(1),
 * 1978: V_rms² = 2·Σ_lobe |X[k]|² / (N²·CG²·ENBW) with N²·CG²·ENBW = N·Σw², generalised to zero padding by
 * Parseval). The same scaling turns white noise of variance σ² into σ²·(2/M) per bin, so the power over any
 * band is the plain bin sum.
 */
export interface TonePowerSpectrum {
  /** Mean-square contribution of each bin, (full-scale units)². */
  power: Float64Array;
  /** Bin spacing, Hz. */
  binHz: number;
  /** Main-lobe half-width of the window on this (zero-padded) grid, bins. */
  lobeHalfWidthBins: number;
}

/**
 * Power spectrum of `samples` (mean removed) under `windowName`, zero-padded to the next power of two.
 * `window` may pass precomputed samples of that window for this length (blocks of equal length reuse one).
 */
export function tonePowerSpectrum(
  samples: Float64Array,
  sampleRateHz: number,
  windowName: WindowName = 'flat_top',
  window: Float64Array = windowSamples(windowName, samples.length),
): TonePowerSpectrum {
  const length = samples.length;
  let mean = 0;
  for (let n = 0; n < length; n++) mean += samples[n];
  mean /= length;
  const weighted = new Float64Array(length);
  let sumSquaresWindow = 0;
  for (let n = 0; n < length; n++) {
    weighted[n] = (samples[n] - mean) * window[n];
    sumSquaresWindow += window[n] * window[n];
  }
  const fftSize = nextPowerOfTwo(Math.max(4, length));
  const { re, im } = realFft(weighted, fftSize);
  const power = new Float64Array(re.length);
  const scale = 2 / (fftSize * sumSquaresWindow);
  for (let k = 0; k < power.length; k++) power[k] = (re[k] * re[k] + im[k] * im[k]) * scale;
  return {
    power,
    binHz: sampleRateHz / fftSize,
    lobeHalfWidthBins: Math.ceil((WINDOW_DEFINITIONS[windowName].mainLobeHalfWidthBins * fftSize) / length),
  };
}

/** Index of the largest bin in [fromBin, toBin]. */
export function largestBin(power: Float64Array, fromBin: number, toBin: number): number {
  let best = fromBin;
  for (let k = fromBin + 1; k <= toBin; k++) if (power[k] > power[best]) best = k;
  return best;
}

/** Sum of bins centre ± halfWidth (clipped to the spectrum). */
export function lobePower(power: Float64Array, centreBin: number, halfWidth: number): number {
  let sum = 0;
  const last = Math.min(power.length - 1, centreBin + halfWidth);
  for (let k = Math.max(0, centreBin - halfWidth); k <= last; k++) sum += power[k];
  return sum;
}

/**
 * Mean noise power per bin near `centreBin`, from the median of the bins between `innerBins` and `outerBins`
 * away (a line's own lobe excluded). The median of an exponentially distributed periodogram bin is ln 2 times
 * its mean (χ² with 2 degrees of freedom), hence the division.
 */
export function localNoisePerBin(power: Float64Array, centreBin: number, innerBins: number, outerBins: number): number {
  const values: number[] = [];
  const first = Math.max(1, centreBin - outerBins);
  const last = Math.min(power.length - 1, centreBin + outerBins);
  for (let k = first; k <= last; k++) if (Math.abs(k - centreBin) > innerBins) values.push(power[k]);
  if (values.length === 0) return 0;
  values.sort((a, b) => a - b);
  return values[Math.floor(values.length / 2)] / Math.LN2;
}

/** Power-weighted mean frequency of the lobe centre ± halfWidth, Hz (refines the peak beyond the bin grid). */
export function lobeCentroidHz(power: Float64Array, centreBin: number, halfWidth: number, binHz: number): number {
  let weightedSum = 0;
  let sum = 0;
  const last = Math.min(power.length - 1, centreBin + halfWidth);
  for (let k = Math.max(0, centreBin - halfWidth); k <= last; k++) {
    weightedSum += k * power[k];
    sum += power[k];
  }
  return sum > 0 ? (weightedSum / sum) * binHz : centreBin * binHz;
}
