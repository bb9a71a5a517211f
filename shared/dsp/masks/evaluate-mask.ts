import { EngineError } from '../errors';
import type { MagnitudeCurve } from '../curves/curve';
import { interpolateOnLogFrequency } from '../curves/interpolate';
import { validateCurve } from '../curves/validate-curve';
import type { LimitVerdict, MaskEvaluationOptions, MaskLimitPoint, MaskVerdict, ToleranceMask } from './mask-types';
import { limitLevelDb, validateMask } from './validate-mask';

/**
 * Check a curve against a mask. Each limit is evaluated over its own span ∩ the curve's span; nothing outside is
 * checked (a curve that does not cover a limit's span gives 'incomplete' unless it fails elsewhere). Curve and
 * limits are straight lines in dB against log f between their points, so the margin is a straight line between
 * the merged breakpoints: its minimum and zero crossings are found exactly there.
 */
export function evaluateMask(curve: MagnitudeCurve, mask: ToleranceMask, options: MaskEvaluationOptions = {}): MaskVerdict {
  validateCurve(curve);
  validateMask(mask);
  const guardBandDb = options.guardBandDb ?? 0;
  if (!(Number.isFinite(guardBandDb) && guardBandDb >= 0 && guardBandDb <= 100)) {
    throw new EngineError('guard_band_invalid', `guardBandDb must be 0–100 dB, got ${guardBandDb}.`, { field: 'guardBandDb' });
  }
  let offsetDb = 0;
  if (mask.levelReference === 'relative') {
    const reference = options.referenceLevelDb;
    if (typeof reference !== 'number' || !Number.isFinite(reference)) {
      throw new EngineError('mask_reference_level_missing', 'A relative mask needs the curve’s reference level (referenceLevelDb).', {
        field: 'referenceLevelDb',
      });
    }
    offsetDb = reference;
  }
  const upper = mask.upper ? evaluateLimit(curve, mask.upper, 'upper', offsetDb - guardBandDb) : null;
  const lower = mask.lower ? evaluateLimit(curve, mask.lower, 'lower', offsetDb + guardBandDb) : null;
  const limits = [upper, lower].filter((v): v is LimitVerdict => v !== null);
  const verdict = limits.some((v) => !v.pass) ? 'fail' : limits.every((v) => v.coversLimitSpan) ? 'pass' : 'incomplete';
  const reference = mask.levelReference === 'relative' ? `relative to the reference level ${offsetDb} dB` : 'absolute (curve’s dB reference)';
  return {
    verdict,
    upper,
    lower,
    guardBandDb,
    description:
      `mask ${reference}, limits linear in dB against log frequency, evaluated over each limit's span ∩ the curve's span; ` +
      `margin = limit − curve (upper), curve − limit (lower), negative = violation; guard band ${guardBandDb} dB`,
  };
}

function evaluateLimit(curve: MagnitudeCurve, points: MaskLimitPoint[], side: 'upper' | 'lower', shiftDb: number): LimitVerdict {
  const { frequencyHz, magnitudeDb } = curve;
  const limitFromHz = points[0].frequencyHz;
  const limitToHz = points[points.length - 1].frequencyHz;
  const fromHz = Math.max(limitFromHz, frequencyHz[0]);
  const toHz = Math.min(limitToHz, frequencyHz[frequencyHz.length - 1]);
  if (fromHz > toHz) {
    throw new EngineError('mask_outside_curve', `The ${side} limit (${limitFromHz}–${limitToHz} Hz) does not overlap the curve.`, {
      field: `mask.${side}`,
    });
  }
  const breakpoints = mergedBreakpoints(frequencyHz, points, fromHz, toHz);
  const margins = breakpoints.map((f) => {
    const limitDb = limitLevelDb(points, f) + shiftDb;
    const curveDb = interpolateOnLogFrequency(frequencyHz, magnitudeDb, f);
    return side === 'upper' ? limitDb - curveDb : curveDb - limitDb;
  });
  let worst = 0;
  for (let i = 1; i < margins.length; i++) if (margins[i] < margins[worst]) worst = i;
  return {
    pass: margins[worst] >= 0,
    worstMarginDb: margins[worst],
    worstMarginFrequencyHz: breakpoints[worst],
    failingRegionsHz: negativeRegions(breakpoints, margins),
    evaluatedFromHz: fromHz,
    evaluatedToHz: toHz,
    coversLimitSpan: fromHz === limitFromHz && toHz === limitToHz,
  };
}

/** Sorted, de-duplicated curve and limit frequencies inside [fromHz, toHz], ends included. */
function mergedBreakpoints(curveHz: Float64Array, points: MaskLimitPoint[], fromHz: number, toHz: number): number[] {
  const all = [fromHz, toHz];
  for (const f of curveHz) if (f > fromHz && f < toHz) all.push(f);
  for (const p of points) if (p.frequencyHz > fromHz && p.frequencyHz < toHz) all.push(p.frequencyHz);
  all.sort((a, b) => a - b);
  return all.filter((f, i) => i === 0 || f !== all[i - 1]);
}

function negativeRegions(frequencyHz: number[], margins: number[]): [number, number][] {
  const regions: [number, number][] = [];
  let openHz: number | null = margins[0] < 0 ? frequencyHz[0] : null;
  for (let i = 1; i < margins.length; i++) {
    const a = margins[i - 1];
    const b = margins[i];
    const crossingHz = (): number => frequencyHz[i - 1] * (frequencyHz[i] / frequencyHz[i - 1]) ** (a / (a - b));
    if (openHz === null && b < 0) openHz = a > 0 ? crossingHz() : frequencyHz[i - 1];
    else if (openHz !== null && b >= 0) {
      regions.push([openHz, b > 0 ? crossingHz() : frequencyHz[i]]);
      openHz = null;
    }
  }
  if (openHz !== null) regions.push([openHz, frequencyHz[frequencyHz.length - 1]]);
  return regions;
}
