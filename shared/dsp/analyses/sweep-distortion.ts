import { describeLogGrid, logFrequencyGrid } from '../curves/grid';
import { selectSegment } from '../distortion/capture-checks';
import { sweepDistortionPart, type ImpulseForDistortion } from '../distortion/sweep-distortion-part';
import { noiseDensity, type NoiseDensity } from '../distortion/sweep-noise';
import { resolveSweepDistortionOptions, type ResolvedSweepDistortionOptions, type SweepDistortionOptions } from '../distortion/sweep-options';
import { EngineError } from '../errors';
import { deconvolveSweepCapture } from '../response/deconvolve';
import { findImpulsePeak } from '../response/impulse-peak';
import { ENGINE_VERSION } from '../result/engine-version';
import type { AnalysisResult } from '../result/types';
import type { EngineWarning } from '../result/warnings';
import type { SweepDesign, SweepParameters } from '../stimuli/sweep';
import { channelWarnings, requireCapture, requireFiniteSamples, type CaptureInput } from './capture-checks';
import { resolveSweepDesignForCapture, sweepCaptureWarnings } from './sweep-stimulus';

export type SweepDistortionPart = ReturnType<typeof sweepDistortionPart>;
export type SweepDistortionResult = AnalysisResult<
  SweepDistortionPart['figures'] & Record<string, unknown>,
  SweepDistortionPart['curves'] & Record<string, unknown>
>;

/** Analytic-inverse deconvolution with room for every order asked, and the linear IR's peak. */
export function impulseForDistortion(channel: Float64Array, design: SweepDesign, options: ResolvedSweepDistortionOptions): ImpulseForDistortion {
  const fs = design.sampleRateHz;
  const highestOrder = Math.max(options.common.maxOrder, options.common.screening?.toOrder ?? 2);
  const ir = deconvolveSweepCapture(channel, design, {
    captureOffsetSamples: Math.round(options.captureOffsetSeconds * fs),
    highestHarmonicOrder: highestOrder,
    preRollReserveSeconds: Math.min(options.prePeakSeconds, 1),
  });
  const recordedDecay = ir.usedCaptureSampleCount - design.sweepSampleCount;
  const searchAfter = Math.min(Math.max(recordedDecay, Math.round(0.1 * fs)), ir.positiveSampleCount);
  const peak = findImpulsePeak(ir, Math.round(0.001 * fs), searchAfter);
  return { ir, linearPeakSamples: peak.delaySamples };
}

/** The stimulus-off part of the capture the noise floor is measured on ('auto': second half of the trailing silence, else the leading silence). */
export function sweepNoiseDensity(channel: Float64Array, design: SweepDesign, options: ResolvedSweepDistortionOptions): NoiseDensity | null {
  const fs = design.sampleRateHz;
  if (options.noiseSegment === null) return null;
  if (options.noiseSegment !== 'auto') {
    return noiseDensity(selectSegment(channel, fs, options.noiseSegment, 'options.noiseSegment'), fs, 'stimulus-off segment of the capture (stated)');
  }
  const offset = Math.round(options.captureOffsetSeconds * fs);
  const sweepEnd = offset + design.leadingSilenceSampleCount + design.sweepSampleCount;
  const trailingEnd = Math.min(channel.length, sweepEnd + design.trailingSilenceSampleCount);
  const trailingStart = sweepEnd + Math.floor((trailingEnd - sweepEnd) / 2);
  const trailing = trailingEnd > trailingStart ? noiseDensity(channel.subarray(trailingStart, trailingEnd), fs, 'second half of the trailing silence') : null;
  if (trailing) return trailing;
  // The leading silence, less its last 10 % (latency), holds the noise before the sweep arrives.
  const leadingEnd = offset + Math.floor(0.9 * design.leadingSilenceSampleCount);
  return leadingEnd - offset > 0 ? noiseDensity(channel.subarray(offset, leadingEnd), fs, 'leading silence before the sweep') : null;
}

export function distortionGrid(design: SweepDesign, options: ResolvedSweepDistortionOptions) {
  const startHz = options.grid.startHz ?? design.parameters.startHz;
  const stopHz = options.grid.stopHz ?? Math.min(design.parameters.stopHz, options.common.upperLimitHz);
  if (stopHz <= startHz) {
    throw new EngineError('grid_band_empty', `The distortion grid ${startHz}–${stopHz} Hz is empty.`, { field: 'options.grid' });
  }
  const spec = { pointsPerOctave: options.grid.pointsPerOctave, startHz, stopHz };
  return { gridHz: logFrequencyGrid(spec), description: describeLogGrid(spec) };
}

/** Harmonic distortion (HD_n for n = 2..K, THD both ways, screening, summaries) from a synchronized-sweep capture. */
export function analyzeSweepDistortion(
  capture: CaptureInput,
  stimulus: SweepParameters | SweepDesign,
  options: SweepDistortionOptions = {},
): SweepDistortionResult {
  const input = requireCapture(capture);
  const resolved = resolveSweepDistortionOptions(options, input.channels.length);
  const { design, warnings: designWarnings } = resolveSweepDesignForCapture(stimulus, input.sampleRateHz);
  const measurement = input.channels[resolved.measurementChannel];
  requireFiniteSamples(measurement, `capture.channels[${resolved.measurementChannel}]`);
  const loopbackChannel = resolved.loopbackChannel === null ? null : input.channels[resolved.loopbackChannel];
  if (loopbackChannel) requireFiniteSamples(loopbackChannel, `capture.channels[${resolved.loopbackChannel}]`);
  const warnings: EngineWarning[] = [
    ...designWarnings,
    ...channelWarnings(measurement, resolved.measurementChannel, 'measurement'),
    ...(loopbackChannel ? channelWarnings(loopbackChannel, resolved.loopbackChannel as number, 'loopback') : []),
    ...sweepCaptureWarnings(measurement.length, design, resolved.captureOffsetSeconds),
  ];
  const grid = distortionGrid(design, resolved);
  const part = sweepDistortionPart({
    impulse: impulseForDistortion(measurement, design, resolved),
    design,
    gridHz: grid.gridHz,
    options: resolved,
    noise: sweepNoiseDensity(measurement, design, resolved),
    loopback: loopbackChannel ? impulseForDistortion(loopbackChannel, design, resolved) : null,
  });
  return {
    kind: 'distortion',
    engineVersion: ENGINE_VERSION,
    conventions: {
      magnitudeReference: 'dB re the fundamental (HD_n, THD, screening)',
      dbfsConvention: 'aes17_sine',
      deconvolution: 'analytic inverse of the synchronized sweep (Novak et al. 2015), divided by fs and the sweep amplitude',
      grid: grid.description,
      stimulus: `${design.formula}; f1 = ${design.parameters.startHz} Hz, f2 = ${design.parameters.stopHz} Hz, L = ${design.rateConstantSeconds} s, level ${design.parameters.levelDbfs} dBFS peak`,
      ...part.conventions,
    },
    figures: part.figures,
    curves: part.curves,
    warnings: [...warnings, ...part.warnings],
  };
}
