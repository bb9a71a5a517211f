import { EngineError } from './errors';
import { complexFftBitReversedInput, complexFftPlan } from './fft-plan';

/**
 * Real FFT helpers in numpy's conventions, so formulas from the literature carry over unchanged: forward
 * X[k] = Σ x[n]·e^(−j2πkn/N) with no scaling, one-sided (N/2 + 1 bins); inverse scaled by 1/N, imaginary parts
 * of bins 0 and N/2 ignored (numpy.fft.rfft / irfft).
 *
 * Both directions run as one half-size complex FFT (fft-plan.ts) of z[n] = x[2n] + j·x[2n+1] plus an O(N)
 * split step (the standard "two real sequences in one complex FFT" packing; Brigham, The Fast Fourier Transform
 * and its Applications, 1988, §9-3). The forward transform works in its own output arrays, so it allocates only
 * the result. Tables are memoised per size; results never depend on the cache.
 */
export interface Spectrum {
  /** Real parts, bins 0..N/2. */
  re: Float64Array;
  /** Imaginary parts, bins 0..N/2. */
  im: Float64Array;
}

/** True for an integer power of two ≥ 2. */
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
  if (!isPowerOfTwo(fftSize) || fftSize < 4 || fftSize > 2 ** 30) {
    throw new EngineError('fft_size_invalid', `FFT size must be a power of two from 4 to 2^30, got ${fftSize}.`);
  }
}

/** cos/sin of 2πk/N for k = 0..N/4, the split-step twiddles of a real FFT of size N. */
const splitTables = new Map<number, Float64Array>();

function splitTwiddles(fftSize: number): Float64Array {
  let table = splitTables.get(fftSize);
  if (!table) {
    const count = fftSize / 4 + 1;
    table = new Float64Array(2 * count);
    const quarter = fftSize / 4;
    for (let k = 0; k < count; k++) {
      // Above π/4 use the complementary angle, so cos(π/2) is exactly 0 and the table is symmetric.
      const mirrored = 2 * k > quarter;
      const angle = (2 * Math.PI * (mirrored ? quarter - k : k)) / fftSize;
      table[2 * k] = mirrored ? Math.sin(angle) : Math.cos(angle);
      table[2 * k + 1] = mirrored ? Math.cos(angle) : Math.sin(angle);
    }
    splitTables.set(fftSize, table);
  }
  return table;
}

/** One-sided spectrum of `signal` (numpy rfft), zero-padded to `fftSize` (a power of two ≥ signal length). */
export function realFft(signal: ArrayLike<number>, fftSize: number): Spectrum {
  requireFftSize(fftSize);
  if (signal.length > fftSize) {
    throw new EngineError('fft_size_invalid', `Signal of ${signal.length} samples does not fit an FFT of ${fftSize}.`);
  }
  const half = fftSize / 2;
  const plan = complexFftPlan(half);
  const reverse = plan.bitReversal;
  // The half-size complex transform runs in bins 0..half−1 of the output arrays; bin `half` is set at the end.
  const re = new Float64Array(half + 1);
  const im = new Float64Array(half + 1);
  const length = signal.length;
  const pairs = length >> 1;
  for (let n = 0; n < pairs; n++) {
    const target = reverse[n];
    re[target] = signal[2 * n];
    im[target] = signal[2 * n + 1];
  }
  if (length % 2 === 1) re[reverse[pairs]] = signal[length - 1];
  complexFftBitReversedInput(plan, re, im);

  // X[k] = E + W^k·O and X[half−k] = conj(E − W^k·O), with E = (Z[k] + conj Z[half−k])/2,
  // O = (Z[k] − conj Z[half−k])/(2j), W = e^(−j2π/N). Each pair (k, half−k) is read and written only here.
  const table = splitTwiddles(fftSize);
  const z0r = re[0];
  const z0i = im[0];
  re[0] = z0r + z0i;
  im[0] = 0;
  re[half] = z0r - z0i;
  im[half] = 0;
  for (let k = 1; k <= half / 2; k++) {
    const m = half - k;
    const ar = re[k];
    const ai = im[k];
    const br = re[m];
    const bi = im[m];
    const er = (ar + br) / 2;
    const ei = (ai - bi) / 2;
    // O = (A − conj B)/(2j): (dr + j·di)/(2j) = (di − j·dr)/2.
    const or = (ai + bi) / 2;
    const oi = -(ar - br) / 2;
    const c = table[2 * k];
    const s = -table[2 * k + 1];
    const pr = or * c - oi * s;
    const pi = or * s + oi * c;
    re[k] = er + pr;
    im[k] = ei + pi;
    re[m] = er - pr;
    im[m] = -(ei - pi);
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
  const { re: xr, im: xi } = spectrum;
  const plan = complexFftPlan(half);
  const reverse = plan.bitReversal;
  const table = splitTwiddles(fftSize);
  // The real parts are transformed in the first half of the output array and interleaved in place at the end.
  const out = new Float64Array(fftSize);
  const zr = out.subarray(0, half);
  const zi = new Float64Array(half);
  // Z[k] = E + j·O with E = (X[k] + conj X[half−k])/2, O = (X[k] − conj X[half−k])·e^(+j2πk/N)/2, and
  // Z[half−k] = conj E + j·conj O. The inverse runs as conj(FFT(conj Z))/half, so conj Z is stored, at
  // bit-reversed positions.
  {
    const a = xr[0];
    const b = xr[half];
    zr[0] = (a + b) / 2;
    zi[0] = -(a - b) / 2;
  }
  for (let k = 1; k <= half / 2; k++) {
    const m = half - k;
    const ar = xr[k];
    const ai = xi[k];
    const br = xr[m];
    const bi = xi[m];
    const er = (ar + br) / 2;
    const ei = (ai - bi) / 2;
    const dr = (ar - br) / 2;
    const di = (ai + bi) / 2;
    const c = table[2 * k];
    const s = table[2 * k + 1];
    const or = dr * c - di * s;
    const oi = dr * s + di * c;
    const targetK = reverse[k];
    const targetM = reverse[m];
    zr[targetK] = er - oi;
    zi[targetK] = -(ei + or);
    zr[targetM] = er + oi;
    zi[targetM] = -(or - ei);
  }
  complexFftBitReversedInput(plan, zr, zi);
  // Descending n writes out[2n], out[2n+1] ≥ n, so no real part still to be read is overwritten.
  const scale = 1 / half;
  for (let n = half - 1; n >= 0; n--) {
    const real = out[n];
    out[2 * n + 1] = -zi[n] * scale;
    out[2 * n] = real * scale;
  }
  return out;
}
