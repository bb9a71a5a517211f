import { EngineError } from './errors';
import { nextPowerOfTwo, realFft } from './fft';

/**
 * Cosine-sum analysis windows, periodic form w[n] = Σ_k (−1)^k·a_k·cos(2πkn/N), n = 0..N−1
 * (Harris, "On the use of windows for harmonic analysis with the DFT", Proc. IEEE 66(1), 1978).
 * Coefficient sources are stated per window; the figures of merit (coherent gain, equivalent noise bandwidth)
 * are computed from the samples, so they are exact for the window actually applied.
 */
export type WindowName = 'rectangular' | 'hann' | 'hamming' | 'blackman' | 'blackman_harris_4' | 'blackman_harris_7' | 'flat_top';

interface WindowDefinition {
  coefficients: readonly number[];
  /** Main-lobe half-width in bins (first null), used to exclude a tone's lobe from noise estimates. */
  mainLobeHalfWidthBins: number;
  description: string;
}

export const WINDOW_DEFINITIONS: Readonly<Record<WindowName, WindowDefinition>> = {
  rectangular: { coefficients: [1], mainLobeHalfWidthBins: 1, description: 'rectangular' },
  hann: { coefficients: [0.5, 0.5], mainLobeHalfWidthBins: 2, description: 'Hann (periodic)' },
  hamming: { coefficients: [0.54, 0.46], mainLobeHalfWidthBins: 2, description: 'Hamming (periodic)' },
  blackman: { coefficients: [0.42, 0.5, 0.08], mainLobeHalfWidthBins: 3, description: 'Blackman (periodic)' },
  // Harris 1978, minimum 4-term Blackman-Harris (−92 dB).
  blackman_harris_4: {
    coefficients: [0.35875, 0.48829, 0.14128, 0.01168],
    mainLobeHalfWidthBins: 4,
    description: '4-term Blackman-Harris, −92 dB (Harris 1978), periodic',
  },
  // Albrecht, "A family of cosine-sum windows for high-resolution measurements", ICASSP 2001 (from memory).
  blackman_harris_7: {
    coefficients: [
      0.27105140069342, 0.43329793923448, 0.21812299954311, 0.06592544638803, 0.01081174209837, 0.00077658482522,
      0.00001388721735,
    ],
    mainLobeHalfWidthBins: 7,
    description: '7-term Blackman-Harris (Albrecht 2001), periodic',
  },
  // D'Antona & Ferrero, Digital Signal Processing for Measurement Systems, Springer 2006, p. 70 (as in scipy's flattop).
  flat_top: {
    coefficients: [0.21557895, 0.41663158, 0.277263158, 0.083578947, 0.006947368],
    mainLobeHalfWidthBins: 5,
    description: '5-term flat-top (D’Antona & Ferrero 2006), periodic',
  },
};

export function windowSamples(name: WindowName, length: number): Float64Array {
  const definition = WINDOW_DEFINITIONS[name];
  if (!definition) throw new EngineError('window_unknown', `Unknown window "${name}".`);
  if (!Number.isInteger(length) || length < 1) {
    throw new EngineError('window_length_invalid', `Window length must be a positive integer, got ${length}.`);
  }
  const w = new Float64Array(length);
  const a = definition.coefficients;
  for (let n = 0; n < length; n++) {
    let sum = 0;
    for (let k = 0; k < a.length; k++) {
      const sign = k % 2 === 0 ? 1 : -1;
      sum += sign * a[k] * Math.cos((2 * Math.PI * k * n) / length);
    }
    w[n] = sum;
  }
  return w;
}

export interface WindowFigures {
  /** Σw / N (Harris 1978). */
  coherentGain: number;
  /** N·Σw² / (Σw)², in bins (Harris 1978). */
  equivalentNoiseBandwidthBins: number;
  /** Σw², needed for PSD scaling: S(f_k) = 2·|X[k]|² / (fs·Σw²). */
  sumOfSquares: number;
}

export function windowFigures(w: ArrayLike<number>): WindowFigures {
  let sum = 0;
  let sumSquares = 0;
  for (let n = 0; n < w.length; n++) {
    sum += w[n];
    sumSquares += w[n] * w[n];
  }
  return {
    coherentGain: sum / w.length,
    equivalentNoiseBandwidthBins: (w.length * sumSquares) / (sum * sum),
    sumOfSquares: sumSquares,
  };
}

export interface WindowSidelobeFigures {
  /** Highest sidelobe relative to the main-lobe peak, dB (negative). */
  highestSidelobeDb: number;
  /** −20·log10|W(½ bin)/W(0)|, dB (Harris 1978). */
  scallopLossDb: number;
  /** Distance from the peak to the first null of |W|, bins (measured). */
  firstNullBins: number;
}

/**
 * Highest sidelobe, scallop loss and first-null distance of a window, measured from its zero-padded spectrum
 * (not copied from a table), so the figures stated in a result are those of the samples actually applied.
 * `padFactor` sets the interpolation of the spectrum (default 64 points per bin).
 */
export function measureWindowSidelobes(
  name: WindowName,
  options: { length?: number; padFactor?: number } = {},
): WindowSidelobeFigures {
  const length = options.length ?? 1024;
  const padFactor = options.padFactor ?? 64;
  if (!Number.isInteger(padFactor) || padFactor < 2 || (padFactor & (padFactor - 1)) !== 0) {
    throw new EngineError('window_pad_factor_invalid', `Pad factor must be a power of two ≥ 2, got ${padFactor}.`);
  }
  const w = windowSamples(name, length);
  const size = nextPowerOfTwo(length * padFactor);
  const spectrum = realFft(w, size);
  const magnitude = new Float64Array(spectrum.re.length);
  for (let k = 0; k < magnitude.length; k++) magnitude[k] = Math.hypot(spectrum.re[k], spectrum.im[k]);
  const peak = magnitude[0];
  const pointsPerBin = size / length;
  // First local minimum well below the peak: a flat-top's passband ripple must not count as a null.
  let firstNull = 1;
  while (
    firstNull + 1 < magnitude.length &&
    (magnitude[firstNull + 1] < magnitude[firstNull] || magnitude[firstNull] > 0.01 * peak)
  ) {
    firstNull++;
  }
  let highest = 0;
  for (let k = firstNull; k < magnitude.length; k++) highest = Math.max(highest, magnitude[k]);
  const halfBin = magnitude[Math.round(pointsPerBin / 2)];
  return {
    // A rectangular window of exactly its own length has no sidelobes at all on the unpadded grid, hence padding.
    highestSidelobeDb: 20 * Math.log10(highest / peak),
    scallopLossDb: -20 * Math.log10(halfBin / peak),
    firstNullBins: firstNull / pointsPerBin,
  };
}
