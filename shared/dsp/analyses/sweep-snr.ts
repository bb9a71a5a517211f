import { smoothSpectrum } from '../curves';
import { deconvolvedNoisePower } from '../response/capture-noise';
import type { CircularImpulseResponse } from '../response/deconvolve';
import type { WindowedSpectrum } from '../response/windowed-spectrum';
import { warning, type EngineWarning } from '../result/warnings';
import type { SweepDesign } from '../stimuli/sweep';

/**
 * Estimated SNR of the response per grid point: 1/3-octave power of the windowed response over that of the noise
 * it carries, the noise taken from the capture's leading silence and carried through the deconvolution
 * (response/capture-noise.ts). Needs at least MINIMUM_NOISE_SECONDS of leading silence in the capture.
 */
export const SNR_SMOOTHING = { octaveFraction: 3, averaging: 'power', window: 'hann' } as const;
export const MINIMUM_NOISE_SECONDS = 0.02;

export interface SweepSnr {
  snrDb: Float64Array | null;
  description: string;
  warnings: EngineWarning[];
}

export function sweepSnr(
  measurement: Float64Array,
  design: SweepDesign,
  captureOffsetSamples: number,
  driveAmplitude: number,
  ir: CircularImpulseResponse,
  spectrum: WindowedSpectrum,
  gridHz: Float64Array,
  thresholdDb: number,
): SweepSnr {
  const fs = design.sampleRateHz;
  const noiseLength = Math.min(design.leadingSilenceSampleCount, measurement.length - captureOffsetSamples);
  if (noiseLength < MINIMUM_NOISE_SECONDS * fs || !(driveAmplitude > 0)) {
    return { snrDb: null, description: 'not estimated (the stimulus has less than 20 ms of leading silence)', warnings: [] };
  }
  const power = deconvolvedNoisePower(measurement.subarray(captureOffsetSamples, captureOffsetSamples + noiseLength), spectrum.fftSize, {
    sampleRateHz: fs,
    rateConstantSeconds: design.rateConstantSeconds,
    driveAmplitude,
    usedCaptureSampleCount: ir.usedCaptureSampleCount,
    deconvolutionFftSize: ir.fftSize,
    windowSumOfSquares: spectrum.windowSumOfSquares,
  });
  for (let k = 0; k < power.length; k++) power[k] = Math.sqrt(power[k]);
  const noise = { re: power, im: new Float64Array(power.length), binSpacingHz: spectrum.binSpacingHz };
  const signalDb = smoothSpectrum(spectrum, gridHz, SNR_SMOOTHING).magnitudeDb;
  const noiseDb = smoothSpectrum(noise, gridHz, SNR_SMOOTHING).magnitudeDb;
  const snrDb = signalDb.map((level, i) => Math.min(level - noiseDb[i], 400));
  const { startHz, stopHz } = design.parameters;
  let worst = -1;
  let below = 0;
  gridHz.forEach((f, i) => {
    if (f < startHz || f > stopHz || snrDb[i] >= thresholdDb) return;
    below++;
    if (worst < 0 || snrDb[i] < snrDb[worst]) worst = i;
  });
  const warnings =
    worst < 0
      ? []
      : [
          warning('low_snr', `The estimated SNR falls to ${snrDb[worst].toFixed(1)} dB at ${gridHz[worst].toPrecision(4)} Hz (threshold ${thresholdDb} dB; ${below} grid points below it).`, {
            worstSnrDb: snrDb[worst],
            worstFrequencyHz: gridHz[worst],
            pointsBelowThreshold: below,
          }),
        ];
  return {
    snrDb,
    description: `estimated per grid point: 1/3-octave power of the windowed response over the noise of the capture's first ${(noiseLength / fs).toFixed(3)} s (leading silence) carried through the deconvolution and the window; assumes stationary noise${ir.method === 'reference_division' ? ' and a roughly flat loopback' : ''}`,
    warnings,
  };
}
