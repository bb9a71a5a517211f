import FFT from 'fft.js';
import { EngineError } from './errors';

/**
 * Real FFT helpers over fft.js (pure JS radix-4), in numpy's conventions so formulas from the literature carry
 * over unchanged: forward X[k] = Σ x[n]·e^(−j2πkn/N) with no scaling, one-sided (N/2 + 1 bins); inverse
 * scaled by 1/N. The inverse real transform runs as one half-size complex FFT (even/odd packing), which is
 * about twice as fast as a full complex inverse.
 *
 * fft.js builds a twiddle table per size; plans are cached per size (pure memoisation: results never depend
 * on the cache).
 */
export interface Spectrum {
  /** Real parts, bins 0..N/2. */
  re: Float64Array;
  /** Imaginary parts, bins 0..N/2. */
  im: Float64Array;
}

const plans = new Map<number, FFT>();

function planFor(size: number): FFT {
  let plan = plans.get(size);
  if (!plan) {
    plan = new FFT(size);
    plans.set(size, plan);
  }
  return plan;
}

export function isPowerOfTwo(n: number): boolean {
  return Number.isInteger(n) && n >= 2 && (n & (n - 1)) === 0;
}

/** Smallest power of two ≥ n (and ≥ 2). */
export function nextPowerOfTwo(n: number): number {
  let size = 2;
  while (size < n) size *= 2;
  return size;
}

function requireFftSize(fftSize: number): void {
  if (!isPowerOfTwo(fftSize) || fftSize < 4) {
    throw new EngineError('fft_size_invalid', `FFT size must be a power of two ≥ 4, got ${fftSize}.`);
  }
}

/** One-sided spectrum of `signal`, zero-padded to `fftSize` (a power of two ≥ signal length). */
export function realFft(signal: ArrayLike<number>, fftSize: number): Spectrum {
  requireFftSize(fftSize);
  if (signal.length > fftSize) {
    throw new EngineError('fft_size_invalid', `Signal of ${signal.length} samples does not fit an FFT of ${fftSize}.`);
  }
  const input = new Float64Array(fftSize);
  input.set(signal as ArrayLike<number>);
  const out = new Float64Array(2 * fftSize);
  planFor(fftSize).realTransform(out, input);
  const bins = fftSize / 2 + 1;
  const re = new Float64Array(bins);
  const im = new Float64Array(bins);
  for (let k = 0; k < bins; k++) {
    re[k] = out[2 * k];
    im[k] = out[2 * k + 1];
  }
  return { re, im };
}

/**
 * Real signal of length `fftSize` whose one-sided spectrum is `spectrum` (numpy irfft: imaginary parts of bins 0
 * and N/2 are ignored, scaling 1/N).
 */
export function inverseRealFft(spectrum: Spectrum, fftSize: number): Float64Array {
  requireFftSize(fftSize);
  const half = fftSize / 2;
  if (spectrum.re.length !== half + 1 || spectrum.im.length !== half + 1) {
    throw new EngineError('fft_size_invalid', `Spectrum of ${spectrum.re.length} bins does not match an FFT of ${fftSize}.`);
  }
  const { re, im } = spectrum;
  // Pack: Z[k] = Xe[k] + j·Xo[k], with Xe[k] = (X[k] + conj X[N/2−k])/2, Xo[k] = (X[k] − conj X[N/2−k])·e^(+j2πk/N)/2.
  const packed = new Float64Array(2 * half);
  for (let k = 0; k < half; k++) {
    const aRe = re[k];
    const aIm = k === 0 ? 0 : im[k];
    const bRe = re[half - k];
    const bIm = k === 0 ? 0 : -im[half - k]; // conj(X[N/2 − k]); bin N/2 (k = 0) is real
    const eRe = (aRe + bRe) / 2;
    const eIm = (aIm + bIm) / 2;
    const dRe = (aRe - bRe) / 2;
    const dIm = (aIm - bIm) / 2;
    const angle = (2 * Math.PI * k) / fftSize;
    const c = Math.cos(angle);
    const s = Math.sin(angle);
    const oRe = dRe * c - dIm * s;
    const oIm = dRe * s + dIm * c;
    packed[2 * k] = eRe - oIm;
    packed[2 * k + 1] = eIm + oRe;
  }
  const z = new Float64Array(2 * half);
  planFor(half).inverseTransform(z, packed);
  const out = new Float64Array(fftSize);
  for (let n = 0; n < half; n++) {
    out[2 * n] = z[2 * n];
    out[2 * n + 1] = z[2 * n + 1];
  }
  return out;
}
