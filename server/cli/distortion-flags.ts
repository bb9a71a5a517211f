import type { CommonDistortionOptions, SteppedDistortionOptions, SweepDistortionOptions, ToneDistortionOptions } from '@shared/dsp';
import { defined, hasFlag, numberFlag, stringFlag, UsageError, type FlagSpec, type ParsedArgs } from './cli-args';

/** Command-line flags of the distortion analyses, mapped onto the engine's option objects (which validate them). */
export const DISTORTION_FLAGS: FlagSpec[] = [
  { name: 'max-order', value: 'K', description: 'highest harmonic order, orders 2..K (default 10)' },
  { name: 'upper-limit-hz', value: 'HZ', description: 'harmonics above min(Nyquist, this[, sweep stop]) are dropped (default 20000)' },
  { name: 'margin-db', value: 'DB', description: 'a harmonic less than this above its noise floor is an upper bound (default 10)' },
  { name: 'thd-headline', value: 'FORM', description: 'thd_f (default) | thd_r: which THD is the headline (both are reported)' },
  { name: 'screening', value: 'N1-N2|off', description: 'high-order screening orders (rub and buzz), default 10-35' },
  { name: 'max-band-hz', value: 'LOW-HIGH', description: 'band of the "max THD" summary (default 100-10000)' },
  { name: 'below-percent', value: 'X', description: 'X of "THD below X % from A to B" (default 1)' },
  { name: 'reference-hz', value: 'HZ', description: 'frequency the "below X %" interval must contain; also "THD at" (default 1000)' },
];

export const LOOPBACK_FLAG: FlagSpec = { name: 'loopback-channel', value: 'N', description: 'loopback channel: analysed the same way as the chain residual' };

export const SWEEP_DISTORTION_FLAGS: FlagSpec[] = [
  { name: 'harmonic-smoothing', value: '1/N|none', description: 'fractional-octave power smoothing of every harmonic spectrum (default none)' },
  { name: 'phase', description: 'include the phase of each harmonic (synchronized sweep)' },
  { name: 'pre-peak-ms', value: 'MS', description: 'window start before each harmonic IR peak (default 50, capped at ¼ of the shortest window)' },
  { name: 'linear-window-ms', value: 'MS', description: 'linear IR window after its peak (default L·ln 2, cut to the recorded decay)' },
  { name: 'noise-segment', value: 'START:DUR|auto|none', description: 'stimulus-off part of the capture for the noise floor, seconds (default auto: trailing silence)' },
  { name: 'min-snr-db', value: 'DB', description: 'fundamental-to-noise ratio below which low_snr is raised (default 40)' },
];

export const SWEEP_GRID_FLAGS: FlagSpec[] = [
  { name: 'points-per-octave', value: 'N', description: 'output grid density, 1…96 (default 48)' },
  { name: 'grid-start-hz', value: 'HZ', description: 'output grid start (default: sweep start)' },
  { name: 'grid-stop-hz', value: 'HZ', description: 'output grid stop (default: min(sweep stop, upper limit))' },
];

export const TONE_ANALYSIS_FLAGS: FlagSpec[] = [
  { name: 'method', value: 'M', description: 'windowed (default for tones) | coherent (integer cycles, stimulus on the same clock)' },
  { name: 'window', value: 'W', description: 'bh7 (7-term Blackman-Harris, default) | bh4 (4-term, −92 dB)' },
  { name: 'thdn-band-hz', value: 'LOW-HIGH', description: 'THD+N bandwidth (default 20-20000)' },
  { name: 'a-weighting', description: 'A-weight the THD+N residual (IEC 61672-1)' },
  { name: 'min-snr-db', value: 'DB', description: 'fundamental-to-noise ratio below which low_snr is raised (default 40)' },
  { name: 'residual-ppo', value: 'N', description: 'points per octave of the plotted residual spectrum (default 24)' },
  { name: 'dbfs-at-1pa', value: 'DBFS', description: 'chain calibration: also give the fundamental in dB SPL' },
];

export const SINGLE_TONE_FLAGS: FlagSpec[] = [
  { name: 'channel', value: 'N', description: 'channel holding the DUT signal (default 0)' },
  { name: 'tone-hz', value: 'HZ', description: 'stimulus frequency (required for coherent; otherwise the largest tone)' },
  { name: 'segment', value: 'START:DUR', description: 'part of the capture to analyse, seconds (skip the settling)' },
  { name: 'silent-segment', value: 'START:DUR', description: 'stimulus-off part of the capture for the noise floor, seconds' },
];

function pair(text: string | undefined, flag: string, separator: string): [number, number] | undefined {
  if (text === undefined) return undefined;
  const parts = text.split(separator).map(Number);
  if (parts.length !== 2 || parts.some((v) => !Number.isFinite(v))) {
    throw new UsageError(`--${flag} must be two numbers separated by "${separator}", got "${text}".`);
  }
  return [parts[0], parts[1]];
}

function segment(text: string | undefined, flag: string) {
  const values = pair(text, flag, ':');
  return values ? { startSeconds: values[0], durationSeconds: values[1] } : undefined;
}

export function commonDistortionOptionsFromFlags(args: ParsedArgs): CommonDistortionOptions {
  const screeningText = stringFlag(args, 'screening');
  const screeningOrders = screeningText === undefined || screeningText === 'off' ? undefined : pair(screeningText, 'screening', '-');
  const summary = defined({
    maxBandHz: pair(stringFlag(args, 'max-band-hz'), 'max-band-hz', '-'),
    belowPercent: numberFlag(args, 'below-percent'),
    referenceHz: numberFlag(args, 'reference-hz'),
  });
  return defined({
    maxOrder: numberFlag(args, 'max-order'),
    upperLimitHz: numberFlag(args, 'upper-limit-hz'),
    marginDb: numberFlag(args, 'margin-db'),
    thdHeadline: stringFlag(args, 'thd-headline') as CommonDistortionOptions['thdHeadline'],
    screening: (screeningText === 'off' ? false : screeningOrders ? { fromOrder: screeningOrders[0], toOrder: screeningOrders[1] } : undefined) as
      | CommonDistortionOptions['screening']
      | undefined,
    summary: Object.keys(summary).length > 0 ? summary : undefined,
  }) as CommonDistortionOptions;
}

export function sweepDistortionOptionsFromFlags(args: ParsedArgs, withGrid: boolean): SweepDistortionOptions {
  const smoothing = stringFlag(args, 'harmonic-smoothing');
  const noiseText = stringFlag(args, 'noise-segment');
  const pre = numberFlag(args, 'pre-peak-ms');
  const linear = numberFlag(args, 'linear-window-ms');
  const grid = defined({
    pointsPerOctave: numberFlag(args, 'points-per-octave'),
    startHz: numberFlag(args, 'grid-start-hz'),
    stopHz: numberFlag(args, 'grid-stop-hz'),
  });
  return defined({
    ...commonDistortionOptionsFromFlags(args),
    measurementChannel: numberFlag(args, 'measurement-channel'),
    loopbackChannel: numberFlag(args, 'loopback-channel'),
    captureOffsetSeconds: numberFlag(args, 'capture-offset-s'),
    octaveFraction: smoothing === undefined || smoothing === 'none' ? undefined : Number(smoothing.replace(/^1\//, '')),
    includePhase: hasFlag(args, 'phase') ? true : undefined,
    prePeakSeconds: pre === undefined ? undefined : pre / 1000,
    linearWindowSeconds: linear === undefined ? undefined : linear / 1000,
    noiseSegment: noiseText === undefined || noiseText === 'auto' ? undefined : noiseText === 'none' ? null : segment(noiseText, 'noise-segment'),
    minSnrDb: numberFlag(args, 'min-snr-db'),
    grid: withGrid && Object.keys(grid).length > 0 ? grid : undefined,
  });
}

export function toneOptionsFromFlags(args: ParsedArgs): ToneDistortionOptions & SteppedDistortionOptions {
  const windowName = stringFlag(args, 'window');
  const band = pair(stringFlag(args, 'thdn-band-hz'), 'thdn-band-hz', '-');
  const thdPlusNoise = defined({ lowHz: band?.[0], highHz: band?.[1], weighting: hasFlag(args, 'a-weighting') ? ('a' as const) : undefined });
  const dbfsAtOnePascal = numberFlag(args, 'dbfs-at-1pa');
  return defined({
    ...commonDistortionOptionsFromFlags(args),
    method: stringFlag(args, 'method') as ToneDistortionOptions['method'],
    // Anything but bh4/bh7 goes through unchanged, so the engine names it in its error.
    window: (windowName === 'bh4' ? 'blackman_harris_4' : windowName === 'bh7' ? 'blackman_harris_7' : windowName) as ToneDistortionOptions['window'],
    thdPlusNoise: Object.keys(thdPlusNoise).length > 0 ? thdPlusNoise : undefined,
    minSnrDb: numberFlag(args, 'min-snr-db'),
    residualPointsPerOctave: numberFlag(args, 'residual-ppo'),
    levelCalibration: dbfsAtOnePascal === undefined ? undefined : { dbfsAtOnePascal },
  }) as ToneDistortionOptions & SteppedDistortionOptions;
}

export function singleToneSettingsFromFlags(args: ParsedArgs): ToneDistortionOptions {
  return defined({
    ...toneOptionsFromFlags(args),
    toneFrequencyHz: numberFlag(args, 'tone-hz'),
    analysisSegment: segment(stringFlag(args, 'segment'), 'segment'),
    silentSegment: segment(stringFlag(args, 'silent-segment'), 'silent-segment'),
  });
}

export function steppedDistortionOptionsFromFlags(args: ParsedArgs): SteppedDistortionOptions {
  return defined({
    ...toneOptionsFromFlags(args),
    measurementChannel: numberFlag(args, 'measurement-channel'),
    loopbackChannel: numberFlag(args, 'loopback-channel'),
    captureOffsetSeconds: numberFlag(args, 'capture-offset-s'),
  });
}
