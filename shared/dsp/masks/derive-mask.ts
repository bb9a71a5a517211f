import { EngineError } from '../errors';
import type { MagnitudeCurve, ReferenceLevelSpec } from '../curves/curve';
import { curveLinearIntegral } from '../curves/integrands';
import { resampleCurve } from '../curves/interpolate';
import { normaliseCurve } from '../curves/reference-level';
import { logFrequencyWindow, windowedMeans } from '../curves/smoothing-window';
import { validateCurve } from '../curves/validate-curve';
import { warning, type EngineWarning } from '../result/warnings';
import type { ToleranceMask } from './mask-types';

export interface DeriveMaskOptions {
  /** Coverage factor k in mean ± k·σ (> 0, e.g. 3). */
  coverageFactor: number;
  /** Smallest half-width of the mask in dB (default 1): limits are at least this far from the mean. */
  minHalfWidthDb?: number;
  /** Common grid; default: the curves' shared frequencies, or the first curve's points inside every curve's span. */
  gridHz?: Float64Array;
  /** Normalise each golden curve to its own reference first; the mask is then 'relative'. Default: absolute. */
  normalisation?: ReferenceLevelSpec;
  /** Smooth k·σ over 1/N octave (rectangular mean in log f) before applying the minimum half-width. */
  halfWidthSmoothingOctaveFraction?: number;
}

export interface DerivedMask {
  mask: ToleranceMask;
  frequencyHz: Float64Array;
  meanDb: Float64Array;
  /** Sample standard deviation (n − 1 in the denominator) of the dB values at each frequency. */
  standardDeviationDb: Float64Array;
  halfWidthDb: Float64Array;
  curveCount: number;
  description: string;
  warnings: EngineWarning[];
}

/**
 * Mask from golden units: at each grid frequency the mean of the curves' dB values ± max(k·σ, minimum
 * half-width), σ the sample standard deviation (n − 1). Needs at least 2 curves; fewer than 3 gives a warning,
 * since σ from two units is a poor estimate (common practice, no source).
 */
export function deriveMaskFromGolden(curves: MagnitudeCurve[], options: DeriveMaskOptions): DerivedMask {
  if (!Array.isArray(curves) || curves.length < 2) {
    throw new EngineError('golden_curves_too_few', 'Deriving a mask needs at least two golden curves.', { field: 'curves' });
  }
  curves.forEach((curve, i) => validateCurve(curve, `curves[${i}]`));
  const { coverageFactor } = options;
  const minHalfWidthDb = options.minHalfWidthDb ?? 1;
  if (!(Number.isFinite(coverageFactor) && coverageFactor > 0 && coverageFactor <= 10)) {
    throw new EngineError('coverage_factor_invalid', `coverageFactor must be in (0, 10], got ${coverageFactor}.`, { field: 'coverageFactor' });
  }
  if (!(Number.isFinite(minHalfWidthDb) && minHalfWidthDb >= 0 && minHalfWidthDb <= 100)) {
    throw new EngineError('min_half_width_invalid', `minHalfWidthDb must be 0–100 dB, got ${minHalfWidthDb}.`, { field: 'minHalfWidthDb' });
  }
  const smoothingFraction = options.halfWidthSmoothingOctaveFraction;
  if (smoothingFraction !== undefined && !(Number.isInteger(smoothingFraction) && smoothingFraction >= 1 && smoothingFraction <= 48)) {
    throw new EngineError('smoothing_fraction_invalid', 'halfWidthSmoothingOctaveFraction must be an integer 1–48.', {
      field: 'halfWidthSmoothingOctaveFraction',
    });
  }

  const normalised = curves.map((curve, i) =>
    options.normalisation ? normaliseCurve(curve, options.normalisation, `curves[${i}].normalisation`).curve : curve,
  );
  const gridHz = options.gridHz ?? commonGrid(normalised);
  const levels = normalised.map((curve) => resampleCurve(curve, gridHz).magnitudeDb);

  const count = levels.length;
  const meanDb = new Float64Array(gridHz.length);
  const standardDeviationDb = new Float64Array(gridHz.length);
  for (let j = 0; j < gridHz.length; j++) {
    let sum = 0;
    for (const curveLevels of levels) sum += curveLevels[j];
    const mean = sum / count;
    let squares = 0;
    for (const curveLevels of levels) squares += (curveLevels[j] - mean) ** 2;
    meanDb[j] = mean;
    standardDeviationDb[j] = Math.sqrt(squares / (count - 1));
  }
  let spreadDb: Float64Array = standardDeviationDb.map((sigma) => coverageFactor * sigma);
  if (smoothingFraction !== undefined && gridHz.length >= 2) spreadDb = smoothSpread(gridHz, spreadDb, smoothingFraction);
  const halfWidthDb = spreadDb.map((spread) => Math.max(spread, minHalfWidthDb));

  const mask: ToleranceMask = {
    levelReference: options.normalisation ? 'relative' : 'absolute',
    upper: Array.from(gridHz, (frequencyHz, j) => ({ frequencyHz, levelDb: meanDb[j] + halfWidthDb[j] })),
    lower: Array.from(gridHz, (frequencyHz, j) => ({ frequencyHz, levelDb: meanDb[j] - halfWidthDb[j] })),
  };
  const warnings =
    count < 3
      ? [warning('few_golden_curves', `Only ${count} golden curves: the standard deviation is a poor estimate; use 3 or more.`, { curveCount: count })]
      : [];
  const smoothingText = smoothingFraction ? `, k·σ smoothed over 1/${smoothingFraction} octave (rectangular, log f)` : '';
  return {
    mask,
    frequencyHz: Float64Array.from(gridHz),
    meanDb,
    standardDeviationDb,
    halfWidthDb,
    curveCount: count,
    description:
      `derived from ${count} golden curves: mean of dB ± max(${coverageFactor}·σ, ${minHalfWidthDb} dB), ` +
      `σ = sample standard deviation (n − 1)${smoothingText}; ` +
      (options.normalisation ? 'each curve normalised to its own reference first (relative mask)' : 'absolute levels'),
    warnings,
  };
}

function sameFrequencies(a: Float64Array, b: Float64Array): boolean {
  return a.length === b.length && a.every((f, i) => f === b[i]);
}

function commonGrid(curves: MagnitudeCurve[]): Float64Array {
  const first = curves[0].frequencyHz;
  if (curves.every((curve) => sameFrequencies(curve.frequencyHz, first))) return first;
  const fromHz = Math.max(...curves.map((c) => c.frequencyHz[0]));
  const toHz = Math.min(...curves.map((c) => c.frequencyHz[c.frequencyHz.length - 1]));
  const grid = first.filter((f) => f >= fromHz && f <= toHz);
  if (grid.length < 2) {
    throw new EngineError('golden_curves_no_overlap', 'The golden curves share fewer than two frequencies of a common span.', {
      field: 'curves',
    });
  }
  return grid;
}

function smoothSpread(gridHz: Float64Array, spreadDb: Float64Array, octaveFraction: number): Float64Array {
  const integral = curveLinearIntegral(gridHz, spreadDb);
  const out = new Float64Array(1);
  const window = logFrequencyWindow(Math.LN2 / (2 * octaveFraction), 'rectangular');
  return gridHz.map((f) => {
    windowedMeans([integral], f, window, out);
    return out[0];
  });
}
