import type { LinearSpectrum, OctaveFraction } from '../curves/curve';
import { smoothSpectrum } from '../curves/smoothing';
import { nextPowerOfTwo, realFft } from '../fft';
import { circularSlice } from '../response/impulse-peak';
import { windowWeights } from '../response/time-window';
import { unitPhasor } from '../response/unit-phasor';
import type { HarmonicWindow } from './harmonic-windows';

/** Zero-padding factor: bins at most 1/(window length) apart (the record's own resolution, the window being tapered). */
const PAD_FACTOR = 1;

/**
 * Spectrum of one windowed harmonic IR, referred to its exact peak time τ_n: the FFT of the window (first sample at
 * startOffset) is rotated by e^(+j2πf·(τ_n − startOffset)/fs), which applies the fractional part of L·ln(n)·fs as a
 * linear phase and takes out the pre-peak offset.
 */
export function harmonicSpectrum(
  buffer: Float64Array,
  sampleRateHz: number,
  plan: HarmonicWindow,
): LinearSpectrum & { windowSumSquares: number } {
  const total = plan.window.totalSamples;
  const segment = circularSlice(buffer, plan.startOffset, total);
  const weights = windowWeights(plan.window);
  let windowSumSquares = 0;
  for (let n = 0; n < total; n++) {
    segment[n] *= weights[n];
    windowSumSquares += weights[n] * weights[n];
  }
  const fftSize = Math.max(1024, nextPowerOfTwo(PAD_FACTOR * total));
  const { re, im } = realFft(segment, fftSize);
  const shift = plan.peakSamples - plan.startOffset;
  const phasor = new Float64Array(2);
  for (let k = 0; k < re.length; k++) {
    unitPhasor((k * shift) / fftSize, phasor);
    const a = re[k];
    const b = im[k];
    re[k] = a * phasor[0] - b * phasor[1];
    im[k] = a * phasor[1] + b * phasor[0];
  }
  return { re, im, binSpacingHz: sampleRateHz / fftSize, windowSumSquares };
}

export interface SpectrumReading {
  magnitude: Float64Array;
  phaseDeg: Float64Array | null;
}

/**
 * |H| (and optionally its phase) at each frequency: fractional-octave power smoothing when asked, else power
 * interpolated linearly between bins; phase from re/im interpolated linearly (bulk delay already removed).
 */
export function readSpectrum(
  spectrum: LinearSpectrum,
  frequenciesHz: Float64Array,
  smoothing: OctaveFraction,
  withPhase: boolean,
): SpectrumReading {
  const smoothed = smoothSpectrum(spectrum, frequenciesHz, { octaveFraction: smoothing, averaging: 'power' });
  const magnitude = smoothed.magnitudeDb.map((db) => 10 ** (db / 20));
  if (!withPhase) return { magnitude, phaseDeg: null };
  const complex = smoothSpectrum(spectrum, frequenciesHz, { octaveFraction: 'none', averaging: 'complex' });
  return { magnitude, phaseDeg: complex.phaseDeg ?? null };
}
