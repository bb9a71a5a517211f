import { EngineError } from '../errors';
import type { MagnitudeCurve } from './curve';

/**
 * Throws an EngineError unless `curve` is usable: equal lengths, at least two points, finite positive strictly
 * ascending frequencies, finite levels and phases. `field` prefixes the reported path (e.g. "curves[2]").
 */
export function validateCurve(curve: MagnitudeCurve, field = 'curve'): void {
  const { frequencyHz, magnitudeDb, phaseDeg } = curve;
  if (!(frequencyHz instanceof Float64Array) || !(magnitudeDb instanceof Float64Array)) {
    throw new EngineError('curve_arrays_invalid', 'A curve needs Float64Array frequencyHz and magnitudeDb.', { field });
  }
  if (magnitudeDb.length !== frequencyHz.length) {
    throw new EngineError(
      'curve_length_mismatch',
      `magnitudeDb has ${magnitudeDb.length} values but frequencyHz has ${frequencyHz.length}.`,
      { field: `${field}.magnitudeDb` },
    );
  }
  if (phaseDeg && phaseDeg.length !== frequencyHz.length) {
    throw new EngineError(
      'curve_length_mismatch',
      `phaseDeg has ${phaseDeg.length} values but frequencyHz has ${frequencyHz.length}.`,
      { field: `${field}.phaseDeg` },
    );
  }
  if (frequencyHz.length < 2) {
    throw new EngineError('curve_too_short', 'A curve needs at least two points.', { field: `${field}.frequencyHz` });
  }
  for (let i = 0; i < frequencyHz.length; i++) {
    const f = frequencyHz[i];
    if (!Number.isFinite(f) || f <= 0) {
      throw new EngineError('curve_frequency_invalid', `Frequency ${f} is not a finite positive number.`, {
        field: `${field}.frequencyHz[${i}]`,
      });
    }
    if (i > 0 && !(f > frequencyHz[i - 1])) {
      throw new EngineError('curve_frequency_not_ascending', 'Frequencies must be strictly ascending.', {
        field: `${field}.frequencyHz[${i}]`,
      });
    }
    if (!Number.isFinite(magnitudeDb[i])) {
      throw new EngineError('curve_level_not_finite', `Level ${magnitudeDb[i]} is not a finite number.`, {
        field: `${field}.magnitudeDb[${i}]`,
      });
    }
    if (phaseDeg && !Number.isFinite(phaseDeg[i])) {
      throw new EngineError('curve_phase_not_finite', `Phase ${phaseDeg[i]} is not a finite number.`, {
        field: `${field}.phaseDeg[${i}]`,
      });
    }
  }
}
