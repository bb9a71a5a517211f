import { fractionalOctaveBands } from '@shared/units/bands';
import { EngineError } from '../errors';
import { stimulusCautions } from './cautions';
import { halfHannRiseGain } from './fades';
import {
  rejectUnknownKeys,
  requireFiniteNumber,
  requireInteger,
  requireLevelDbfs,
  requireNumberInRange,
  requireObject,
  requireSampleRateHz,
} from './parameter-checks';

/**
 * Stepped-sine plan on a fractional-octave grid.
 *
 * Conventions:
 * - Step frequencies are the exact IEC 61260-1 base-10 mid-band frequencies of 1/b octave (b = 1, 2, 3, 6, 12, 24)
 *   from the band containing startHz to the band containing stopHz, labelled with ISO 266 nominal values (from
 *   shared/units/bands). Steps at or above fs/2 are dropped.
 * - Coherent analysis window per step: k = max(analysisCycles, ceil(f·analysisSeconds)) whole cycles and
 *   N = round(k·fs/f) samples, so the tone actually played is f' = k·fs/N (reported as analysedFrequencyHz;
 *   |f' − f|/f ≤ 1/(2N)). The window then holds exactly k cycles and the tone sits on DFT bin k with no leakage,
 *   its harmonics on bins n·k.
 * - Each step: half-Hann ramp up over rampSeconds, settle for max(settleSeconds, settleCycles/f), the analysis
 *   window, half-Hann ramp down, then gapSeconds of silence. The tone is A·sin(2π·k·m/N) with m counted from the
 *   step's first sample (m integer, the phase reduced exactly through (k·m) mod N). A = 10^(levelDbfs/20).
 * - Rendered file: leading silence, the steps, trailing silence; regenerated bit for bit from the parameters.
 */
export interface SteppedSineParameters {
  startHz: number;
  stopHz: number;
  /** b in 1/b octave: 1, 2, 3, 6, 12 or 24. */
  bandsPerOctave: number;
  sampleRateHz: number;
  /** Peak level, dBFS (≤ 0). Default −20. */
  levelDbfs?: number;
  /** Minimum settle time per step, s. Default 0.05. */
  settleSeconds?: number;
  /** Minimum settle time in periods of the step frequency. Default 10. */
  settleCycles?: number;
  /** Minimum analysis window, s. Default 0.1. */
  analysisSeconds?: number;
  /** Minimum whole cycles in the analysis window. Default 20. */
  analysisCycles?: number;
  /** Half-Hann level ramp at the start and end of each step, s. Default 0.005. */
  rampSeconds?: number;
  /** Silence between steps, s. Default 0. */
  gapSeconds?: number;
  leadingSilenceSeconds?: number;
  trailingSilenceSeconds?: number;
}

export interface SteppedSineStep {
  index: number;
  /** IEC 61260-1 band number x. */
  bandIndex: number;
  exactHz: number;
  nominalLabel: string;
  /** f' = k·fs/N, the frequency actually played and analysed. */
  analysedFrequencyHz: number;
  analysisCycles: number;
  analysisSampleCount: number;
  /** File sample where the step (its ramp up) begins. */
  startSample: number;
  rampSampleCount: number;
  settleSampleCount: number;
  /** File sample where the analysis window begins. */
  analysisStartSample: number;
  /** File sample just after the step's ramp down. */
  endSample: number;
}

export interface SteppedSinePlan {
  kind: 'stepped_sine';
  parameters: Required<SteppedSineParameters>;
  sampleRateHz: number;
  amplitude: number;
  steps: SteppedSineStep[];
  totalSampleCount: number;
  totalDurationSeconds: number;
  fadeShape: 'half_hann';
  formula: string;
  cautions: string[];
}

export const STEPPED_SINE_BANDS_PER_OCTAVE = [1, 2, 3, 6, 12, 24] as const;
const KEYS = [
  'startHz',
  'stopHz',
  'bandsPerOctave',
  'sampleRateHz',
  'levelDbfs',
  'settleSeconds',
  'settleCycles',
  'analysisSeconds',
  'analysisCycles',
  'rampSeconds',
  'gapSeconds',
  'leadingSilenceSeconds',
  'trailingSilenceSeconds',
] as const;
const MAX_PLAN_SECONDS = 3600;

export function designSteppedSine(params: SteppedSineParameters, field = 'steppedSine'): SteppedSinePlan {
  const raw = requireObject(params, field);
  rejectUnknownKeys(raw, field, KEYS);
  const sampleRateHz = requireSampleRateHz(raw.sampleRateHz, `${field}.sampleRateHz`);
  const bandsPerOctave = requireFiniteNumber(raw.bandsPerOctave, `${field}.bandsPerOctave`);
  if (!(STEPPED_SINE_BANDS_PER_OCTAVE as readonly number[]).includes(bandsPerOctave)) {
    throw new EngineError('bands_per_octave_invalid', `${field}.bandsPerOctave must be one of ${STEPPED_SINE_BANDS_PER_OCTAVE.join(', ')}, got ${bandsPerOctave}.`, {
      field: `${field}.bandsPerOctave`,
    });
  }
  const startHz = requireNumberInRange(raw.startHz, `${field}.startHz`, 1, sampleRateHz / 2, 'Hz', 'step_frequency_out_of_range');
  const stopHz = requireNumberInRange(raw.stopHz, `${field}.stopHz`, 1, sampleRateHz / 2, 'Hz', 'step_frequency_out_of_range');
  if (startHz > stopHz) {
    throw new EngineError('step_band_empty', `${field}.startHz (${startHz} Hz) must not exceed ${field}.stopHz (${stopHz} Hz).`, {
      field: `${field}.startHz`,
    });
  }
  const p: Required<SteppedSineParameters> = {
    startHz,
    stopHz,
    bandsPerOctave,
    sampleRateHz,
    levelDbfs: requireLevelDbfs(raw.levelDbfs ?? -20, `${field}.levelDbfs`),
    settleSeconds: requireNumberInRange(raw.settleSeconds ?? 0.05, `${field}.settleSeconds`, 0, 60, 's'),
    settleCycles: requireNumberInRange(raw.settleCycles ?? 10, `${field}.settleCycles`, 0, 100000, 'cycles'),
    analysisSeconds: requireNumberInRange(raw.analysisSeconds ?? 0.1, `${field}.analysisSeconds`, 0, 60, 's'),
    analysisCycles: requireInteger(raw.analysisCycles ?? 20, `${field}.analysisCycles`, 1, 100000),
    rampSeconds: requireNumberInRange(raw.rampSeconds ?? 0.005, `${field}.rampSeconds`, 0, 10, 's'),
    gapSeconds: requireNumberInRange(raw.gapSeconds ?? 0, `${field}.gapSeconds`, 0, 60, 's'),
    leadingSilenceSeconds: requireNumberInRange(raw.leadingSilenceSeconds ?? 0.1, `${field}.leadingSilenceSeconds`, 0, 60, 's'),
    trailingSilenceSeconds: requireNumberInRange(raw.trailingSilenceSeconds ?? 0.2, `${field}.trailingSilenceSeconds`, 0, 60, 's'),
  };
  const bands = fractionalOctaveBands(bandsPerOctave, startHz, stopHz).filter((band) => band.exactHz < sampleRateHz / 2);
  const ramp = Math.round(p.rampSeconds * sampleRateHz);
  const gap = Math.round(p.gapSeconds * sampleRateHz);
  let cursor = Math.round(p.leadingSilenceSeconds * sampleRateHz);
  const steps: SteppedSineStep[] = [];
  for (const band of bands) {
    const f = band.exactHz;
    const k = Math.max(p.analysisCycles, Math.ceil(f * p.analysisSeconds));
    const n = Math.round((k * sampleRateHz) / f);
    if (2 * k >= n) continue; // f' would reach Nyquist
    const settle = Math.ceil(Math.max(p.settleSeconds, p.settleCycles / f) * sampleRateHz);
    const step: SteppedSineStep = {
      index: steps.length,
      bandIndex: band.index,
      exactHz: f,
      nominalLabel: band.nominalLabel,
      analysedFrequencyHz: (k * sampleRateHz) / n,
      analysisCycles: k,
      analysisSampleCount: n,
      startSample: cursor,
      rampSampleCount: ramp,
      settleSampleCount: settle,
      analysisStartSample: cursor + ramp + settle,
      endSample: cursor + 2 * ramp + settle + n,
    };
    steps.push(step);
    cursor = step.endSample + gap;
  }
  if (steps.length === 0) {
    throw new EngineError('step_plan_empty', `No 1/${bandsPerOctave}-octave step lies between ${startHz} Hz and ${stopHz} Hz below Nyquist.`, {
      field: `${field}.startHz`,
    });
  }
  const totalSampleCount = cursor - gap + Math.round(p.trailingSilenceSeconds * sampleRateHz);
  if (totalSampleCount / sampleRateHz > MAX_PLAN_SECONDS) {
    throw new EngineError('step_plan_too_long', `The plan would last ${(totalSampleCount / sampleRateHz).toFixed(0)} s (limit ${MAX_PLAN_SECONDS} s).`, {
      field,
    });
  }
  return {
    kind: 'stepped_sine',
    parameters: p,
    sampleRateHz,
    amplitude: Math.pow(10, p.levelDbfs / 20),
    steps,
    totalSampleCount,
    totalDurationSeconds: totalSampleCount / sampleRateHz,
    fadeShape: 'half_hann',
    formula: 'per step x[m] = A·w[m]·sin(2π·k·m/N), f′ = k·fs/N, k whole cycles in the N-sample analysis window, w = half-Hann ramps',
    cautions: stimulusCautions(),
  };
}

/** Tone value of step `step` at step sample m (without ramps or amplitude). */
export function unitStepSample(step: SteppedSineStep, m: number): number {
  return Math.sin((2 * Math.PI * ((step.analysisCycles * m) % step.analysisSampleCount)) / step.analysisSampleCount);
}

export function renderSteppedSine(plan: SteppedSinePlan): Float64Array {
  const out = new Float64Array(plan.totalSampleCount);
  for (const step of plan.steps) {
    const length = step.endSample - step.startSample;
    const ramp = step.rampSampleCount;
    for (let m = 0; m < length; m++) {
      const fromEnd = length - 1 - m;
      const gain = m < ramp ? halfHannRiseGain(m, ramp) : fromEnd < ramp ? halfHannRiseGain(fromEnd, ramp) : 1;
      out[step.startSample + m] = plan.amplitude * gain * unitStepSample(step, m);
    }
  }
  return out;
}
