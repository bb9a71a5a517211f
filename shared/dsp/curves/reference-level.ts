import { EngineError } from '../errors';
import type { BandAverage, MagnitudeCurve, NormalisationSpec, ReferenceLevel, ReferenceLevelSpec } from './curve';
import { curveLinearIntegral, curvePowerIntegral } from './integrands';
import { levelAtFrequencyDb } from './interpolate';
import { validateCurve } from './validate-curve';

function formatHz(frequencyHz: number): string {
  return `${Number(frequencyHz.toPrecision(6))} Hz`;
}

/**
 * Mean level of the curve over [fromHz, toHz], weighted uniformly in log frequency (every octave counts the same),
 * of the curve's interpolant (dB linear in log f): 'db' averages the dB values, 'power' is 10·log10 of the mean
 * of 10^(L/10). The power mean is never below the dB mean and weighs peaks more; they agree on a flat curve.
 */
export function bandMeanLevelDb(
  curve: MagnitudeCurve,
  fromHz: number,
  toHz: number,
  average: BandAverage,
  field = 'band',
): number {
  const first = curve.frequencyHz[0];
  const last = curve.frequencyHz[curve.frequencyHz.length - 1];
  if (!(Number.isFinite(fromHz) && Number.isFinite(toHz) && fromHz < toHz)) {
    throw new EngineError('band_invalid', `A band needs finite fromHz < toHz, got ${fromHz}–${toHz} Hz.`, { field });
  }
  if (fromHz < first || toHz > last) {
    throw new EngineError('band_outside_curve', `Band ${fromHz}–${toHz} Hz reaches outside the curve (${first}–${last} Hz).`, {
      field,
      details: { fromHz, toHz, curveFromHz: first, curveToHz: last },
    });
  }
  if (average !== 'db' && average !== 'power') {
    throw new EngineError('band_average_invalid', `Band average must be 'db' or 'power'.`, { field: `${field}.average` });
  }
  const widthLn = Math.log(toHz / fromHz);
  if (average === 'db') return curveLinearIntegral(curve.frequencyHz, curve.magnitudeDb).integrate(fromHz, toHz) / widthLn;
  const meanPower = curvePowerIntegral(curve.frequencyHz, curve.magnitudeDb).integrate(fromHz, toHz) / widthLn;
  return 10 * Math.log10(meanPower);
}

/** The reference level a spec asks for, with its band and a plain-words description. */
export function referenceLevel(curve: MagnitudeCurve, spec: ReferenceLevelSpec, field = 'reference'): ReferenceLevel {
  validateCurve(curve);
  if (spec.kind === 'at_frequency') {
    const levelDb = levelAtFrequencyDb(curve, spec.frequencyHz, `${field}.frequencyHz`);
    return {
      levelDb,
      bandHz: [spec.frequencyHz, spec.frequencyHz],
      description: `level at ${formatHz(spec.frequencyHz)} (interpolated linearly in dB against log frequency)`,
    };
  }
  if (spec.kind === 'band_mean') {
    const levelDb = bandMeanLevelDb(curve, spec.fromHz, spec.toHz, spec.average, field);
    const what = spec.average === 'db' ? 'mean of dB values' : 'power mean (10·log10 of the mean of 10^(L/10))';
    return {
      levelDb,
      bandHz: [spec.fromHz, spec.toHz],
      description: `${what} over ${formatHz(spec.fromHz)}–${formatHz(spec.toHz)}, uniform in log frequency`,
    };
  }
  throw new EngineError('reference_kind_invalid', `Reference must be 'at_frequency' or 'band_mean'.`, { field: `${field}.kind` });
}

/** The curve minus its reference level (phase untouched), with the reference used and a description. */
export function normaliseCurve(
  curve: MagnitudeCurve,
  spec: NormalisationSpec,
  field = 'normalisation',
): { curve: MagnitudeCurve; reference: ReferenceLevel | null; description: string } {
  if (spec.kind === 'none') return { curve, reference: null, description: 'none' };
  const reference = referenceLevel(curve, spec, field);
  const magnitudeDb = curve.magnitudeDb.map((level) => level - reference.levelDb);
  const normalised: MagnitudeCurve = curve.phaseDeg
    ? { frequencyHz: curve.frequencyHz, magnitudeDb, phaseDeg: curve.phaseDeg }
    : { frequencyHz: curve.frequencyHz, magnitudeDb };
  return {
    curve: normalised,
    reference,
    description: `relative to the ${reference.description} = ${Number(reference.levelDb.toFixed(4))} dB`,
  };
}
