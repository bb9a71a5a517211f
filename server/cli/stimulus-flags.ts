import type { SteadyToneParameters, SteppedSineParameters, SweepParameters } from '@shared/dsp';
import { defined, numberFlag, requiredNumberFlag, UsageError, type FlagSpec, type ParsedArgs } from './cli-args';

/**
 * Command-line flags that describe a stimulus by its parameters (the same parameters the API takes), for both
 * `stimulus` (to write it) and `analyze` (to deconvolve by it). In `analyze`, --sample-rate-hz defaults to the
 * capture's rate.
 */
export const COMMON_STIMULUS_FLAGS: FlagSpec[] = [
  { name: 'sample-rate-hz', value: 'HZ', description: 'stimulus sample rate (analyze: defaults to the capture’s)' },
  { name: 'level-dbfs', value: 'DB', description: 'peak level, dBFS ≤ 0 (default −20: start low)' },
  { name: 'lead-silence-s', value: 'S', description: 'silence before the stimulus (sweep/tone default 0.1, steps 0.1)' },
  { name: 'trail-silence-s', value: 'S', description: 'silence after it (sweep default 1, steps 0.2, tone 0.1)' },
];

export const SWEEP_FLAGS: FlagSpec[] = [
  { name: 'sweep-start-hz', value: 'HZ', description: 'synchronized sweep start frequency f1 (required)' },
  { name: 'sweep-stop-hz', value: 'HZ', description: 'stop frequency f2 ≤ fs/2 (required)' },
  { name: 'sweep-duration-s', value: 'S', description: 'approximate sweep duration, 0.1–600 s (required; the synchronized T differs slightly)' },
  { name: 'fade-in-s', value: 'S', description: 'half-Hann fade-in (default min(2/f1, T/10))' },
  { name: 'fade-out-s', value: 'S', description: 'half-Hann fade-out (default min(5 ms, T/10))' },
];

export const STEPPED_FLAGS: FlagSpec[] = [
  { name: 'steps-start-hz', value: 'HZ', description: 'first step: the band containing this frequency (required)' },
  { name: 'steps-stop-hz', value: 'HZ', description: 'last step: the band containing this frequency (required)' },
  { name: 'steps-per-octave', value: 'B', description: '1/B-octave steps, B = 1, 2, 3, 6, 12 or 24 (required)' },
  { name: 'settle-s', value: 'S', description: 'minimum settle time per step (default 0.05)' },
  { name: 'settle-cycles', value: 'N', description: 'minimum settle periods per step (default 10)' },
  { name: 'analysis-s', value: 'S', description: 'minimum analysis window per step (default 0.1)' },
  { name: 'analysis-cycles', value: 'N', description: 'minimum whole cycles analysed per step (default 20)' },
  { name: 'ramp-s', value: 'S', description: 'half-Hann level ramp at each step’s start and end (default 0.005)' },
  { name: 'gap-s', value: 'S', description: 'silence between steps (default 0)' },
];

export const TONE_FLAGS: FlagSpec[] = [
  { name: 'tone-frequency-hz', value: 'HZ', description: 'steady tone frequency (required)' },
  { name: 'tone-duration-s', value: 'S', description: 'tone duration, 0.1–600 s (required)' },
  { name: 'fade-s', value: 'S', description: 'half-Hann fade at each end (default 0.01)' },
];

function sampleRate(args: ParsedArgs, fallbackHz: number | undefined): number {
  const rate = numberFlag(args, 'sample-rate-hz') ?? fallbackHz;
  if (rate === undefined) throw new UsageError('Option --sample-rate-hz is required.');
  return rate;
}

export function sweepParametersFromFlags(args: ParsedArgs, fallbackSampleRateHz?: number): SweepParameters {
  return {
    startHz: requiredNumberFlag(args, 'sweep-start-hz'),
    stopHz: requiredNumberFlag(args, 'sweep-stop-hz'),
    approximateDurationSeconds: requiredNumberFlag(args, 'sweep-duration-s'),
    sampleRateHz: sampleRate(args, fallbackSampleRateHz),
    ...defined({
      levelDbfs: numberFlag(args, 'level-dbfs'),
      fadeInSeconds: numberFlag(args, 'fade-in-s'),
      fadeOutSeconds: numberFlag(args, 'fade-out-s'),
      leadingSilenceSeconds: numberFlag(args, 'lead-silence-s'),
      trailingSilenceSeconds: numberFlag(args, 'trail-silence-s'),
    }),
  };
}

export function steppedParametersFromFlags(args: ParsedArgs, fallbackSampleRateHz?: number): SteppedSineParameters {
  return {
    startHz: requiredNumberFlag(args, 'steps-start-hz'),
    stopHz: requiredNumberFlag(args, 'steps-stop-hz'),
    bandsPerOctave: requiredNumberFlag(args, 'steps-per-octave'),
    sampleRateHz: sampleRate(args, fallbackSampleRateHz),
    ...defined({
      levelDbfs: numberFlag(args, 'level-dbfs'),
      settleSeconds: numberFlag(args, 'settle-s'),
      settleCycles: numberFlag(args, 'settle-cycles'),
      analysisSeconds: numberFlag(args, 'analysis-s'),
      analysisCycles: numberFlag(args, 'analysis-cycles'),
      rampSeconds: numberFlag(args, 'ramp-s'),
      gapSeconds: numberFlag(args, 'gap-s'),
      leadingSilenceSeconds: numberFlag(args, 'lead-silence-s'),
      trailingSilenceSeconds: numberFlag(args, 'trail-silence-s'),
    }),
  };
}

export function toneParametersFromFlags(args: ParsedArgs): SteadyToneParameters {
  return {
    frequencyHz: requiredNumberFlag(args, 'tone-frequency-hz'),
    durationSeconds: requiredNumberFlag(args, 'tone-duration-s'),
    sampleRateHz: sampleRate(args, undefined),
    ...defined({
      levelDbfs: numberFlag(args, 'level-dbfs'),
      fadeSeconds: numberFlag(args, 'fade-s'),
      leadingSilenceSeconds: numberFlag(args, 'lead-silence-s'),
      trailingSilenceSeconds: numberFlag(args, 'trail-silence-s'),
    }),
  };
}
