import { analyzeCalibratorCapture, analyzeSteppedResponse, analyzeSweepResponse, type DecodedWav } from '@shared/dsp';
import { numberFlag, requiredNumberFlag, type FlagSpec, type ParsedArgs } from './cli-args';
import { CHANNEL_FLAGS, CURVE_OUTPUT_FLAGS, SWEEP_ANALYSIS_FLAGS, steppedResponseOptionsFromFlags, sweepResponseOptionsFromFlags } from './response-flags';
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
];
