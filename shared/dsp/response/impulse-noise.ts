import type { CircularImpulseResponse } from './deconvolve';
import type { ImpulsePeak } from './impulse-peak';

/**
 * Broadband peak-to-noise ratio of the impulse response, 20·log10(|h_peak| / RMS of the noise), with the noise
 * taken from the pre-arrival gap: from half the second harmonic's advance (½·L·ln 2) before the peak up to 1 ms
 * before the window's pre-roll. Only noise (and the tail of the 2nd-harmonic IR if the system rings longer than
 * ½·L·ln 2, and the band-edge ringing of the deconvolved pulse near f1) lives there, so it is conservative
 * (common practice, no source).
 */
export interface ImpulseNoiseEstimate {
  peakToNoiseDb: number;
  noiseRmsLinear: number;
  /** Noise span, seconds from t = 0 (negative = before the sweep's start). */
  noiseFromSeconds: number;
  noiseToSeconds: number;
}

const MINIMUM_NOISE_SAMPLES = 32;

export function estimateImpulseNoise(ir: CircularImpulseResponse, peak: ImpulsePeak, preRollSamples: number): ImpulseNoiseEstimate | null {
  const fs = ir.sampleRateHz;
  const end = peak.sampleOffset - preRollSamples - Math.ceil(0.001 * fs);
  const start = peak.sampleOffset - Math.floor(0.5 * ir.rateConstantSeconds * Math.LN2 * fs);
  if (end - start < MINIMUM_NOISE_SAMPLES || end - start > ir.fftSize / 2) return null;
  const n = ir.samples.length;
  let sum = 0;
  for (let offset = start; offset < end; offset++) {
    const v = ir.samples[((offset % n) + n) % n];
    sum += v * v;
  }
  const noiseRmsLinear = Math.sqrt(sum / (end - start));
  const peakToNoiseDb = noiseRmsLinear > 0 ? Math.min(20 * Math.log10(Math.abs(peak.value) / noiseRmsLinear), 400) : 400;
  return { peakToNoiseDb, noiseRmsLinear, noiseFromSeconds: start / fs, noiseToSeconds: end / fs };
}
