import { EngineError } from '../errors';
import type { MagnitudeCurve } from '../curves/curve';

/** Stated reference of a supplied spectrum's magnitude values. */
export type SpectrumMagnitudeReference = 'db_spl' | 'dbv' | 'dbu' | 'dbfs' | 'db_relative';

export const SPECTRUM_MAGNITUDE_REFERENCES: readonly SpectrumMagnitudeReference[] = ['db_spl', 'dbv', 'dbu', 'dbfs', 'db_relative'];

/** A measured spectrum from elsewhere (another instrument, a simulation, a datasheet). */
export interface SpectrumInput {
  /** Strictly ascending, 0 < f ≤ 1 MHz. */
  frequenciesHz: ArrayLike<number>;
  /** Levels in the stated reference, within ±400 dB. */
  magnitudeDb: ArrayLike<number>;
  magnitudeReference: SpectrumMagnitudeReference;
  /** Optional phase in degrees (any unwrapping), finite. */
  phaseDeg?: ArrayLike<number>;
}

export const SPECTRUM_MIN_POINTS = 3;
export const SPECTRUM_MAX_POINTS = 1_048_577;
export const SPECTRUM_MAX_FREQUENCY_HZ = 1e6;
export const SPECTRUM_MAX_ABS_LEVEL_DB = 400;

export function describeMagnitudeReference(reference: SpectrumMagnitudeReference): string {
  switch (reference) {
    case 'db_spl':
      return 'dB SPL re 20 µPa (as supplied)';
    case 'dbv':
      return 'dBV, dB re 1 V RMS (as supplied)';
    case 'dbu':
      return 'dBu, dB re 0.7746 V RMS (as supplied)';
    case 'dbfs':
      return 'dBFS (as supplied; the source instrument’s full-scale convention applies)';
    case 'db_relative':
      return 'dB relative to an unstated reference (as supplied)';
  }
}

function isArrayOfNumbersLike(value: unknown): value is ArrayLike<number> {
  return Array.isArray(value) || value instanceof Float64Array || value instanceof Float32Array;
}

function requireArray(value: unknown, field: string): ArrayLike<number> {
  if (!isArrayOfNumbersLike(value)) {
    throw new EngineError('spectrum_array_missing', `${field} must be an array of numbers.`, { field });
  }
  return value;
}

/**
 * Validate a supplied spectrum and turn it into a curve. Every problem gets its own code and the path of the
 * first offending value (e.g. "spectrum.frequenciesHz[4]").
 */
export function spectrumInputToCurve(input: SpectrumInput, field = 'spectrum'): MagnitudeCurve {
  if (typeof input !== 'object' || input === null) {
    throw new EngineError('spectrum_missing', `${field} must be an object.`, { field });
  }
  if (!SPECTRUM_MAGNITUDE_REFERENCES.includes(input.magnitudeReference)) {
    throw new EngineError(
      'spectrum_reference_invalid',
      `${field}.magnitudeReference must be one of ${SPECTRUM_MAGNITUDE_REFERENCES.join(', ')}.`,
      { field: `${field}.magnitudeReference` },
    );
  }
  const frequencies = requireArray(input.frequenciesHz, `${field}.frequenciesHz`);
  const magnitudes = requireArray(input.magnitudeDb, `${field}.magnitudeDb`);
  const phases = input.phaseDeg === undefined ? undefined : requireArray(input.phaseDeg, `${field}.phaseDeg`);
  const count = frequencies.length;
  if (count < SPECTRUM_MIN_POINTS) {
    throw new EngineError('spectrum_too_short', `${field} needs at least ${SPECTRUM_MIN_POINTS} points, got ${count}.`, {
      field: `${field}.frequenciesHz`,
    });
  }
  if (count > SPECTRUM_MAX_POINTS) {
    throw new EngineError('spectrum_too_long', `${field} may have at most ${SPECTRUM_MAX_POINTS} points, got ${count}.`, {
      field: `${field}.frequenciesHz`,
    });
  }
  if (magnitudes.length !== count) {
    throw new EngineError('spectrum_length_mismatch', `${field}.magnitudeDb has ${magnitudes.length} values for ${count} frequencies.`, {
      field: `${field}.magnitudeDb`,
    });
  }
  if (phases && phases.length !== count) {
    throw new EngineError('spectrum_length_mismatch', `${field}.phaseDeg has ${phases.length} values for ${count} frequencies.`, {
      field: `${field}.phaseDeg`,
    });
  }
  const frequencyHz = new Float64Array(count);
  const magnitudeDb = new Float64Array(count);
  const phaseDeg = phases ? new Float64Array(count) : undefined;
  for (let i = 0; i < count; i++) {
    const f = frequencies[i];
    if (typeof f !== 'number' || !Number.isFinite(f)) {
      throw new EngineError('spectrum_frequency_not_finite', `Frequency ${String(f)} is not a finite number.`, {
        field: `${field}.frequenciesHz[${i}]`,
      });
    }
    if (f <= 0 || f > SPECTRUM_MAX_FREQUENCY_HZ) {
      throw new EngineError('spectrum_frequency_out_of_range', `Frequency ${f} Hz is outside 0 < f ≤ 1 MHz.`, {
        field: `${field}.frequenciesHz[${i}]`,
      });
    }
    if (i > 0 && !(f > frequencyHz[i - 1])) {
      throw new EngineError('spectrum_frequency_not_ascending', `Frequencies must be strictly ascending (${frequencyHz[i - 1]} then ${f} Hz).`, {
        field: `${field}.frequenciesHz[${i}]`,
      });
    }
    const level = magnitudes[i];
    if (typeof level !== 'number' || !Number.isFinite(level)) {
      throw new EngineError('spectrum_magnitude_not_finite', `Magnitude ${String(level)} is not a finite number.`, {
        field: `${field}.magnitudeDb[${i}]`,
      });
    }
    if (Math.abs(level) > SPECTRUM_MAX_ABS_LEVEL_DB) {
      throw new EngineError('spectrum_magnitude_out_of_range', `Magnitude ${level} dB is outside ±${SPECTRUM_MAX_ABS_LEVEL_DB} dB.`, {
        field: `${field}.magnitudeDb[${i}]`,
      });
    }
    frequencyHz[i] = f;
    magnitudeDb[i] = level;
    if (phases && phaseDeg) {
      const phase = phases[i];
      if (typeof phase !== 'number' || !Number.isFinite(phase)) {
        throw new EngineError('spectrum_phase_not_finite', `Phase ${String(phase)} is not a finite number.`, {
          field: `${field}.phaseDeg[${i}]`,
        });
      }
      phaseDeg[i] = phase;
    }
  }
  return phaseDeg ? { frequencyHz, magnitudeDb, phaseDeg } : { frequencyHz, magnitudeDb };
}
