import type { CurveOutputOptions, ReferenceOption, SteppedResponseOptions, SweepResponseOptions } from '@shared/dsp';
import { defined, hasFlag, numberFlag, stringFlag, UsageError, type FlagSpec, type ParsedArgs } from './cli-args';

/** Command-line flags for the response analyses, mapped onto the engine's option objects (which validate them). */
export const CHANNEL_FLAGS: FlagSpec[] = [
  { name: 'measurement-channel', value: 'N', description: 'channel holding the microphone/DUT signal (default 0)' },
  { name: 'reference-channel', value: 'N', description: 'loopback channel to divide by (cancels the interface and its latency)' },
  { name: 'capture-offset-s', value: 'S', description: 'where the stimulus file starts in the capture (default 0)' },
];

export const CURVE_OUTPUT_FLAGS: FlagSpec[] = [
  { name: 'normalise', value: 'REF', description: 'none | 1khz | <Hz> | band:<lowHz>-<highHz>[:db|power] (default none)' },
  { name: 'band-limit-reference', value: 'REF', description: 'reference of the −X dB points: 1khz | <Hz> | band:<lowHz>-<highHz>[:db|power] (default: the normalisation’s, else 1 kHz)' },
  { name: 'band-limit-drops', value: 'DB,…', description: 'the −X dB points to find (default 3,6,10)' },
  { name: 'tolerance-db', value: 'DB', description: 'X of the widest "±X dB from A to B" range (default 3)' },
  { name: 'ignore-narrower-than-oct', value: 'OCT', description: 'step over excursions narrower than this, e.g. 0.111 (default 0)' },
  { name: 'no-band-limits', description: 'skip band limits and the ±X dB range' },
  { name: 'no-third-octave', description: 'skip the 1/3-octave table' },
  { name: 'dbfs-at-1pa', value: 'DBFS', description: 'chain calibration (from a calibrator capture): results in dB SPL re 20 µPa' },
  { name: 'distance-m', value: 'M', description: 'measurement distance (stated in the result; needed for --refer-distance-m)' },
  { name: 'drive-vrms', value: 'V', description: 'drive voltage at the terminals (stated; needed for --refer-vrms)' },
  { name: 'temperature-c', value: '°C', description: 'air temperature for the speed of sound (default 20)' },
  { name: 'refer-distance-m', value: 'M', description: 'refer the SPL to this distance (inverse-square law, far field only)' },
  { name: 'refer-vrms', value: 'V', description: 'refer the SPL to this drive voltage (linear system assumed)' },
  { name: 'low-snr-db', value: 'DB', description: 'SNR below which low_snr is raised (sweep default 20 per grid point, steps 20)' },
];

export const SWEEP_ANALYSIS_FLAGS: FlagSpec[] = [
  { name: 'gate-ms', value: 'MS', description: 'time gate length after the IR peak (quasi-anechoic); lowest valid frequency ≈ 1/T' },
  { name: 'gate-pre-roll-ms', value: 'MS', description: 'gate start before the IR peak (default 1)' },
  { name: 'gate-shape', value: 'SHAPE', description: 'half_hann (flat top, default) | tukey' },
  { name: 'gate-taper', value: 'F', description: 'half_hann: fall share after the peak (0.25); tukey: α (0.5)' },
  { name: 'window-s', value: 'S', description: 'ungated IR window after the peak (default 1, cut to the recorded decay)' },
  { name: 'smoothing', value: '1/N|none', description: 'fractional-octave smoothing, N = 1…48 (default none)' },
  { name: 'smoothing-mode', value: 'MODE', description: 'power (default) | complex' },
  { name: 'smoothing-window', value: 'SHAPE', description: 'hann (default) | rectangular, over log frequency' },
  { name: 'points-per-octave', value: 'N', description: 'output grid density, 1…96 (default 48)' },
  { name: 'grid-start-hz', value: 'HZ', description: 'output grid start (default: sweep start)' },
  { name: 'grid-stop-hz', value: 'HZ', description: 'output grid stop (default: sweep stop)' },
  { name: 'ir-output-ms', value: 'MS', description: 'windowed IR included after the peak (default 50; 0 omits it)' },
];

function parseReference(text: string, flag: string): ReferenceOption {
  if (text === '1khz') return { kind: 'at_1khz' };
  const band = /^band:([0-9.eE+-]+)-([0-9.eE+-]+)(?::(db|power))?$/.exec(text);
  if (band) return { kind: 'band_mean', lowHz: Number(band[1]), highHz: Number(band[2]), average: (band[3] as 'db' | 'power') ?? 'power' };
  const frequency = Number(text);
  if (text.trim() !== '' && Number.isFinite(frequency)) return { kind: 'at_frequency', frequencyHz: frequency };
  throw new UsageError(`--${flag} must be 1khz, a frequency in Hz or band:<lowHz>-<highHz>[:db|power], got "${text}".`);
}

function parseList(text: string | undefined, flag: string): number[] | undefined {
  if (text === undefined) return undefined;
  const values = text.split(',').map(Number);
  if (values.some((v) => !Number.isFinite(v))) throw new UsageError(`--${flag} must be a comma-separated list of numbers, got "${text}".`);
  return values;
}

export function curveOutputOptionsFromFlags(args: ParsedArgs): CurveOutputOptions {
  const normalise = stringFlag(args, 'normalise');
  const bandReference = stringFlag(args, 'band-limit-reference');
  const calibration = numberFlag(args, 'dbfs-at-1pa');
  const referDistance = numberFlag(args, 'refer-distance-m');
  const referVoltage = numberFlag(args, 'refer-vrms');
  return defined({
    normalisation: normalise === undefined ? undefined : normalise === 'none' ? { kind: 'none' as const } : parseReference(normalise, 'normalise'),
    bandLimits: hasFlag(args, 'no-band-limits')
      ? null
      : defined({
          reference: bandReference === undefined ? undefined : parseReference(bandReference, 'band-limit-reference'),
          dropsDb: parseList(stringFlag(args, 'band-limit-drops'), 'band-limit-drops'),
          toleranceDb: numberFlag(args, 'tolerance-db'),
          ignoreExcursionsNarrowerThanOctaves: numberFlag(args, 'ignore-narrower-than-oct'),
        }),
    thirdOctaveTable: hasFlag(args, 'no-third-octave') ? false : undefined,
    calibration: calibration === undefined ? undefined : { dbfsAtOnePascal: calibration },
    conditions: defined({
      distanceMetres: numberFlag(args, 'distance-m'),
      driveVoltageRms: numberFlag(args, 'drive-vrms'),
      temperatureCelsius: numberFlag(args, 'temperature-c'),
    }),
    referTo: referDistance === undefined && referVoltage === undefined ? undefined : defined({ distanceMetres: referDistance, driveVoltageRms: referVoltage }),
  });
}

function channelOptions(args: ParsedArgs) {
  return defined({
    measurementChannel: numberFlag(args, 'measurement-channel'),
    referenceChannel: numberFlag(args, 'reference-channel'),
    captureOffsetSeconds: numberFlag(args, 'capture-offset-s'),
    lowSnrThresholdDb: numberFlag(args, 'low-snr-db'),
  });
}

function parseSmoothing(args: ParsedArgs): SweepResponseOptions['smoothing'] {
  const text = stringFlag(args, 'smoothing');
  const mode = stringFlag(args, 'smoothing-mode') as 'power' | 'complex' | undefined;
  const window = stringFlag(args, 'smoothing-window') as 'hann' | 'rectangular' | undefined;
  if (text === undefined && mode === undefined && window === undefined) return undefined;
  let octaveFraction: number | 'none' = 'none';
  if (text !== undefined && text !== 'none') {
    const match = /^1\/(\d+)$/.exec(text);
    if (!match) throw new UsageError(`--smoothing must be none or 1/N (e.g. 1/6), got "${text}".`);
    octaveFraction = Number(match[1]);
  }
  return { octaveFraction, ...defined({ averaging: mode, window }) };
}

export function sweepResponseOptionsFromFlags(args: ParsedArgs): SweepResponseOptions {
  const gateMs = numberFlag(args, 'gate-ms');
  const preRollMs = numberFlag(args, 'gate-pre-roll-ms');
  const irMs = numberFlag(args, 'ir-output-ms');
  if (gateMs === undefined && ['gate-pre-roll-ms', 'gate-shape', 'gate-taper'].some((name) => args.flags.has(name))) {
    throw new UsageError('The gate options need --gate-ms.');
  }
  const grid = defined({
    pointsPerOctave: numberFlag(args, 'points-per-octave'),
    startHz: numberFlag(args, 'grid-start-hz'),
    stopHz: numberFlag(args, 'grid-stop-hz'),
  });
  return {
    ...channelOptions(args),
    ...curveOutputOptionsFromFlags(args),
    ...defined({
      gate:
        gateMs === undefined
          ? undefined
          : {
              lengthSeconds: gateMs / 1000,
              ...defined({
                preRollSeconds: preRollMs === undefined ? undefined : preRollMs / 1000,
                shape: stringFlag(args, 'gate-shape') as 'half_hann' | 'tukey' | undefined,
                taperFraction: numberFlag(args, 'gate-taper'),
              }),
            },
      analysisWindowSeconds: numberFlag(args, 'window-s'),
      smoothing: parseSmoothing(args),
      grid: Object.keys(grid).length > 0 ? grid : undefined,
      impulseResponseOutputSeconds: irMs === undefined ? undefined : irMs / 1000,
    }),
  };
}

export function steppedResponseOptionsFromFlags(args: ParsedArgs): SteppedResponseOptions {
  return { ...channelOptions(args), ...curveOutputOptionsFromFlags(args) };
}
