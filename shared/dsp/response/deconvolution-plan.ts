import { EngineError } from '../errors';
import { nextPowerOfTwo } from '../fft';
import type { SweepDesign } from '../stimuli/sweep';

/** Types and the capture/FFT plan shared by both deconvolutions (see deconvolve.ts for the conventions). */
export type DeconvolutionMethod = 'analytic_inverse' | 'reference_division';

export interface DeconvolutionOptions {
  /** Capture sample at which the stimulus file (its leading silence) starts. Default 0. */
  captureOffsetSamples?: number;
  /** Reserve negative-time room for harmonic IRs up to this order. Default 1 (only the linear IR's pre-roll). */
  highestHarmonicOrder?: number;
  /** Negative-time room kept for the linear IR's pre-roll, seconds. Default 0.01 s. */
  preRollReserveSeconds?: number;
}

export interface CircularImpulseResponse {
  /** Length fftSize; see the layout in the module comment. */
  samples: Float64Array;
  fftSize: number;
  sampleRateHz: number;
  method: DeconvolutionMethod;
  /** Sweep rate constant L (seconds), for Δt_n = L·ln(n). */
  rateConstantSeconds: number;
  /** Indices [0, positiveSampleCount) hold t ≥ 0; the rest hold negative times. */
  positiveSampleCount: number;
  /** Capture samples used, counted from the sweep's t = 0. */
  usedCaptureSampleCount: number;
  /** Samples the stimulus needed from t = 0 (sweep plus trailing silence). */
  expectedCaptureSampleCount: number;
  description: string;
}

export interface CaptureSegment {
  start: number;
  length: number;
  fftSize: number;
  reserveSampleCount: number;
}

export function planSegment(captureLength: number, design: SweepDesign, options: DeconvolutionOptions): CaptureSegment {
  const fs = design.sampleRateHz;
  const offset = options.captureOffsetSamples ?? 0;
  if (!Number.isInteger(offset) || offset < 0) {
    throw new EngineError('capture_offset_invalid', `captureOffsetSamples must be a non-negative integer, got ${offset}.`, {
      field: 'captureOffsetSamples',
    });
  }
  const order = options.highestHarmonicOrder ?? 1;
  if (!Number.isInteger(order) || order < 1 || order > 100) {
    throw new EngineError('harmonic_order_invalid', `highestHarmonicOrder must be an integer from 1 to 100, got ${order}.`, {
      field: 'highestHarmonicOrder',
    });
  }
  const preRollSeconds = options.preRollReserveSeconds ?? 0.01;
  if (!Number.isFinite(preRollSeconds) || preRollSeconds < 0 || preRollSeconds > 10) {
    throw new EngineError('pre_roll_invalid', `preRollReserveSeconds must be from 0 to 10 s, got ${preRollSeconds}.`, {
      field: 'preRollReserveSeconds',
    });
  }
  const start = offset + design.leadingSilenceSampleCount;
  const expected = design.sweepSampleCount + design.trailingSilenceSampleCount;
  const length = Math.min(expected, captureLength - start);
  if (length < Math.min(design.sweepSampleCount, 16)) {
    throw new EngineError(
      'capture_too_short',
      `The capture ends before the sweep starts (needs more than ${start} samples, has ${captureLength}).`,
      { field: 'capture' },
    );
  }
  const L = design.rateConstantSeconds;
  const harmonicSeconds = order >= 2 ? L * Math.log(order) + 0.5 * L * Math.log((order + 1) / order) : 0;
  const reserveSampleCount = Math.ceil((harmonicSeconds + preRollSeconds) * fs);
  return { start, length, fftSize: Math.max(4, nextPowerOfTwo(length + reserveSampleCount)), reserveSampleCount };
}

export function buffer(
  samples: Float64Array,
  segment: CaptureSegment,
  design: SweepDesign,
  method: DeconvolutionMethod,
  description: string,
): CircularImpulseResponse {
  return {
    samples,
    fftSize: segment.fftSize,
    sampleRateHz: design.sampleRateHz,
    method,
    rateConstantSeconds: design.rateConstantSeconds,
    positiveSampleCount: segment.fftSize - segment.reserveSampleCount,
    usedCaptureSampleCount: segment.length,
    expectedCaptureSampleCount: design.sweepSampleCount + design.trailingSilenceSampleCount,
    description,
  };
}

/** Multiply `spectrum` in place by X̃(f)/(fs·A), the sweep's analytic inverse (Novak et al. 2015). */
