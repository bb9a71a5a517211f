import {
  analyzeCalibratorCapture,
  analyzeSteppedDistortion,
  analyzeSteppedResponse,
  analyzeSweepDistortion,
  analyzeSweepResponse,
  analyzeSweepResponseAndDistortion,
  analyzeToneDistortion,
  type DecodedWav,
} from '@shared/dsp';
import { numberFlag, requiredNumberFlag, UsageError, type FlagSpec, type ParsedArgs } from './cli-args';
import { CHANNEL_FLAGS, CURVE_OUTPUT_FLAGS, SWEEP_ANALYSIS_FLAGS, steppedResponseOptionsFromFlags, sweepResponseOptionsFromFlags } from './response-flags';
import {
  DISTORTION_FLAGS,
  LOOPBACK_FLAG,
  SINGLE_TONE_FLAGS,
  SWEEP_DISTORTION_FLAGS,
  SWEEP_GRID_FLAGS,
  TONE_ANALYSIS_FLAGS,
  singleToneSettingsFromFlags,
  steppedDistortionOptionsFromFlags,
  sweepDistortionOptionsFromFlags,
} from './distortion-flags';
import { COMMON_STIMULUS_FLAGS, STEPPED_FLAGS, SWEEP_FLAGS, steppedParametersFromFlags, sweepParametersFromFlags } from './stimulus-flags';

/**
 * The analysis kinds `npm run analyze` knows. To add one, append an entry: its name (the --kind value), a
 * one-line summary, the flags it accepts (shown by --help) and a run function that maps the parsed flags onto
 * an engine entry point and returns its result (printed as JSON, the same shape the API returns).
 */
export interface AnalysisKind {
  name: string;
  summary: string;
  flags: FlagSpec[];
  run(capture: DecodedWav, args: ParsedArgs): unknown;
}

const CALIBRATOR_FLAGS: FlagSpec[] = [
  { name: 'channel', value: 'N', description: 'channel holding the microphone signal (default 0)' },
  { name: 'stated-spl-db', value: 'DB', description: 'the calibrator’s stated level, dB SPL re 20 µPa (required, e.g. 94 or 114)' },
  { name: 'stated-frequency-hz', value: 'HZ', description: 'the calibrator’s stated frequency (default 1000)' },
];

const MEASUREMENT_CHANNEL_FLAGS = CHANNEL_FLAGS.filter((flag) => flag.name !== 'reference-channel');

function toneChannel(capture: DecodedWav, args: ParsedArgs, name: string): Float64Array | undefined {
  const index = numberFlag(args, name);
  if (index === undefined) return undefined;
  if (!Number.isInteger(index) || index < 0 || index >= capture.channels.length) {
    throw new UsageError(`--${name} must be a channel index from 0 to ${capture.channels.length - 1}.`);
  }
  return capture.channels[index];
}

/** Harmonic distortion kinds: from a sweep, a sweep with its response, a single tone, a stepped sine. */
const DISTORTION_KINDS: AnalysisKind[] = [
  {
    name: 'distortion',
    summary: 'harmonic distortion from a synchronized-sweep capture (HD_n at n·f0, THD_F and THD_R, high-order screening, summaries)',
    flags: [...SWEEP_FLAGS, ...COMMON_STIMULUS_FLAGS, ...MEASUREMENT_CHANNEL_FLAGS, LOOPBACK_FLAG, ...SWEEP_GRID_FLAGS, ...DISTORTION_FLAGS, ...SWEEP_DISTORTION_FLAGS],
    run: (capture, args) =>
      analyzeSweepDistortion(capture, sweepParametersFromFlags(args, capture.sampleRateHz), sweepDistortionOptionsFromFlags(args, true)),
  },
  {
    name: 'response-and-distortion',
    summary: 'frequency response and harmonic distortion of one sweep capture, one deconvolution, on the response grid',
    flags: [...SWEEP_FLAGS, ...COMMON_STIMULUS_FLAGS, ...CHANNEL_FLAGS, ...SWEEP_ANALYSIS_FLAGS, ...CURVE_OUTPUT_FLAGS, ...DISTORTION_FLAGS, ...SWEEP_DISTORTION_FLAGS],
    run: (capture, args) => {
      const { measurementChannel, captureOffsetSeconds, ...distortion } = sweepDistortionOptionsFromFlags(args, false);
      void measurementChannel;
      void captureOffsetSeconds;
      return analyzeSweepResponseAndDistortion(capture, sweepParametersFromFlags(args, capture.sampleRateHz), {
        response: sweepResponseOptionsFromFlags(args),
        distortion,
      });
    },
  },
  {
    name: 'tone-distortion',
    summary: 'HD_n, THD_F/THD_R, THD+N, SINAD and the residual spectrum of a single-tone capture',
    flags: [...SINGLE_TONE_FLAGS, LOOPBACK_FLAG, ...TONE_ANALYSIS_FLAGS, ...DISTORTION_FLAGS],
    run: (capture, args) =>
      analyzeToneDistortion(
        {
          samples: toneChannel(capture, args, 'channel') ?? capture.channels[0],
          sampleRateHz: capture.sampleRateHz,
          ...(toneChannel(capture, args, 'loopback-channel') ? { loopbackSamples: toneChannel(capture, args, 'loopback-channel') } : {}),
        },
        singleToneSettingsFromFlags(args),
      ),
  },
  {
    name: 'stepped-distortion',
    summary: 'HD_n, THD_F/THD_R, THD+N and screening at every step of a stepped-sine capture (coherent by default)',
    flags: [...STEPPED_FLAGS, ...COMMON_STIMULUS_FLAGS, ...MEASUREMENT_CHANNEL_FLAGS, LOOPBACK_FLAG, ...TONE_ANALYSIS_FLAGS, ...DISTORTION_FLAGS],
    run: (capture, args) =>
      analyzeSteppedDistortion(capture, steppedParametersFromFlags(args, capture.sampleRateHz), steppedDistortionOptionsFromFlags(args)),
  },
];

export const ANALYSIS_KINDS: AnalysisKind[] = [
  {
    name: 'response',
    summary: 'frequency response from a synchronized-sweep capture (IR, gate, smoothing, phase, group delay, band limits)',
    flags: [...SWEEP_FLAGS, ...COMMON_STIMULUS_FLAGS, ...CHANNEL_FLAGS, ...SWEEP_ANALYSIS_FLAGS, ...CURVE_OUTPUT_FLAGS],
    run: (capture, args) =>
      analyzeSweepResponse(capture, sweepParametersFromFlags(args, capture.sampleRateHz), sweepResponseOptionsFromFlags(args)),
  },
  {
    name: 'stepped',
    summary: 'level and phase of the fundamental per step from a stepped-sine capture',
    flags: [...STEPPED_FLAGS, ...COMMON_STIMULUS_FLAGS, ...CHANNEL_FLAGS, ...CURVE_OUTPUT_FLAGS],
    run: (capture, args) =>
      analyzeSteppedResponse(capture, steppedParametersFromFlags(args, capture.sampleRateHz), steppedResponseOptionsFromFlags(args)),
  },
  {
    name: 'calibrator',
    summary: 'chain sensitivity (dBFS at 1 Pa) from a calibrator capture',
    flags: CALIBRATOR_FLAGS,
    run: (capture, args) =>
      analyzeCalibratorCapture(capture, {
        statedLevelDbSpl: requiredNumberFlag(args, 'stated-spl-db'),
        ...(numberFlag(args, 'channel') === undefined ? {} : { channel: numberFlag(args, 'channel') }),
        ...(numberFlag(args, 'stated-frequency-hz') === undefined ? {} : { statedFrequencyHz: numberFlag(args, 'stated-frequency-hz') }),
      }),
  },
  ...DISTORTION_KINDS,
];
