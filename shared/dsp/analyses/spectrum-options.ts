import type { NormalisationSpec, ReferenceLevelSpec, SmoothingOptions } from '../curves/curve';
import { EngineError } from '../errors';
import type { ToleranceMask } from '../masks/mask-types';
import { validateMask } from '../masks/validate-mask';
import { rejectUnknownKeys, requireNumberInRange, requireObject, requireOneOf } from '../stimuli/parameter-checks';
import { resolveBandLimits, resolveReference, type BandLimitOptions, type NormalisationOption } from './curve-output-options';
import { toReferenceSpec } from './derived-curve-outputs';
import { resolveGridOptions, resolveSmoothingOptions, type ResolvedGridOptions } from './smoothing-and-grid-options';

/**
 * Options of the spectrum analysis (same shapes as the response analyses where they overlap), with defaults:
 * - smoothing none; grid null (keep the supplied frequencies) or { pointsPerOctave (48), startHz, stopHz };
 * - normalisation none; band limits on ([3, 6, 10] dB, ±3 dB range; reference = the normalisation reference,
 *   else 1 kHz, else the power mean over the whole curve when 1 kHz lies outside it); 1/3-octave table on;
 * - conditions (distanceMetres, driveVoltageRms, nominalImpedanceOhms) for loudspeaker sensitivity of dB SPL data;
 * - sensitivityBand 300 Hz – 3 kHz power mean (common practice, no source);
 * - mask none; maskGuardBandDb 0.
 */
export interface SpectrumAnalysisOptions {
  smoothing?: SmoothingOptions;
  grid?: { pointsPerOctave?: number; startHz?: number; stopHz?: number } | null;
  normalisation?: NormalisationOption;
  bandLimits?: BandLimitOptions | null;
  thirdOctaveTable?: boolean;
  conditions?: { distanceMetres?: number; driveVoltageRms?: number; nominalImpedanceOhms?: number };
  sensitivityBand?: { lowHz: number; highHz: number; average?: 'db' | 'power' };
  mask?: ToleranceMask | null;
  maskGuardBandDb?: number;
}

export interface ResolvedSpectrumOptions {
  smoothing: Required<SmoothingOptions>;
  grid: ResolvedGridOptions | null;
  normalisation: NormalisationSpec;
  bandLimits: {
    reference: ReferenceLevelSpec | null;
    dropsDb: number[];
    toleranceDb: number;
    ignoreExcursionsNarrowerThanOctaves: number;
  } | null;
  thirdOctaveTable: boolean;
  conditions: { distanceMetres: number | null; driveVoltageRms: number | null; nominalImpedanceOhms: number | null };
  sensitivityBand: { fromHz: number; toHz: number; average: 'db' | 'power'; stated: boolean };
  mask: ToleranceMask | null;
  maskGuardBandDb: number;
}

const KEYS = [
  'smoothing',
  'grid',
  'normalisation',
  'bandLimits',
  'thirdOctaveTable',
  'conditions',
  'sensitivityBand',
  'mask',
  'maskGuardBandDb',
] as const;

function resolveGrid(value: unknown, field: string): ResolvedSpectrumOptions['grid'] {
  if (value === undefined || value === null) return null;
  return resolveGridOptions(value, field);
}

function resolveSpectrumBandLimits(value: unknown, field: string): ResolvedSpectrumOptions['bandLimits'] {
  const bandLimits = resolveBandLimits(value, field);
  if (bandLimits === null) return null;
  return { ...bandLimits, reference: bandLimits.reference === null ? null : toReferenceSpec(bandLimits.reference) };
}

function optionalPositive(value: unknown, field: string, maximum: number, unit: string): number | null {
  if (value === undefined || value === null) return null;
  return requireNumberInRange(value, field, Number.MIN_VALUE, maximum, unit);
}

function resolveConditions(value: unknown, field: string): ResolvedSpectrumOptions['conditions'] {
  const raw = value === undefined ? {} : requireObject(value, field);
  rejectUnknownKeys(raw, field, ['distanceMetres', 'driveVoltageRms', 'nominalImpedanceOhms']);
  return {
    distanceMetres: optionalPositive(raw.distanceMetres, `${field}.distanceMetres`, 1000, 'm'),
    driveVoltageRms: optionalPositive(raw.driveVoltageRms, `${field}.driveVoltageRms`, 1000, 'V'),
    nominalImpedanceOhms: optionalPositive(raw.nominalImpedanceOhms, `${field}.nominalImpedanceOhms`, 10_000, 'Ω'),
  };
}

function resolveSensitivityBand(value: unknown, field: string): ResolvedSpectrumOptions['sensitivityBand'] {
  if (value === undefined) return { fromHz: 300, toHz: 3000, average: 'power', stated: false };
  const raw = requireObject(value, field);
  rejectUnknownKeys(raw, field, ['lowHz', 'highHz', 'average']);
  const fromHz = requireNumberInRange(raw.lowHz, `${field}.lowHz`, 0.01, 1e6, 'Hz');
  const toHz = requireNumberInRange(raw.highHz, `${field}.highHz`, 0.01, 1e6, 'Hz');
  if (!(toHz > fromHz)) throw new EngineError('band_invalid', `${field}.highHz must be above ${field}.lowHz.`, { field: `${field}.highHz` });
  return { fromHz, toHz, average: requireOneOf(raw.average ?? 'power', `${field}.average`, ['db', 'power'] as const), stated: true };
}

export function resolveSpectrumOptions(options: unknown, field = 'options'): ResolvedSpectrumOptions {
  const raw = options === undefined ? {} : requireObject(options, field);
  rejectUnknownKeys(raw, field, KEYS);
  let normalisation: NormalisationSpec = { kind: 'none' };
  if (raw.normalisation !== undefined) {
    const n = requireObject(raw.normalisation, `${field}.normalisation`);
    if (n.kind === 'none') rejectUnknownKeys(n, `${field}.normalisation`, ['kind']);
    else normalisation = toReferenceSpec(resolveReference(n, `${field}.normalisation`));
  }
  if (raw.thirdOctaveTable !== undefined && typeof raw.thirdOctaveTable !== 'boolean') {
    throw new EngineError('parameter_not_boolean', `${field}.thirdOctaveTable must be true or false.`, { field: `${field}.thirdOctaveTable` });
  }
  let mask: ToleranceMask | null = null;
  if (raw.mask !== undefined && raw.mask !== null) {
    const maskRaw = requireObject(raw.mask, `${field}.mask`);
    rejectUnknownKeys(maskRaw, `${field}.mask`, ['levelReference', 'upper', 'lower']);
    mask = maskRaw as unknown as ToleranceMask;
    validateMask(mask, `${field}.mask`);
  }
  return {
    smoothing: resolveSmoothingOptions(raw.smoothing, `${field}.smoothing`),
    grid: resolveGrid(raw.grid, `${field}.grid`),
    normalisation,
    bandLimits: resolveSpectrumBandLimits(raw.bandLimits, `${field}.bandLimits`),
    thirdOctaveTable: (raw.thirdOctaveTable as boolean | undefined) ?? true,
    conditions: resolveConditions(raw.conditions, `${field}.conditions`),
    sensitivityBand: resolveSensitivityBand(raw.sensitivityBand, `${field}.sensitivityBand`),
    mask,
    maskGuardBandDb: requireNumberInRange(raw.maskGuardBandDb ?? 0, `${field}.maskGuardBandDb`, 0, 100, 'dB'),
  };
}
