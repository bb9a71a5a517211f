import { dbSplFromPascals } from '../../units/levels';
import { EngineError } from '../errors';
import { rejectUnknownKeys, requireInteger, requireNumberInRange, requireObject, requireOneOf } from '../stimuli/parameter-checks';
import {
  COMMON_OPTION_KEYS,
  requireOptionsObject,
  resolveCommonOptions,
  resolveThdPlusNoiseBand,
  type CommonDistortionOptions,
  type ResolvedCommonOptions,
  type ThdPlusNoiseOptions,
} from './options';
import type { ThdPlusNoiseBand } from './thd-plus-noise';
import type { ToneAnalysisMethod, ToneWindowName } from './tone-spectrum';

/** Turns the fundamental's dBFS into a calibrated level. */
export type LevelCalibration = { dbfsAtOnePascal: number } | { dbfsAtOneVoltRms: number };

/** Options of a tone analysis (single tone, or each step of a stepped sine). */
export interface ToneAnalysisOptions extends CommonDistortionOptions {
  /** 'coherent' when the stimulus is ours and the clocks are shared (integer cycles); default 'windowed'. */
  method?: ToneAnalysisMethod;
  /** Low-sidelobe window for the windowed method. Default 'blackman_harris_7'. */
  window?: ToneWindowName;
  thdPlusNoise?: ThdPlusNoiseOptions;
  /** Below this fundamental-to-noise ratio a low_snr warning is raised, dB. Default 40. */
  minSnrDb?: number;
  /** Points per octave of the plotted residual spectrum. Default 24. */
  residualPointsPerOctave?: number;
  levelCalibration?: LevelCalibration;
}

export interface ResolvedToneOptions {
  common: ResolvedCommonOptions;
  method: ToneAnalysisMethod;
  window: ToneWindowName;
  thdPlusNoiseBand: ThdPlusNoiseBand;
  minSnrDb: number;
  residualPointsPerOctave: number;
  levelCalibration: LevelCalibration | null;
}

export const TONE_OPTION_KEYS = [
  ...COMMON_OPTION_KEYS,
  'method',
  'window',
  'thdPlusNoise',
  'minSnrDb',
  'residualPointsPerOctave',
  'levelCalibration',
] as const;

function resolveCalibration(value: unknown, field: string): LevelCalibration | null {
  if (value === undefined) return null;
  const raw = requireObject(value, field);
  rejectUnknownKeys(raw, field, ['dbfsAtOnePascal', 'dbfsAtOneVoltRms']);
  if ('dbfsAtOnePascal' in raw === 'dbfsAtOneVoltRms' in raw) {
    throw new EngineError('calibration_ambiguous', `${field} needs exactly one of dbfsAtOnePascal or dbfsAtOneVoltRms.`, {
      field,
    });
  }
  if ('dbfsAtOnePascal' in raw) {
    return {
      dbfsAtOnePascal: requireNumberInRange(raw.dbfsAtOnePascal, `${field}.dbfsAtOnePascal`, -200, 200, 'dBFS'),
    };
  }
  return { dbfsAtOneVoltRms: requireNumberInRange(raw.dbfsAtOneVoltRms, `${field}.dbfsAtOneVoltRms`, -200, 200, 'dBFS') };
}

/** Validate and default tone-analysis options; `extraKeys` are keys the calling analysis handles itself. */
export function resolveToneOptions(value: unknown, field: string, extraKeys: readonly string[] = []): ResolvedToneOptions {
  const raw = requireOptionsObject(value, field);
  rejectUnknownKeys(raw, field, [...TONE_OPTION_KEYS, ...extraKeys]);
  return {
    common: resolveCommonOptions(raw, field),
    method: requireOneOf(raw.method ?? 'windowed', `${field}.method`, ['coherent', 'windowed'] as const),
    window: requireOneOf(raw.window ?? 'blackman_harris_7', `${field}.window`, ['blackman_harris_4', 'blackman_harris_7'] as const),
    thdPlusNoiseBand: resolveThdPlusNoiseBand(raw.thdPlusNoise, `${field}.thdPlusNoise`),
    minSnrDb: requireNumberInRange(raw.minSnrDb ?? 40, `${field}.minSnrDb`, 0, 200, 'dB'),
    residualPointsPerOctave: requireInteger(raw.residualPointsPerOctave ?? 24, `${field}.residualPointsPerOctave`, 1, 96),
    levelCalibration: resolveCalibration(raw.levelCalibration, `${field}.levelCalibration`),
  };
}

/** Level figures of the fundamental: dBFS always, plus dB SPL or dBV when calibrated. */
export function calibratedLevels(levelDbfs: number, calibration: LevelCalibration | null): Record<string, number> {
  if (!calibration) return {};
  if ('dbfsAtOnePascal' in calibration) {
    return { fundamentalLevelDbSpl: levelDbfs - calibration.dbfsAtOnePascal + dbSplFromPascals(1) };
  }
  return { fundamentalLevelDbv: levelDbfs - calibration.dbfsAtOneVoltRms };
}
