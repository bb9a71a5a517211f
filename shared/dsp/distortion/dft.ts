import { isPowerOfTwo, nextPowerOfTwo, realFft, type Spectrum } from '../fft';

/**
 * DFT of a real record of any length N (bins 0..⌊N/2⌋, same sign convention and scaling as realFft: no 1/N).
 * Tone records hold an integer number of cycles or a window's full length, so N is rarely a power of two; the
 * arbitrary length runs as Bluestein's chirp-z convolution (Bluestein, IEEE Trans. Audio Electroacoust. 18(4),
 * 1970) over power-of-two real FFTs.
 */
export function realDft(signal: ArrayLike<number>): Spectrum {
  const length = signal.length;
  if (isPowerOfTwo(length) && length >= 4) return realFft(signal, length);
  const bins = Math.floor(length / 2) + 1;
  const size = nextPowerOfTwo(2 * length - 1);
  // chirp[n] = e^(−jπn²/N); n² taken modulo 2N keeps the angle exact for long records.
  const chirpRe = new Float64Array(length);
  const chirpIm = new Float64Array(length);
  for (let n = 0; n < length; n++) {
    const angle = (Math.PI * ((n * n) % (2 * length))) / length;
    chirpRe[n] = Math.cos(angle);
    chirpIm[n] = -Math.sin(angle);
  }
  const aRe = new Float64Array(size);
  const aIm = new Float64Array(size);
  for (let n = 0; n < length; n++) {
    aRe[n] = signal[n] * chirpRe[n];
    aIm[n] = signal[n] * chirpIm[n];
  }
  const bRe = new Float64Array(size);
  const bIm = new Float64Array(size);
  bRe[0] = chirpRe[0];
  bIm[0] = -chirpIm[0];
  for (let n = 1; n < length; n++) {
    bRe[n] = bRe[size - n] = chirpRe[n];
    bIm[n] = bIm[size - n] = -chirpIm[n];
  }
  const a = complexFft(aRe, aIm);
  const b = complexFft(bRe, bIm);
  for (let k = 0; k < size; k++) {
    const re = a.re[k] * b.re[k] - a.im[k] * b.im[k];
    const im = a.re[k] * b.im[k] + a.im[k] * b.re[k];
    a.re[k] = re;
    a.im[k] = -im; // conjugate, so the forward transform below acts as an inverse
  }
  const c = complexFft(a.re, a.im);
  const re = new Float64Array(bins);
  const im = new Float64Array(bins);
  for (let k = 0; k < bins; k++) {
    const convRe = c.re[k] / size;
    const convIm = -c.im[k] / size;
    re[k] = convRe * chirpRe[k] - convIm * chirpIm[k];
    im[k] = convRe * chirpIm[k] + convIm * chirpRe[k];
  }
  return { re, im };
}

/** Full complex FFT of z = u + jv from two real FFTs: Z = U + jV, with the upper half of U, V by conjugate symmetry. */
function complexFft(u: Float64Array, v: Float64Array): { re: Float64Array; im: Float64Array } {
  const size = u.length;
  const half = size / 2;
  const uSpectrum = realFft(u, size);
  const vSpectrum = realFft(v, size);
  const re = new Float64Array(size);
  const im = new Float64Array(size);
  for (let k = 0; k < size; k++) {
    const mirrored = k > half;
    const index = mirrored ? size - k : k;
    const sign = mirrored ? -1 : 1;
    const uRe = uSpectrum.re[index];
    const uIm = sign * uSpectrum.im[index];
    const vRe = vSpectrum.re[index];
    const vIm = sign * vSpectrum.im[index];
    re[k] = uRe - vIm;
    im[k] = uIm + vRe;
  }
  return { re, im };
}

/**
 * Σ x[n]·w[n]·e^(−j2π·ν·n) at one normalised frequency ν (cycles per sample), for reading a tone between bins.
 * The rotating phasor is re-seeded from cos/sin every 1024 samples so rounding does not accumulate.
 */
export function windowedDtft(signal: ArrayLike<number>, window: ArrayLike<number> | null, cyclesPerSample: number): { re: number; im: number } {
  const step = -2 * Math.PI * cyclesPerSample;
  const stepRe = Math.cos(step);
  const stepIm = Math.sin(step);
  let re = 0;
  let im = 0;
  let phasorRe = 1;
  let phasorIm = 0;
  for (let n = 0; n < signal.length; n++) {
    if ((n & 1023) === 0) {
      phasorRe = Math.cos(step * n);
      phasorIm = Math.sin(step * n);
    }
    const value = window ? signal[n] * window[n] : signal[n];
    re += value * phasorRe;
    im += value * phasorIm;
    const nextRe = phasorRe * stepRe - phasorIm * stepIm;
    phasorIm = phasorRe * stepIm + phasorIm * stepRe;
    phasorRe = nextRe;
  }
  return { re, im };
}
