import { nextPowerOfTwo, realFft } from '../fft';
import type { CircularImpulseResponse } from './deconvolve';
import { circularSlice, type ImpulsePeak } from './impulse-peak';
import { windowWeights, type TimeWindow } from './time-window';
import { unitPhasor } from './unit-phasor';

/**
 * Spectrum of the windowed linear impulse response with the bulk delay removed.
 *
 * The window's first sample lies at t_start = (peak index − preRoll)/fs. Its FFT is rotated by
 * e^(+j2πf·(preRoll + δ)/fs) (δ = sub-sample part of the peak), which is the same as H(f)·e^(+j2πf·τ0) with
 * τ0 = the peak delay: the excess response left after the time of flight is taken out. The record is zero-padded to
 * at least fs/minimumBinSpacingHz so the spectrum is sampled densely enough for smoothing and phase unwrapping.
 */
export interface WindowedSpectrum {
  /** One-sided excess spectrum (bulk delay removed), bins 0..M/2. */
  re: Float64Array;
  im: Float64Array;
  binSpacingHz: number;
  fftSize: number;
  /** The windowed IR itself, first sample at t = startSeconds. */
  windowedImpulse: Float64Array;
  startSeconds: number;
  /** Σw² of the window weights (for noise scaling). */
  windowSumOfSquares: number;
}

export const MINIMUM_BIN_SPACING_HZ = 1;

export function windowedExcessSpectrum(
  ir: CircularImpulseResponse,
  peak: ImpulsePeak,
  window: TimeWindow,
): WindowedSpectrum {
  const start = peak.sampleOffset - window.preRollSamples;
  const windowed = circularSlice(ir.samples, start, window.totalSamples);
  const weights = windowWeights(window);
  let windowSumOfSquares = 0;
  for (let n = 0; n < windowed.length; n++) {
    windowed[n] *= weights[n];
    windowSumOfSquares += weights[n] * weights[n];
  }
  const fftSize = Math.max(nextPowerOfTwo(window.totalSamples), nextPowerOfTwo(Math.ceil(ir.sampleRateHz / MINIMUM_BIN_SPACING_HZ)));
  const spectrum = realFft(windowed, fftSize);
  const shiftSamples = window.preRollSamples + (peak.delaySamples - peak.sampleOffset);
  const { re, im } = spectrum;
  const phasor = new Float64Array(2);
  for (let k = 0; k < re.length; k++) {
    unitPhasor((k * shiftSamples) / fftSize, phasor);
    const c = phasor[0];
    const s = phasor[1];
    const a = re[k];
    const b = im[k];
    re[k] = a * c - b * s;
    im[k] = a * s + b * c;
  }
  return {
    re,
    im,
    binSpacingHz: ir.sampleRateHz / fftSize,
    fftSize,
    windowedImpulse: windowed,
    startSeconds: start / ir.sampleRateHz,
    windowSumOfSquares,
  };
}
