import { EngineError } from '../errors';
import {
  rejectUnknownKeys,
  requireFiniteNumber,
  requireNumberInRange,
  requireObject,
  requireOneOf,
} from '../stimuli/parameter-checks';

/**
 * Options shared by every response analysis for the derived outputs (normalisation, band limits, ±X dB range,
 * 1/3-octave table) and the magnitude reference (calibration, measurement conditions). Types, defaults and
 * validation live together; every rejection names its field path (e.g. "options.bandLimits.dropsDb[1]").
 */
export type ReferenceOption =
  | { kind: 'at_1khz' }
  | { kind: 'at_frequency'; frequencyHz: number }
  | { kind: 'band_mean'; lowHz: number; highHz: number; average?: 'db' | 'power' };

export type NormalisationOption = { kind: 'none' } | ReferenceOption;

export interface BandLimitOptions {
  /** Reference level for the limits. Default: the normalisation reference, else 1 kHz (or the power mean over the output range when 1 kHz lies outside it). */
  reference?: ReferenceOption;
  /** dB below the reference. Default [3, 6, 10]. */
  dropsDb?: number[];
  /** X in "±X dB from A to B". Default 3. */
  toleranceDb?: number;
  /** Excursions narrower than this many octaves are stepped over (e.g. 1/9). Default 0. */
  ignoreExcursionsNarrowerThanOctaves?: number;
}

export interface CalibrationOption {
  /** Level in dBFS (AES17) that 1 Pa RMS at the microphone reads in this chain, e.g. from a calibrator capture. */
  dbfsAtOnePascal: number;
}

export interface ConditionsOption {
  /** Microphone distance from the reference point, metres. */
  distanceMetres?: number;
  /** Drive voltage at the DUT terminals while the stimulus played (for the stimulus level), V RMS. */
  driveVoltageRms?: number;
  /** Air temperature, °C (sets the speed of sound). Default 20 °C. */
  temperatureCelsius?: number;
}

export interface ReferToOption {
  /** Refer the SPL to this distance by the inverse-square law (far field only). */
  distanceMetres?: number;
  /** Refer the SPL to this drive voltage (linear system assumed). */
  driveVoltageRms?: number;
}

export interface CurveOutputOptions {
  normalisation?: NormalisationOption;
  /** null to skip band limits and the ±X dB range. */
  bandLimits?: BandLimitOptions | null;
  /** Output the 1/3-octave table. Default true. */
  thirdOctaveTable?: boolean;
  calibration?: CalibrationOption | null;
  conditions?: ConditionsOption;
  referTo?: ReferToOption | null;
}

export interface ResolvedBandLimits {
  reference: ReferenceOption | null;
  dropsDb: number[];
  toleranceDb: number;
  ignoreExcursionsNarrowerThanOctaves: number;
}

export interface ResolvedCurveOutputOptions {
  normalisation: NormalisationOption;
  bandLimits: ResolvedBandLimits | null;
  thirdOctaveTable: boolean;
  calibration: CalibrationOption | null;
  conditions: { distanceMetres: number | null; driveVoltageRms: number | null; temperatureCelsius: number };
  referTo: { distanceMetres: number | null; driveVoltageRms: number | null } | null;
}

export const CURVE_OUTPUT_OPTION_KEYS = ['normalisation', 'bandLimits', 'thirdOctaveTable', 'calibration', 'conditions', 'referTo'] as const;

export function resolveReference(value: unknown, field: string): ReferenceOption {
  const raw = requireObject(value, field);
  const kind = requireOneOf(raw.kind, `${field}.kind`, ['at_1khz', 'at_frequency', 'band_mean'] as const);
  if (kind === 'at_1khz') {
    rejectUnknownKeys(raw, field, ['kind']);
    return { kind };
  }
  if (kind === 'at_frequency') {
    rejectUnknownKeys(raw, field, ['kind', 'frequencyHz']);
    return { kind, frequencyHz: requireNumberInRange(raw.frequencyHz, `${field}.frequencyHz`, 1e-3, 1e6, 'Hz') };
  }
  rejectUnknownKeys(raw, field, ['kind', 'lowHz', 'highHz', 'average']);
  const lowHz = requireNumberInRange(raw.lowHz, `${field}.lowHz`, 1e-3, 1e6, 'Hz');
  const highHz = requireNumberInRange(raw.highHz, `${field}.highHz`, 1e-3, 1e6, 'Hz');
  if (!(highHz > lowHz)) {
    throw new EngineError('band_invalid', `${field}.highHz must be above ${field}.lowHz.`, { field: `${field}.highHz` });
  }
  const average = requireOneOf(raw.average ?? 'power', `${field}.average`, ['db', 'power'] as const);
  return { kind, lowHz, highHz, average };
}

function resolveNormalisation(value: unknown, field: string): NormalisationOption {
  if (value === undefined) return { kind: 'none' };
  const raw = requireObject(value, field);
  if (raw.kind === 'none') {
    rejectUnknownKeys(raw, field, ['kind']);
    return { kind: 'none' };
  }
  return resolveReference(raw, field);
}

/** Band limits (default on: [3, 6, 10] dB drops, ±3 dB range); null turns them off. */
export function resolveBandLimits(value: unknown, field: string): ResolvedBandLimits | null {
  if (value === null) return null;
  const raw = value === undefined ? {} : requireObject(value, field);
  rejectUnknownKeys(raw, field, ['reference', 'dropsDb', 'toleranceDb', 'ignoreExcursionsNarrowerThanOctaves']);
  let dropsDb = [3, 6, 10];
  if (raw.dropsDb !== undefined) {
    if (!Array.isArray(raw.dropsDb) || raw.dropsDb.length === 0 || raw.dropsDb.length > 10) {
      throw new EngineError('band_limit_drops_invalid', `${field}.dropsDb must be a list of 1 to 10 dB values.`, { field: `${field}.dropsDb` });
    }
    dropsDb = raw.dropsDb.map((drop, i) => requireNumberInRange(drop, `${field}.dropsDb[${i}]`, 0.01, 100, 'dB'));
  }
  return {
    reference: raw.reference === undefined ? null : resolveReference(raw.reference, `${field}.reference`),
    dropsDb,
    toleranceDb: requireNumberInRange(raw.toleranceDb ?? 3, `${field}.toleranceDb`, 0.01, 100, 'dB'),
    ignoreExcursionsNarrowerThanOctaves: requireNumberInRange(
      raw.ignoreExcursionsNarrowerThanOctaves ?? 0,
      `${field}.ignoreExcursionsNarrowerThanOctaves`,
      0,
      2,
      'octaves',
    ),
  };
}

function optionalPositive(value: unknown, field: string, maximum: number, unit: string): number | null {
  if (value === undefined || value === null) return null;
  const n = requireFiniteNumber(value, field);
  if (!(n > 0) || n > maximum) {
    throw new EngineError('parameter_out_of_range', `${field} must be above 0 and at most ${maximum} ${unit}, got ${n}.`, { field });
  }
  return n;
}

export function resolveCurveOutputOptions(raw: Record<string, unknown>, field: string): ResolvedCurveOutputOptions {
  let calibration: CalibrationOption | null = null;
  if (raw.calibration !== undefined && raw.calibration !== null) {
    const c = requireObject(raw.calibration, `${field}.calibration`);
    rejectUnknownKeys(c, `${field}.calibration`, ['dbfsAtOnePascal']);
    calibration = { dbfsAtOnePascal: requireNumberInRange(c.dbfsAtOnePascal, `${field}.calibration.dbfsAtOnePascal`, -200, 50, 'dBFS') };
  }
  const conditionsRaw = raw.conditions === undefined ? {} : requireObject(raw.conditions, `${field}.conditions`);
  rejectUnknownKeys(conditionsRaw, `${field}.conditions`, ['distanceMetres', 'driveVoltageRms', 'temperatureCelsius']);
  const conditions = {
    distanceMetres: optionalPositive(conditionsRaw.distanceMetres, `${field}.conditions.distanceMetres`, 1000, 'm'),
    driveVoltageRms: optionalPositive(conditionsRaw.driveVoltageRms, `${field}.conditions.driveVoltageRms`, 1000, 'V'),
    temperatureCelsius: requireNumberInRange(conditionsRaw.temperatureCelsius ?? 20, `${field}.conditions.temperatureCelsius`, -50, 60, '°C'),
  };
  let referTo: ResolvedCurveOutputOptions['referTo'] = null;
  if (raw.referTo !== undefined && raw.referTo !== null) {
    const r = requireObject(raw.referTo, `${field}.referTo`);
    rejectUnknownKeys(r, `${field}.referTo`, ['distanceMetres', 'driveVoltageRms']);
    referTo = {
      distanceMetres: optionalPositive(r.distanceMetres, `${field}.referTo.distanceMetres`, 1000, 'm'),
      driveVoltageRms: optionalPositive(r.driveVoltageRms, `${field}.referTo.driveVoltageRms`, 1000, 'V'),
    };
    if (!calibration) {
      throw new EngineError('refer_to_needs_calibration', `${field}.referTo needs ${field}.calibration (an absolute SPL to refer).`, {
        field: `${field}.referTo`,
      });
    }
    if (referTo.distanceMetres !== null && conditions.distanceMetres === null) {
      throw new EngineError('refer_to_needs_distance', `${field}.referTo.distanceMetres needs ${field}.conditions.distanceMetres.`, {
        field: `${field}.conditions.distanceMetres`,
      });
    }
    if (referTo.driveVoltageRms !== null && conditions.driveVoltageRms === null) {
      throw new EngineError('refer_to_needs_voltage', `${field}.referTo.driveVoltageRms needs ${field}.conditions.driveVoltageRms.`, {
        field: `${field}.conditions.driveVoltageRms`,
      });
    }
  }
  if (raw.thirdOctaveTable !== undefined && typeof raw.thirdOctaveTable !== 'boolean') {
    throw new EngineError('parameter_not_boolean', `${field}.thirdOctaveTable must be true or false.`, { field: `${field}.thirdOctaveTable` });
  }
  return {
    normalisation: resolveNormalisation(raw.normalisation, `${field}.normalisation`),
    bandLimits: resolveBandLimits(raw.bandLimits, `${field}.bandLimits`),
    thirdOctaveTable: (raw.thirdOctaveTable as boolean | undefined) ?? true,
    calibration,
    conditions,
    referTo,
  };
}
