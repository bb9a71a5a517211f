import {
  bandLimits,
  normaliseCurve,
  thirdOctaveBandValues,
  toleranceRange,
  type BandLimitsResult,
  type LimitPoint,
  type MagnitudeCurve,
  type ReferenceLevelSpec,
  type ThirdOctaveBandValue,
  type ToleranceRangeResult,
} from '../curves';
import { warning, type EngineWarning } from '../result/warnings';
import type { ReferenceOption, ResolvedCurveOutputOptions } from './curve-output-options';

/**
 * Normalisation, band limits (−X dB points), the widest ±X dB range and the 1/3-octave table of a response curve
 * whose dB already carry their final reference. Band limits are taken on the normalised curve.
 */
export interface DerivedCurveOutputs {
  curve: MagnitudeCurve;
  normalisationDescription: string;
  normalisationReferenceLevelDb: number | null;
  bandLimits: BandLimitsResult | null;
  toleranceRange: ToleranceRangeResult | null;
  thirdOctave: ThirdOctaveBandValue[] | null;
  warnings: EngineWarning[];
}

export function toReferenceSpec(option: ReferenceOption): ReferenceLevelSpec {
  if (option.kind === 'at_1khz') return { kind: 'at_frequency', frequencyHz: 1000 };
  if (option.kind === 'at_frequency') return { kind: 'at_frequency', frequencyHz: option.frequencyHz };
  return { kind: 'band_mean', fromHz: option.lowHz, toHz: option.highHz, average: option.average ?? 'power' };
}

function defaultReference(curve: MagnitudeCurve): ReferenceLevelSpec {
  const first = curve.frequencyHz[0];
  const last = curve.frequencyHz[curve.frequencyHz.length - 1];
  if (first <= 1000 && last >= 1000) return { kind: 'at_frequency', frequencyHz: 1000 };
  return { kind: 'band_mean', fromHz: first, toHz: last, average: 'power' };
}

function beyond(point: LimitPoint): boolean {
  return point.status === 'beyond_measured_range';
}

export function deriveCurveOutputs(curve: MagnitudeCurve, options: ResolvedCurveOutputOptions, field: string): DerivedCurveOutputs {
  const warnings: EngineWarning[] = [];
  const normalisation =
    options.normalisation.kind === 'none' ? { kind: 'none' as const } : toReferenceSpec(options.normalisation);
  const normalised = normaliseCurve(curve, normalisation, `${field}.normalisation`);
  let limits: BandLimitsResult | null = null;
  let tolerance: ToleranceRangeResult | null = null;
  if (options.bandLimits && curve.frequencyHz.length >= 2) {
    const reference = options.bandLimits.reference
      ? toReferenceSpec(options.bandLimits.reference)
      : normalisation.kind !== 'none'
        ? normalisation
        : defaultReference(curve);
    limits = bandLimits(normalised.curve, {
      reference,
      dropsDb: options.bandLimits.dropsDb,
      ignoreExcursionsNarrowerThanOctaves: options.bandLimits.ignoreExcursionsNarrowerThanOctaves,
    });
    tolerance = toleranceRange(normalised.curve, {
      reference,
      toleranceDb: options.bandLimits.toleranceDb,
      ignoreExcursionsNarrowerThanOctaves: options.bandLimits.ignoreExcursionsNarrowerThanOctaves,
    });
    const unreached = limits.limits.filter((limit) => beyond(limit.lower) || beyond(limit.upper)).map((limit) => limit.dropDb);
    if (unreached.length > 0) {
      warnings.push(
        warning('band_limit_beyond_range', `The −${unreached.join('/−')} dB point(s) lie beyond the measured range on at least one side.`, {
          dropsDb: unreached.join(','),
        }),
      );
    }
  }
  const first = curve.frequencyHz[0];
  const last = curve.frequencyHz[curve.frequencyHz.length - 1];
  const thirdOctave =
    options.thirdOctaveTable && curve.frequencyHz.length >= 2
      ? thirdOctaveBandValues(normalised.curve, { startHz: first, stopHz: last })
      : null;
  return {
    curve: normalised.curve,
    normalisationDescription: normalised.description,
    normalisationReferenceLevelDb: normalised.reference ? normalised.reference.levelDb : null,
    bandLimits: limits,
    toleranceRange: tolerance,
    thirdOctave,
    warnings,
  };
}
