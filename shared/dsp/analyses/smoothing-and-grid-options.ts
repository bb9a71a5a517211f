import type { SmoothingOptions } from '../curves/curve';
import { EngineError } from '../errors';
import { rejectUnknownKeys, requireInteger, requireNumberInRange, requireObject, requireOneOf } from '../stimuli/parameter-checks';

/** Log-frequency grid of an analysis: null band ends mean "the analysis' own band". */
export interface ResolvedGridOptions {
  pointsPerOctave: number;
  startHz: number | null;
  stopHz: number | null;
}

/** Smoothing option shared by the analyses: none by default, else 1/N octave (N = 1…48), power averaging, Hann window. */
export function resolveSmoothingOptions(value: unknown, field: string): Required<SmoothingOptions> {
  if (value === undefined) return { octaveFraction: 'none', averaging: 'power', window: 'hann' };
  const raw = requireObject(value, field);
  rejectUnknownKeys(raw, field, ['octaveFraction', 'averaging', 'window']);
  return {
    octaveFraction: raw.octaveFraction === 'none' ? 'none' : requireInteger(raw.octaveFraction, `${field}.octaveFraction`, 1, 48),
    averaging: requireOneOf(raw.averaging ?? 'power', `${field}.averaging`, ['power', 'complex'] as const),
    window: requireOneOf(raw.window ?? 'hann', `${field}.window`, ['hann', 'rectangular'] as const),
  };
}

/** Grid option shared by the analyses: 48 points per octave by default; an undefined value takes every default. */
export function resolveGridOptions(value: unknown, field: string): ResolvedGridOptions {
  const raw = value === undefined ? {} : requireObject(value, field);
  rejectUnknownKeys(raw, field, ['pointsPerOctave', 'startHz', 'stopHz']);
  const startHz = raw.startHz === undefined ? null : requireNumberInRange(raw.startHz, `${field}.startHz`, 0.01, 1e6, 'Hz');
  const stopHz = raw.stopHz === undefined ? null : requireNumberInRange(raw.stopHz, `${field}.stopHz`, 0.01, 1e6, 'Hz');
  if (startHz !== null && stopHz !== null && !(stopHz > startHz)) {
    throw new EngineError('grid_range_invalid', `${field}.stopHz must be above ${field}.startHz.`, { field: `${field}.stopHz` });
  }
  return { pointsPerOctave: requireInteger(raw.pointsPerOctave ?? 48, `${field}.pointsPerOctave`, 1, 96), startHz, stopHz };
}
