import { EngineError } from '../errors';
import { inverseRealFft, nextPowerOfTwo, realFft, type Spectrum } from '../fft';
import { harmonicAdvanceSeconds, type SweepDesign } from '../stimuli/sweep';
import { unitPhasor } from './unit-phasor';

export { harmonicAdvanceSeconds };

/**
 * Deconvolution of a synchronized-sweep capture into a circular impulse-response buffer.
 *
 * Conventions:
 * - Time zero is the first sample of the sweep itself (the stimulus file's leading silence is skipped: the capture
 *   is read from captureOffsetSamples + leadingSilenceSampleCount). A system delay, including any interface
 *   latency when no loopback reference is used, therefore appears as a delay of the linear IR.
 * - Buffer layout: `samples[i]` is h(t = i/fs) for i < positiveSampleCount and h(t = (i − fftSize)/fs) for the
 *   remaining indices (negative times wrapped to the end, as in any circular deconvolution). The linear IR starts
 *   at t ≥ 0; the n-th harmonic IR peaks at t = −Δt_n = −L·ln(n), i.e. at index fftSize − L·ln(n)·fs (generally
 *   fractional: apply the fraction as a linear phase on that harmonic's spectrum, or treat its phase as unreliable).
 * - FFT size = nextPowerOfTwo(used capture samples + negative-time reserve). The reserve holds the pre-roll of the
 *   linear IR and, when highestHarmonicOrder ≥ 2, the harmonic IRs up to that order with half the gap to the next
 *   order (L·ln(K) + ½·L·ln((K+1)/K)) plus the pre-roll.
 * - Analytic inverse (Novak et al., JAES 63(10) 2015): X̃(f) = 2·sqrt(f/L)·exp(−j2πfL(1 − ln(f/f1)) + jπ/4), X̃(0) = 0,
 *   h = IFFT(FFT(y)·X̃)/(fs·A). Dividing by fs turns the sampled FFT into the continuous-time scale and dividing by
 *   the sweep amplitude A makes the result relative to the stimulus: a unit-gain system gives |H| ≈ 1 in [f1, f2].
 * - Reference division (dual-channel): H = Y·conj(X)/(|X|² + ε(f)) with X the captured loopback of the drive
 *   signal (Kirkeby et al., IEEE Trans. Speech Audio Proc. 6(2), 1998, regularised inversion). ε is 1e−10 of the
 *   mean in-band |X|² inside [f1, f2] and rises (geometrically, raised-cosine in log f) to 1× that mean one third
 *   of an octave outside the band, so out-of-band noise is not amplified. The interface's response and latency
 *   cancel; the result is dB re the loopback channel.
 */
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

interface CaptureSegment {
  start: number;
  length: number;
  fftSize: number;
  reserveSampleCount: number;
}

function planSegment(captureLength: number, design: SweepDesign, options: DeconvolutionOptions): CaptureSegment {
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

function buffer(
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
export function applyAnalyticInverse(spectrum: Spectrum, fftSize: number, design: SweepDesign): void {
  const fs = design.sampleRateHz;
  const L = design.rateConstantSeconds;
  const f1 = design.parameters.startHz;
  const binHz = fs / fftSize;
  const scale = (2 * Math.sqrt(binHz)) / (Math.sqrt(L) * fs * design.amplitude);
  const logBinRatio = Math.log(binHz / f1);
  const { re, im } = spectrum;
  const phasor = new Float64Array(2);
  re[0] = 0;
  im[0] = 0;
  for (let k = 1; k < re.length; k++) {
    // Phase in cycles, −f·L·(1 − ln(f/f1)) + 1/8, reduced to [0, 1) (unitPhasor reduces it).
    const f = k * binHz;
    unitPhasor(0.125 - f * L * (1 - (Math.log(k) + logBinRatio)), phasor);
    const gain = scale * Math.sqrt(k);
    const c = gain * phasor[0];
    const s = gain * phasor[1];
    const a = re[k];
    const b = im[k];
    re[k] = a * c - b * s;
    im[k] = a * s + b * c;
  }
}

/** Deconvolve one capture channel by the sweep's analytic inverse. */
export function deconvolveSweepCapture(
  capture: Float64Array,
  design: SweepDesign,
  options: DeconvolutionOptions = {},
): CircularImpulseResponse {
  const segment = planSegment(capture.length, design, options);
  const spectrum = realFft(capture.subarray(segment.start, segment.start + segment.length), segment.fftSize);
  applyAnalyticInverse(spectrum, segment.fftSize, design);
  const samples = inverseRealFft(spectrum, segment.fftSize);
  return buffer(samples, segment, design, 'analytic_inverse', 'analytic inverse of the synchronized sweep (Novak et al. 2015), divided by fs and the sweep amplitude');
}

/** Weight 0 inside [f1, f2] rising to 1 one third of an octave outside (raised cosine in log2 f). */
function outOfBandWeight(frequencyHz: number, startHz: number, stopHz: number): number {
  const transitionOctaves = 1 / 3;
  let octavesOutside = 0;
  if (frequencyHz < startHz) octavesOutside = frequencyHz <= 0 ? Infinity : Math.log2(startHz / frequencyHz);
  else if (frequencyHz > stopHz) octavesOutside = Math.log2(frequencyHz / stopHz);
  if (octavesOutside <= 0) return 0;
  if (octavesOutside >= transitionOctaves) return 1;
  return 0.5 * (1 - Math.cos((Math.PI * octavesOutside) / transitionOctaves));
}

export const REFERENCE_REGULARISATION = { inBandRelative: 1e-10, outOfBandRelative: 1, transitionOctaves: 1 / 3 } as const;

/** Deconvolve a capture channel by its recorded loopback reference: H = Y·conj(X)/(|X|² + ε(f)). */
export function deconvolveWithReference(
  capture: Float64Array,
  reference: Float64Array,
  design: SweepDesign,
  options: DeconvolutionOptions = {},
): CircularImpulseResponse {
  if (reference.length !== capture.length) {
    throw new EngineError('reference_length_mismatch', 'The reference channel must have as many samples as the measurement channel.', {
      field: 'referenceChannel',
    });
  }
  const segment = planSegment(capture.length, design, options);
  const end = segment.start + segment.length;
  const y = realFft(capture.subarray(segment.start, end), segment.fftSize);
  const x = realFft(reference.subarray(segment.start, end), segment.fftSize);
  const binHz = design.sampleRateHz / segment.fftSize;
  const { startHz, stopHz } = design.parameters;
  let inBandPower = 0;
  let inBandBins = 0;
  for (let k = 0; k < x.re.length; k++) {
    const f = k * binHz;
    if (f >= startHz && f <= stopHz) {
      inBandPower += x.re[k] * x.re[k] + x.im[k] * x.im[k];
      inBandBins++;
    }
  }
  const meanPower = inBandBins > 0 ? inBandPower / inBandBins : 0;
  if (!(meanPower > 0)) {
    throw new EngineError('reference_channel_silent', 'The reference channel holds no signal inside the sweep band.', {
      field: 'referenceChannel',
    });
  }
  const logIn = Math.log(REFERENCE_REGULARISATION.inBandRelative * meanPower);
  const logOut = Math.log(REFERENCE_REGULARISATION.outOfBandRelative * meanPower);
  for (let k = 0; k < y.re.length; k++) {
    const w = outOfBandWeight(k * binHz, startHz, stopHz);
    const epsilon = Math.exp(logIn + (logOut - logIn) * w);
    const xr = x.re[k];
    const xi = x.im[k];
    const yr = y.re[k];
    const yi = y.im[k];
    const denominator = xr * xr + xi * xi + epsilon;
    y.re[k] = (yr * xr + yi * xi) / denominator;
    y.im[k] = (yi * xr - yr * xi) / denominator;
  }
  const samples = inverseRealFft(y, segment.fftSize);
  return buffer(
    samples,
    segment,
    design,
    'reference_division',
    'division by the loopback reference channel, H = Y·conj(X)/(|X|² + ε), ε = 1e−10 of the mean in-band |X|² inside the sweep band rising to 1× over 1/3 octave outside (Kirkeby et al. 1998)',
  );
}

/** Fractional buffer index at which the n-th harmonic IR peaks: fftSize − L·ln(n)·fs (order 1 → 0). */
export function harmonicPeakIndex(ir: Pick<CircularImpulseResponse, 'fftSize' | 'sampleRateHz' | 'rateConstantSeconds'>, order: number): number {
  if (order === 1) return 0;
  return ir.fftSize - harmonicAdvanceSeconds(ir, order) * ir.sampleRateHz;
}

/** Time in seconds of buffer index i (negative for the wrapped part). */
export function bufferIndexTimeSeconds(ir: CircularImpulseResponse, index: number): number {
  const i = index < ir.positiveSampleCount ? index : index - ir.fftSize;
  return i / ir.sampleRateHz;
}
