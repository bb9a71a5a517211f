import type { LimitPoint } from '../curves/curve';
import { interpolateOnLogFrequency } from '../curves/interpolate';
import { walkOutward } from '../curves/walk-outward';
import { distortionValue, type DistortionValue } from './thd';

/** A distortion curve against the fundamental frequency; NaN marks frequencies without a value. */
export interface DistortionCurveInput {
  frequencyHz: ArrayLike<number>;
  ratio: ArrayLike<number>;
  isUpperBound: ArrayLike<number | boolean>;
}

export interface MaximumInBand extends DistortionValue {
  frequencyHz: number;
  bandHz: [number, number];
}

export interface ValueAtFrequency extends DistortionValue {
  frequencyHz: number;
}

export interface BelowThreshold {
  thresholdPercent: number;
  referenceHz: number;
  /** Lower and upper ends of the widest interval around the reference where the curve stays below the threshold. */
  lower: LimitPoint;
  upper: LimitPoint;
  description: string;
}

interface ValidCurve {
  frequencyHz: Float64Array;
  levelDb: Float64Array;
  isUpperBound: boolean[];
}

/** The finite part of the curve, in dB (20·log10 ratio). */
function validPart(curve: DistortionCurveInput): ValidCurve {
  const frequencyHz: number[] = [];
  const levelDb: number[] = [];
  const isUpperBound: boolean[] = [];
  for (let i = 0; i < curve.frequencyHz.length; i++) {
    const ratio = curve.ratio[i];
    if (!(Number.isFinite(ratio) && ratio > 0)) continue;
    frequencyHz.push(curve.frequencyHz[i]);
    levelDb.push(20 * Math.log10(ratio));
    isUpperBound.push(Boolean(curve.isUpperBound[i]));
  }
  return { frequencyHz: Float64Array.from(frequencyHz), levelDb: Float64Array.from(levelDb), isUpperBound };
}

/** Largest value in [low, high] and where it occurs (grid points only); null when the band holds none. */
export function maximumInBand(curve: DistortionCurveInput, bandHz: [number, number]): MaximumInBand | null {
  const valid = validPart(curve);
  let best = -1;
  for (let i = 0; i < valid.frequencyHz.length; i++) {
    const f = valid.frequencyHz[i];
    if (f < bandHz[0] || f > bandHz[1]) continue;
    if (best < 0 || valid.levelDb[i] > valid.levelDb[best]) best = i;
  }
  if (best < 0) return null;
  return { ...distortionValue(10 ** (valid.levelDb[best] / 20), valid.isUpperBound[best]), frequencyHz: valid.frequencyHz[best], bandHz };
}

/** Value at a frequency, dB linear in log f between grid points; null outside the curve. */
export function valueAtFrequency(curve: DistortionCurveInput, frequencyHz: number): ValueAtFrequency | null {
  const valid = validPart(curve);
  const n = valid.frequencyHz.length;
  if (n === 0 || frequencyHz < valid.frequencyHz[0] || frequencyHz > valid.frequencyHz[n - 1]) return null;
  let upper = 0;
  while (upper < n - 1 && valid.frequencyHz[upper] < frequencyHz) upper++;
  const lower = Math.max(0, upper - 1);
  const bound = valid.isUpperBound[lower] || valid.isUpperBound[upper];
  const levelDb = n === 1 ? valid.levelDb[0] : interpolateOnLogFrequency(valid.frequencyHz, valid.levelDb, frequencyHz);
  return { ...distortionValue(10 ** (levelDb / 20), bound), frequencyHz };
}

/**
 * "Below X % from A to B": walking outward from the reference frequency (default 1 kHz), where the curve first
 * rises to X for good (dB linear in log f between points). 'beyond_measured_range' when it stays below X up to the
 * end of the data (the data end is not the limit); 'outside_at_reference_band' when it is not below X at the
 * reference. An upper bound below X counts as below X (the true value is lower still).
 */
export function belowThreshold(curve: DistortionCurveInput, thresholdPercent: number, referenceHz: number): BelowThreshold {
  const valid = validPart(curve);
  const description = `widest interval containing ${referenceHz} Hz where the value stays below ${thresholdPercent} %, edges interpolated in dB against log f`;
  const n = valid.frequencyHz.length;
  if (n < 2 || referenceHz < valid.frequencyHz[0] || referenceHz > valid.frequencyHz[n - 1]) {
    const outside: LimitPoint = { status: 'outside_at_reference_band', atHz: referenceHz };
    return { thresholdPercent, referenceHz, lower: outside, upper: outside, description: `${description}; the reference lies outside the data` };
  }
  const magnitude = { frequencyHz: valid.frequencyHz, magnitudeDb: valid.levelDb };
  const region = { lowDb: Number.NEGATIVE_INFINITY, highDb: 20 * Math.log10(thresholdPercent / 100) };
  const walk = (direction: 'up' | 'down') =>
    walkOutward(magnitude, { startHz: referenceHz, direction, region, ignoreNarrowerThanOctaves: 0 });
  return { thresholdPercent, referenceHz, lower: walk('down'), upper: walk('up'), description };
}
