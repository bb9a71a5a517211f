import { EngineError } from '../errors';
import { stimulusCautions } from './cautions';
import { applyHalfHannFades } from './fades';
import { resolveSweepParameters } from './sweep-parameters';

export { SWEEP_PARAMETER_KEYS, resolveSweepParameters, type SynchronizedTiming } from './sweep-parameters';

/**
 * Synchronized exponential sine sweep (Novak, Lotton, Simon, "Synchronized swept-sine: theory, application, and
 * implementation", JAES 63(10):786–798, 2015).
 *
 * Conventions:
 * - Rate constant L = round(f1·T_approx / ln(f2/f1)) / f1, so f1·L is an integer; actual sweep duration
 *   T = L·ln(f2/f1) (slightly different from the requested approximate duration).
 * - Sweep x(t) = A·sin(2π·f1·L·exp(t/L)) for t = n/fs, n = 0 … ceil(T·fs) − 1; x(0) = 0. The instantaneous
 *   frequency is f1·exp(t/L). A = 10^(levelDbfs/20) is the peak re full scale (for a sine, equal to its AES17 level).
 * - Because n·φ(t) = φ(t + L·ln n), the n-th harmonic is the sweep advanced by exactly Δt_n = L·ln(n) seconds
 *   (generally a non-integer number of samples); see harmonicAdvanceSeconds.
 * - Fades: half-Hann rise over fadeInSeconds at the start of the sweep and half-Hann fall over fadeOutSeconds at
 *   its end (see fades.ts). The analytic inverse used for deconvolution ignores the fades; they only reduce
 *   ripple at the band edges.
 * - Rendered file: leading silence, the sweep, trailing silence. Time t = 0 of the sweep is sample
 *   leadingSilenceSampleCount of the file.
 * - The design is fully determined by its resolved parameters: renderSweep(design) is bit-identical on every
 *   call and every run on the same JavaScript engine.
 */
export interface SweepParameters {
  /** Start frequency f1 in Hz (> 0, below stopHz). */
  startHz: number;
  /** Stop frequency f2 in Hz (≤ fs/2). */
  stopHz: number;
  /** Requested sweep duration in seconds (0.1 … 600); the synchronized duration T differs slightly. */
  approximateDurationSeconds: number;
  sampleRateHz: number;
  /** Peak level in dBFS (≤ 0). Default −20 dBFS: start low. */
  levelDbfs?: number;
  /** Half-Hann fade-in length in seconds. Default min(2/f1, T/10). */
  fadeInSeconds?: number;
  /** Half-Hann fade-out length in seconds. Default min(0.005, T/10). */
  fadeOutSeconds?: number;
  /** Silence before the sweep, in seconds. Default 0.1 s. */
  leadingSilenceSeconds?: number;
  /** Silence after the sweep, in seconds (leave at least the system's decay time). Default 1 s. */
  trailingSilenceSeconds?: number;
}

export type ResolvedSweepParameters = Required<SweepParameters>;

export interface SweepDesign {
  kind: 'synchronized_exponential_sweep';
  /** Every parameter with its default applied: enough to regenerate the stimulus bit for bit. */
  parameters: ResolvedSweepParameters;
  sampleRateHz: number;
  /** L in seconds. */
  rateConstantSeconds: number;
  /** f1·L, an integer. */
  startCycles: number;
  /** T = L·ln(f2/f1), seconds. */
  sweepDurationSeconds: number;
  /** Peak amplitude re full scale, 10^(levelDbfs/20). */
  amplitude: number;
  sweepSampleCount: number;
  leadingSilenceSampleCount: number;
  trailingSilenceSampleCount: number;
  fadeInSampleCount: number;
  fadeOutSampleCount: number;
  totalSampleCount: number;
  totalDurationSeconds: number;
  fadeShape: 'half_hann';
  formula: string;
  cautions: string[];
}

export const SWEEP_FORMULA =
  'x(t) = A·sin(2π·f1·L·exp(t/L)), 0 ≤ t < T, L = round(f1·T_approx/ln(f2/f1))/f1, T = L·ln(f2/f1) (synchronized swept sine, Novak et al., JAES 63(10) 2015)';

/** Validate the parameters, apply defaults and compute the synchronized design. Field paths are prefixed by `field`. */
export function designSynchronizedSweep(params: SweepParameters, field = 'sweep'): SweepDesign {
  const { parameters, startCycles, rateConstantSeconds, sweepDurationSeconds } = resolveSweepParameters(params, field);
  const { sampleRateHz, levelDbfs, fadeInSeconds, fadeOutSeconds, leadingSilenceSeconds, trailingSilenceSeconds } = parameters;
  const sweepSampleCount = Math.ceil(sweepDurationSeconds * sampleRateHz);
  const leadingSilenceSampleCount = Math.round(leadingSilenceSeconds * sampleRateHz);
  const trailingSilenceSampleCount = Math.round(trailingSilenceSeconds * sampleRateHz);
  const totalSampleCount = leadingSilenceSampleCount + sweepSampleCount + trailingSilenceSampleCount;
  return {
    kind: 'synchronized_exponential_sweep',
    parameters,
    sampleRateHz,
    rateConstantSeconds,
    startCycles,
    sweepDurationSeconds,
    amplitude: Math.pow(10, levelDbfs / 20),
    sweepSampleCount,
    leadingSilenceSampleCount,
    trailingSilenceSampleCount,
    fadeInSampleCount: Math.round(fadeInSeconds * sampleRateHz),
    fadeOutSampleCount: Math.round(fadeOutSeconds * sampleRateHz),
    totalSampleCount,
    totalDurationSeconds: totalSampleCount / sampleRateHz,
    fadeShape: 'half_hann',
    formula: SWEEP_FORMULA,
    cautions: stimulusCautions(),
  };
}

/** Same continuous sweep (same f1, f2, L, level, fades and silences) designed at another sample rate. */
export function redesignSweepAtSampleRate(design: SweepDesign, sampleRateHz: number, field = 'sweep'): SweepDesign {
  return designSynchronizedSweep({ ...design.parameters, sampleRateHz }, field);
}

/**
 * Sweep value at sample n of the sweep (t = n/fs), without fades or amplitude. Uses
 * sin(2π·f1·L·e^u) = sin(2π·f1·L·(e^u − 1)) (f1·L is an integer) and reduces the cycle count to its fraction,
 * which keeps the argument of sin small and accurate even for long sweeps.
 */
export function unitSweepSample(design: SweepDesign, n: number): number {
  const cycles = design.startCycles * Math.expm1(n / (design.sampleRateHz * design.rateConstantSeconds));
  return Math.sin(2 * Math.PI * (cycles - Math.floor(cycles)));
}

/** The complete stimulus: leading silence, faded sweep at the stated level, trailing silence. */
export function renderSweep(design: SweepDesign): Float64Array {
  const out = new Float64Array(design.totalSampleCount);
  const start = design.leadingSilenceSampleCount;
  for (let n = 0; n < design.sweepSampleCount; n++) {
    out[start + n] = design.amplitude * unitSweepSample(design, n);
  }
  applyHalfHannFades(out, start, design.sweepSampleCount, design.fadeInSampleCount, design.fadeOutSampleCount);
  return out;
}

/** Instantaneous frequency f1·exp(t/L) at time t (seconds from the start of the sweep). */
export function sweepFrequencyAtHz(design: SweepDesign, timeSeconds: number): number {
  return design.parameters.startHz * Math.exp(timeSeconds / design.rateConstantSeconds);
}

/** Time (seconds from the start of the sweep) at which the sweep passes frequencyHz: L·ln(f/f1). */
export function sweepTimeAtFrequencySeconds(design: SweepDesign, frequencyHz: number): number {
  return design.rateConstantSeconds * Math.log(frequencyHz / design.parameters.startHz);
}

/** Δt_n = L·ln(n): how far the n-th harmonic's response is advanced (Novak et al. 2015). */
export function harmonicAdvanceSeconds(design: Pick<SweepDesign, 'rateConstantSeconds'>, order: number): number {
  if (!Number.isInteger(order) || order < 1) {
    throw new EngineError('harmonic_order_invalid', `Harmonic order must be a positive integer, got ${order}.`, { field: 'order' });
  }
  return design.rateConstantSeconds * Math.log(order);
}
