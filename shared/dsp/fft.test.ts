import { describe, expect, it } from 'vitest';
import FFT from 'fft.js';
import { inverseRealFft, isPowerOfTwo, nextPowerOfTwo, realFft } from './fft';
import { isEngineError } from './errors';

function seededSignal(length: number, seed: number): Float64Array {
  const signal = new Float64Array(length);
  let state = seed >>> 0;
  for (let n = 0; n < length; n++) {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    signal[n] = state / 2 ** 32 - 0.5 + 0.3 * Math.sin(0.05 * n);
  }
  return signal;
}

/** Direct evaluation of X[k] = Σ x[n]·e^(−j2πkn/N) (the DFT definition; numpy.fft.rfft uses the same sign and no scaling). */
function naiveDft(signal: Float64Array, size: number): { re: Float64Array; im: Float64Array } {
  const bins = size / 2 + 1;
  const re = new Float64Array(bins);
  const im = new Float64Array(bins);
  for (let k = 0; k < bins; k++) {
    let sumRe = 0;
    let sumIm = 0;
    for (let n = 0; n < signal.length; n++) {
      const angle = (-2 * Math.PI * ((k * n) % size)) / size;
      sumRe += signal[n] * Math.cos(angle);
      sumIm += signal[n] * Math.sin(angle);
    }
    re[k] = sumRe;
    im[k] = sumIm;
  }
  return { re, im };
}

function maxAbsDifference(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let worst = 0;
  for (let i = 0; i < a.length; i++) worst = Math.max(worst, Math.abs(a[i] - b[i]));
  return worst;
}

describe('realFft against the DFT definition', () => {
  for (const size of [4, 8, 16, 32, 64, 128, 256, 512]) {
    it(`matches a naive DFT at N = ${size} (odd and even signal lengths, zero padding)`, () => {
      for (const length of [size, size - 1, Math.max(1, size / 2 + 1)]) {
        const signal = seededSignal(length, size + length);
        const fast = realFft(signal, size);
        const slow = naiveDft(signal, size);
        expect(fast.re.length).toBe(size / 2 + 1);
        expect(maxAbsDifference(fast.re, slow.re)).toBeLessThan(1e-11 * size);
        expect(maxAbsDifference(fast.im, slow.im)).toBeLessThan(1e-11 * size);
        // Bins 0 and N/2 of a real signal are real.
        expect(fast.im[0]).toBe(0);
        expect(fast.im[size / 2]).toBe(0);
      }
    });
  }

  it('puts a unit impulse at n = 1 on the unit circle: X[k] = e^(−j2πk/N) (DFT shift theorem)', () => {
    const size = 64;
    const impulse = new Float64Array(size);
    impulse[1] = 1;
    const spectrum = realFft(impulse, size);
    for (let k = 0; k <= size / 2; k++) {
      expect(spectrum.re[k]).toBeCloseTo(Math.cos((2 * Math.PI * k) / size), 14);
      expect(spectrum.im[k]).toBeCloseTo(-Math.sin((2 * Math.PI * k) / size), 14);
    }
  });

  it('reads a cosine of amplitude A on bin k as A·N/2 (DFT of a sampled cosine)', () => {
    const size = 1024;
    const signal = new Float64Array(size);
    for (let n = 0; n < size; n++) signal[n] = 0.75 * Math.cos((2 * Math.PI * 37 * n) / size);
    const spectrum = realFft(signal, size);
    expect(spectrum.re[37]).toBeCloseTo((0.75 * size) / 2, 9);
    expect(Math.abs(spectrum.im[37])).toBeLessThan(1e-9);
  });
});

describe('realFft against fft.js (general-purpose reference library, npm fft.js 4.0.4)', () => {
  for (const exponent of [2, 3, 5, 8, 11, 12, 13, 16, 17]) {
    const size = 2 ** exponent;
    it(`agrees at N = 2^${exponent}`, () => {
      const signal = seededSignal(size, exponent);
      const reference = new FFT(size);
      const out = reference.createComplexArray() as number[];
      reference.transform(out, reference.toComplexArray(Array.from(signal), undefined));
      const ours = realFft(signal, size);
      let peak = 0;
      let worst = 0;
      for (let k = 0; k <= size / 2; k++) {
        peak = Math.max(peak, Math.hypot(out[2 * k], out[2 * k + 1]));
        worst = Math.max(worst, Math.abs(ours.re[k] - out[2 * k]), Math.abs(ours.im[k] - out[2 * k + 1]));
      }
      expect(worst / peak).toBeLessThan(1e-13);
    });
  }
});

describe('inverseRealFft', () => {
  for (const exponent of [2, 3, 4, 7, 10, 15, 18]) {
    const size = 2 ** exponent;
    it(`round-trips a real signal at N = 2^${exponent} to within 1e-14 relative`, () => {
      const signal = seededSignal(size, 100 + exponent);
      const back = inverseRealFft(realFft(signal, size), size);
      expect(back.length).toBe(size);
      expect(maxAbsDifference(back, signal)).toBeLessThan(1e-14 * Math.sqrt(size) + 1e-15);
    });
  }

  it('ignores the imaginary parts of bins 0 and N/2, as numpy.fft.irfft does', () => {
    const size = 32;
    const spectrum = realFft(seededSignal(size, 7), size);
    const expected = inverseRealFft(spectrum, size);
    spectrum.im[0] = 5;
    spectrum.im[size / 2] = -3;
    expect(maxAbsDifference(inverseRealFft(spectrum, size), expected)).toBe(0);
  });

  it('matches the inverse DFT definition x[n] = (1/N)·Σ_k X[k]·e^(+j2πkn/N) over the Hermitian spectrum', () => {
    const size = 16;
    const spectrum = { re: new Float64Array(size / 2 + 1), im: new Float64Array(size / 2 + 1) };
    for (let k = 0; k <= size / 2; k++) {
      spectrum.re[k] = Math.cos(k) + 0.1 * k;
      spectrum.im[k] = k === 0 || k === size / 2 ? 0 : Math.sin(3 * k);
    }
    const signal = inverseRealFft(spectrum, size);
    for (let n = 0; n < size; n++) {
      let sum = 0;
      for (let k = 0; k < size; k++) {
        const folded = k <= size / 2 ? k : size - k;
        const re = spectrum.re[folded];
        const im = k <= size / 2 ? spectrum.im[folded] : -spectrum.im[folded];
        const angle = (2 * Math.PI * k * n) / size;
        sum += re * Math.cos(angle) - im * Math.sin(angle);
      }
      expect(signal[n]).toBeCloseTo(sum / size, 13);
    }
  });
});

describe('Parseval: Σ|x|² = (1/N)·Σ_k |X[k]|² over all N bins', () => {
  for (const exponent of [6, 12, 16]) {
    it(`holds at N = 2^${exponent}`, () => {
      const size = 2 ** exponent;
      const signal = seededSignal(size, exponent * 3);
      const { re, im } = realFft(signal, size);
      let timeEnergy = 0;
      for (const value of signal) timeEnergy += value * value;
      let spectralEnergy = re[0] * re[0] + re[size / 2] * re[size / 2];
      for (let k = 1; k < size / 2; k++) spectralEnergy += 2 * (re[k] * re[k] + im[k] * im[k]);
      expect(spectralEnergy / size / timeEnergy).toBeCloseTo(1, 12);
    });
  }
});

describe('size helpers and validation', () => {
  it('recognises powers of two and rounds up to the next one', () => {
    expect([2, 4, 1024, 2 ** 20].every(isPowerOfTwo)).toBe(true);
    expect([0, 1, 3, 6, 1000, 2.5, -4].some(isPowerOfTwo)).toBe(false);
    expect(nextPowerOfTwo(1)).toBe(2);
    expect(nextPowerOfTwo(1000)).toBe(1024);
    expect(nextPowerOfTwo(1024)).toBe(1024);
    expect(nextPowerOfTwo(480_001)).toBe(2 ** 19);
  });

  it('refuses sizes that are not powers of two, too small, or shorter than the signal, with EngineError fft_size_invalid', () => {
    const attempts = [
      () => realFft(new Float64Array(8), 12),
      () => realFft(new Float64Array(8), 2),
      () => realFft(new Float64Array(9), 8),
      () => inverseRealFft({ re: new Float64Array(4), im: new Float64Array(4) }, 8),
    ];
    for (const attempt of attempts) {
      let caught: unknown;
      try {
        attempt();
      } catch (error) {
        caught = error;
      }
      expect(isEngineError(caught) && caught.code).toBe('fft_size_invalid');
    }
  });
});
