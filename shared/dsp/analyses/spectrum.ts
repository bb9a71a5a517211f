import type { MagnitudeCurve, ReferenceLevel, ReferenceLevelSpec } from '../curves/curve';
import { bandLimits, toleranceRange } from '../curves/band-limits';
import { describeLogGrid, gridNominalLabels, logFrequencyGrid } from '../curves/grid';
import { gridInsideCurve, levelAtFrequencyDb } from '../curves/interpolate';
import { normaliseCurve } from '../curves/reference-level';
import { smoothCurve } from '../curves/smoothing';
import { describeSmoothing } from '../curves/smoothing-options';
import { thirdOctaveBandValues } from '../curves/third-octave';
import { EngineError } from '../errors';
import { evaluateMask } from '../masks/evaluate-mask';
import type { MaskVerdict } from '../masks/mask-types';
import { ENGINE_VERSION } from '../result/engine-version';
import type { Conventions } from '../result/types';
import { warning, type EngineWarning } from '../result/warnings';
import { describeMagnitudeReference, spectrumInputToCurve, type SpectrumInput } from './spectrum-input';
import { resolveSpectrumOptions, type ResolvedSpectrumOptions, type SpectrumAnalysisOptions } from './spectrum-options';
import { spectrumSensitivity } from './spectrum-sensitivity';
import type { SpectrumFigures, SpectrumResult } from './spectrum-types';

export type { SpectrumInput, SpectrumMagnitudeReference } from './spectrum-input';
export type { SpectrumAnalysisOptions } from './spectrum-options';
export type { SpectrumCurves, SpectrumFigures, SpectrumResult } from './spectrum-types';

/**
 * Derived figures for a spectrum measured elsewhere: optional smoothing onto an optional log grid,
 * normalisation, band limits and the ±X dB range, the 1/3-octave table, loudspeaker sensitivity (dB SPL data
 * with stated distance and drive) and a mask verdict. Same inputs and options give the same numbers bit for bit.
 */
export function analyzeSpectrum(input: SpectrumInput, options?: SpectrumAnalysisOptions): SpectrumResult {
  const supplied = spectrumInputToCurve(input, 'spectrum');
  const resolved = resolveSpectrumOptions(options, 'options');
  if (resolved.smoothing.averaging === 'complex' && resolved.smoothing.octaveFraction !== 'none' && !supplied.phaseDeg) {
    throw new EngineError('phase_required', 'Complex smoothing needs spectrum.phaseDeg.', { field: 'spectrum.phaseDeg' });
  }
  const gridHz = outputGrid(supplied, resolved);
  const output = smoothCurve(supplied, resolved.smoothing, gridHz);
  const normalised = normaliseCurve(output, resolved.normalisation, 'options.normalisation');
  const warnings: EngineWarning[] = [];

  const limits = resolved.bandLimits ? computeBandLimits(output, resolved, warnings) : null;
  const sensitivity = input.magnitudeReference === 'db_spl' ? spectrumSensitivity(output, resolved) : null;
  if (sensitivity && sensitivity.distanceCorrectionDb !== 0) {
    warnings.push(warning('far_field_assumption', 'The level was referred to 1 m by the inverse-square law, valid only in the far field.'));
  }
  const mask = resolved.mask ? checkMask(output, resolved, normalised.reference, warnings) : null;
  const last = output.frequencyHz.length - 1;
  const oneKilohertzInside = output.frequencyHz[0] <= 1000 && output.frequencyHz[last] >= 1000;

  const conventions: Conventions = {
    magnitudeReference: describeMagnitudeReference(input.magnitudeReference),
    smoothing: describeSmoothing(resolved.smoothing),
    grid: resolved.grid ? describeLogGrid(gridOptions(supplied, resolved)) + ', inside the supplied span' : 'the supplied frequencies',
    interpolation: 'linear in dB (and phase in degrees) against log frequency between points; no extrapolation',
    normalisation: normalised.description,
  };
  if (limits) conventions.bandLimits = limits.description;
  if (resolved.thirdOctaveTable) {
    conventions.thirdOctave =
      'IEC 61260-1 base-10 exact centres and edges, ISO 266 labels; band level = power mean over the band edges, uniform in log frequency, of the supplied spectrum; centre level = the supplied spectrum at the exact centre';
  }
  if (input.magnitudeReference === 'db_spl') {
    conventions.sensitivity = sensitivity?.description ?? 'not computed: options.conditions needs distanceMetres and driveVoltageRms';
  }
  if (mask) conventions.mask = mask.description;
  if (output.phaseDeg) {
    conventions.phase =
      resolved.smoothing.octaveFraction === 'none'
        ? 'the supplied phase, read linearly against log frequency'
        : 'phase of the complex-smoothed response, wrapped to (−180°, 180°]';
  }

  return {
    kind: 'spectrum',
    engineVersion: ENGINE_VERSION,
    conventions,
    figures: {
      pointCount: output.frequencyHz.length,
      fromHz: output.frequencyHz[0],
      toHz: output.frequencyHz[last],
      referenceLevelDb: normalised.reference?.levelDb ?? null,
      levelAtOneKilohertzDb: oneKilohertzInside ? levelAtFrequencyDb(output, 1000) : null,
      bandLimits: limits?.figures ?? null,
      sensitivity,
      mask,
    },
    curves: {
      response: {
        frequencyHz: Array.from(output.frequencyHz),
        nominalLabel: gridNominalLabels(output.frequencyHz),
        magnitudeDb: Array.from(output.magnitudeDb),
        relativeMagnitudeDb: normalised.reference ? Array.from(normalised.curve.magnitudeDb) : null,
        phaseDeg: output.phaseDeg ? Array.from(output.phaseDeg) : null,
      },
      thirdOctave: resolved.thirdOctaveTable ? thirdOctaveBandValues(supplied) : null,
    },
    warnings,
  };
}

function gridOptions(curve: MagnitudeCurve, resolved: ResolvedSpectrumOptions) {
  const grid = resolved.grid!;
  return {
    pointsPerOctave: grid.pointsPerOctave,
    startHz: grid.startHz ?? curve.frequencyHz[0],
    stopHz: grid.stopHz ?? curve.frequencyHz[curve.frequencyHz.length - 1],
  };
}

function outputGrid(curve: MagnitudeCurve, resolved: ResolvedSpectrumOptions): Float64Array {
  if (!resolved.grid) return curve.frequencyHz;
  const grid = gridInsideCurve(curve, logFrequencyGrid(gridOptions(curve, resolved)));
  if (grid.length < 2) {
    throw new EngineError('grid_outside_spectrum', 'Fewer than two grid points fall inside the supplied spectrum.', { field: 'options.grid' });
  }
  return grid;
}

function defaultReference(curve: MagnitudeCurve): ReferenceLevelSpec {
  const first = curve.frequencyHz[0];
  const last = curve.frequencyHz[curve.frequencyHz.length - 1];
  if (first <= 1000 && last >= 1000) return { kind: 'at_frequency', frequencyHz: 1000 };
  return { kind: 'band_mean', fromHz: first, toHz: last, average: 'power' };
}

function computeBandLimits(
  curve: MagnitudeCurve,
  resolved: ResolvedSpectrumOptions,
  warnings: EngineWarning[],
): { figures: NonNullable<SpectrumFigures['bandLimits']>; description: string } {
  const settings = resolved.bandLimits!;
  const spec: ReferenceLevelSpec =
    settings.reference ?? (resolved.normalisation.kind !== 'none' ? resolved.normalisation : defaultReference(curve));
  const ignore = settings.ignoreExcursionsNarrowerThanOctaves;
  const drops = bandLimits(curve, { reference: spec, dropsDb: settings.dropsDb, ignoreExcursionsNarrowerThanOctaves: ignore });
  const range = toleranceRange(curve, { reference: spec, toleranceDb: settings.toleranceDb, ignoreExcursionsNarrowerThanOctaves: ignore });
  const ends = [...drops.limits.flatMap((l) => [l.lower, l.upper]), range.lower, range.upper];
  if (ends.some((end) => end.status === 'beyond_measured_range')) {
    warnings.push(warning('band_limit_beyond_range', 'At least one band limit is not reached inside the supplied frequencies.'));
  }
  return {
    figures: {
      referenceLevelDb: drops.reference.levelDb,
      limits: drops.limits,
      toleranceRange: { toleranceDb: range.toleranceDb, lower: range.lower, upper: range.upper },
    },
    description:
      `reference = ${drops.reference.description}; limits walk outward from the reference band on the output curve, ` +
      `crossings interpolated linearly in dB against log frequency; ` +
      (ignore > 0 ? `excursions narrower than ${ignore} octave ignored; ` : 'no excursions ignored; ') +
      `'beyond_measured_range' when not reached inside the data; ±${range.toleranceDb} dB range = largest interval containing the reference band`,
  };
}

function checkMask(
  curve: MagnitudeCurve,
  resolved: ResolvedSpectrumOptions,
  reference: ReferenceLevel | null,
  warnings: EngineWarning[],
): MaskVerdict {
  const mask = resolved.mask!;
  if (mask.levelReference === 'relative' && !reference) {
    throw new EngineError('mask_needs_normalisation', 'A relative mask needs options.normalisation to set the reference level.', {
      field: 'options.mask.levelReference',
    });
  }
  const verdict = evaluateMask(curve, mask, { referenceLevelDb: reference?.levelDb, guardBandDb: resolved.maskGuardBandDb });
  if (verdict.verdict === 'incomplete') {
    warnings.push(warning('mask_partial_coverage', 'The curve does not cover the whole mask span; only the overlap was checked.'));
  }
  return verdict;
}
