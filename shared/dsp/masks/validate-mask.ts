import { EngineError } from '../errors';
import type { MaskLimitPoint, ToleranceMask } from './mask-types';

const MAX_MASK_POINTS = 10_000;

function validateLimit(points: unknown, field: string): asserts points is MaskLimitPoint[] {
  if (!Array.isArray(points) || points.length < 2) {
    throw new EngineError('mask_limit_too_short', 'A mask limit needs at least two points.', { field });
  }
  if (points.length > MAX_MASK_POINTS) {
    throw new EngineError('mask_limit_too_long', `A mask limit may have at most ${MAX_MASK_POINTS} points.`, { field });
  }
  points.forEach((point: MaskLimitPoint, i) => {
    const f = point?.frequencyHz;
    if (typeof f !== 'number' || !Number.isFinite(f) || f <= 0 || f > 1e6) {
      throw new EngineError('mask_frequency_invalid', `Mask frequency must be in (0, 1 MHz], got ${String(f)}.`, {
        field: `${field}[${i}].frequencyHz`,
      });
    }
    if (i > 0 && !(f > points[i - 1].frequencyHz)) {
      throw new EngineError('mask_frequency_not_ascending', 'Mask frequencies must be strictly ascending.', {
        field: `${field}[${i}].frequencyHz`,
      });
    }
    const level = point.levelDb;
    if (typeof level !== 'number' || !Number.isFinite(level) || Math.abs(level) > 400) {
      throw new EngineError('mask_level_invalid', `Mask level must be a finite dB value within ±400, got ${String(level)}.`, {
        field: `${field}[${i}].levelDb`,
      });
    }
  });
}

/** Level of a limit polyline at `frequencyHz` (inside its span), linear in dB against log f. */
export function limitLevelDb(points: MaskLimitPoint[], frequencyHz: number): number {
  let i = 0;
  let high = points.length - 2;
  while (i < high) {
    const mid = (i + high + 1) >> 1;
    if (points[mid].frequencyHz <= frequencyHz) i = mid;
    else high = mid - 1;
  }
  const a = points[i];
  const b = points[i + 1];
  const t = Math.log(frequencyHz / a.frequencyHz) / Math.log(b.frequencyHz / a.frequencyHz);
  return a.levelDb + t * (b.levelDb - a.levelDb);
}

/** Throws an EngineError unless the mask is well formed (and upper ≥ lower wherever both are defined). */
export function validateMask(mask: ToleranceMask, field = 'mask'): void {
  if (mask?.levelReference !== 'absolute' && mask?.levelReference !== 'relative') {
    throw new EngineError('mask_reference_invalid', `levelReference must be 'absolute' or 'relative'.`, {
      field: `${field}.levelReference`,
    });
  }
  if (!mask.upper && !mask.lower) {
    throw new EngineError('mask_empty', 'A mask needs an upper limit, a lower limit or both.', { field });
  }
  if (mask.upper) validateLimit(mask.upper, `${field}.upper`);
  if (mask.lower) validateLimit(mask.lower, `${field}.lower`);
  if (!mask.upper || !mask.lower) return;
  const fromHz = Math.max(mask.upper[0].frequencyHz, mask.lower[0].frequencyHz);
  const toHz = Math.min(mask.upper[mask.upper.length - 1].frequencyHz, mask.lower[mask.lower.length - 1].frequencyHz);
  // Both lines are straight between breakpoints, so checking every breakpoint of the overlap is exact.
  const checks = [fromHz, toHz, ...mask.upper.map((p) => p.frequencyHz), ...mask.lower.map((p) => p.frequencyHz)];
  for (const f of checks) {
    if (f < fromHz || f > toHz) continue;
    const gapDb = limitLevelDb(mask.upper, f) - limitLevelDb(mask.lower, f);
    if (gapDb < 0) {
      throw new EngineError('mask_limits_crossed', `The upper limit lies below the lower limit at ${f} Hz.`, {
        field,
        details: { frequencyHz: f, gapDb },
      });
    }
  }
}
