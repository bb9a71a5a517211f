import { EngineError } from '../errors';
import type { BandLimitsResult, MagnitudeCurve, ReferenceLevelSpec, ToleranceRangeResult } from './curve';
import { referenceLevel } from './reference-level';
import { walkOutward } from './walk-outward';

/** Default drops for band limits: the −3, −6 and −10 dB points (common practice, no source). */
export const DEFAULT_BAND_LIMIT_DROPS_DB: readonly number[] = [3, 6, 10];

export interface BandLimitsOptions {
  reference: ReferenceLevelSpec;
  /** Positive dB below the reference; default [3, 6, 10]. */
  dropsDb?: readonly number[];
  /**
   * Dips below the threshold narrower than this many octaves (exit to re-entry) are stepped over, e.g. 1/9 for
   * the IEC 60268-5 effective frequency range (from memory). Default 0: none ignored.
   */
  ignoreExcursionsNarrowerThanOctaves?: number;
}

function requireExcursionWidth(octaves: number): void {
  if (!(Number.isFinite(octaves) && octaves >= 0 && octaves <= 2)) {
    throw new EngineError('excursion_width_invalid', `Ignored excursion width must be 0–2 octaves, got ${octaves}.`, {
      field: 'ignoreExcursionsNarrowerThanOctaves',
    });
  }
}

/**
 * The −X dB points of the (smoothed) curve: walking outward from the edges of the reference band, the first
 * frequency below (above) it where the level falls under reference − X, crossings interpolated linearly in dB
 * against log f. Not reached inside the data → 'beyond_measured_range' (never the edge of the data).
 */
export function bandLimits(curve: MagnitudeCurve, options: BandLimitsOptions): BandLimitsResult {
  const reference = referenceLevel(curve, options.reference);
  const dropsDb = options.dropsDb ?? DEFAULT_BAND_LIMIT_DROPS_DB;
  const ignore = options.ignoreExcursionsNarrowerThanOctaves ?? 0;
  requireExcursionWidth(ignore);
  dropsDb.forEach((drop, i) => {
    if (!(Number.isFinite(drop) && drop > 0 && drop <= 100)) {
      throw new EngineError('band_limit_drop_invalid', `Each drop must be a positive dB value up to 100, got ${drop}.`, {
        field: `dropsDb[${i}]`,
      });
    }
  });
  const [bandFromHz, bandToHz] = reference.bandHz;
  const limits = dropsDb.map((dropDb) => {
    const thresholdDb = reference.levelDb - dropDb;
    const region = { lowDb: thresholdDb, highDb: Number.POSITIVE_INFINITY };
    return {
      dropDb,
      thresholdDb,
      lower: walkOutward(curve, { startHz: bandFromHz, direction: 'down', region, ignoreNarrowerThanOctaves: ignore }),
      upper: walkOutward(curve, { startHz: bandToHz, direction: 'up', region, ignoreNarrowerThanOctaves: ignore }),
    };
  });
  return { reference, ignoredExcursionsNarrowerThanOctaves: ignore, limits };
}

export interface ToleranceRangeOptions {
  reference: ReferenceLevelSpec;
  /** X in "±X dB from A to B". */
  toleranceDb: number;
  /** Excursions (peaks or dips) out of ±X narrower than this many octaves are stepped over. Default 0. */
  ignoreExcursionsNarrowerThanOctaves?: number;
}

/**
 * The widest "±X dB from A to B" range: the largest contiguous interval containing the reference band in which
 * |L − reference| ≤ X everywhere. If the curve leaves ±X inside the reference band, both ends are
 * 'outside_at_reference_band'. The reference is fixed (level at a frequency or band mean), not fitted.
 */
export function toleranceRange(curve: MagnitudeCurve, options: ToleranceRangeOptions): ToleranceRangeResult {
  const reference = referenceLevel(curve, options.reference);
  const { toleranceDb } = options;
  if (!(Number.isFinite(toleranceDb) && toleranceDb > 0 && toleranceDb <= 100)) {
    throw new EngineError('tolerance_invalid', `toleranceDb must be a positive dB value up to 100, got ${toleranceDb}.`, {
      field: 'toleranceDb',
    });
  }
  const ignore = options.ignoreExcursionsNarrowerThanOctaves ?? 0;
  requireExcursionWidth(ignore);
  const region = { lowDb: reference.levelDb - toleranceDb, highDb: reference.levelDb + toleranceDb };
  const [bandFromHz, bandToHz] = reference.bandHz;
  const base = { reference, toleranceDb, ignoredExcursionsNarrowerThanOctaves: ignore };
  if (bandToHz > bandFromHz) {
    const inside = walkOutward(curve, {
      startHz: bandFromHz,
      direction: 'up',
      region,
      ignoreNarrowerThanOctaves: ignore,
      untilHz: bandToHz,
    });
    if (inside.status !== 'beyond_measured_range') {
      const atHz = inside.status === 'found' ? inside.frequencyHz : inside.atHz;
      const violation = { status: 'outside_at_reference_band' as const, atHz };
      return { ...base, lower: violation, upper: violation };
    }
  }
  return {
    ...base,
    lower: walkOutward(curve, { startHz: bandFromHz, direction: 'down', region, ignoreNarrowerThanOctaves: ignore }),
    upper: walkOutward(curve, { startHz: bandToHz, direction: 'up', region, ignoreNarrowerThanOctaves: ignore }),
  };
}
