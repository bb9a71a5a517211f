import type { LimitPoint, MagnitudeCurve } from './curve';
import { interpolateOnLogFrequency, segmentIndex } from './interpolate';

/** Allowed band of levels while walking: lowDb ≤ L ≤ highDb (either may be infinite). */
export interface LevelRegion {
  lowDb: number;
  highDb: number;
}

export interface WalkOptions {
  startHz: number;
  direction: 'up' | 'down';
  region: LevelRegion;
  /** Excursions out of the region narrower than this (octaves, between exit and re-entry) are stepped over. */
  ignoreNarrowerThanOctaves: number;
  /** Stop here instead of at the end of the data (for checks inside a band). */
  untilHz?: number;
}

/**
 * Walk the curve (dB linear in log f between points) from `startHz` outward and return where it first leaves
 * the region for good: the interpolated exit frequency, 'beyond_measured_range' when the data ends while
 * inside, or 'outside_at_reference_band' when the start itself is outside. An exit that has not re-entered
 * when the data ends is a found limit (the measured data shows the curve leaving).
 */
export function walkOutward(curve: MagnitudeCurve, options: WalkOptions): LimitPoint {
  const { frequencyHz, magnitudeDb } = curve;
  const { startHz, direction, region, ignoreNarrowerThanOctaves } = options;
  const startDb = interpolateOnLogFrequency(frequencyHz, magnitudeDb, startHz);
  if (!(startDb >= region.lowDb && startDb <= region.highDb)) {
    return { status: 'outside_at_reference_band', atHz: startHz };
  }
  const up = direction === 'up';
  const endHz = options.untilHz ?? (up ? frequencyHz[frequencyHz.length - 1] : frequencyHz[0]);
  const beyond = (hz: number): boolean => (up ? hz >= endHz : hz <= endHz);

  let previousHz = startHz;
  let previousDb = startDb;
  let exitHz: number | null = null;
  let index = segmentIndex(frequencyHz, startHz) + (up ? 1 : 0);
  while (previousHz !== endHz) {
    let nextHz: number;
    let nextDb: number;
    const candidateHz = index >= 0 && index < frequencyHz.length ? frequencyHz[index] : endHz;
    if ((up ? candidateHz <= previousHz : candidateHz >= previousHz) && index >= 0 && index < frequencyHz.length) {
      index += up ? 1 : -1;
      continue;
    }
    if (beyond(candidateHz)) {
      nextHz = endHz;
      nextDb = interpolateOnLogFrequency(frequencyHz, magnitudeDb, endHz);
    } else {
      nextHz = candidateHz;
      nextDb = magnitudeDb[index];
      index += up ? 1 : -1;
    }
    const [insideFrom, insideTo] = insideInterval(previousDb, nextDb, region);
    const at = (t: number): number => previousHz * (nextHz / previousHz) ** t;
    if (exitHz === null) {
      if (insideTo < 1) exitHz = at(Math.max(insideTo, 0));
    } else if (insideFrom <= insideTo) {
      const entryHz = at(insideFrom);
      if (Math.abs(Math.log2(entryHz / exitHz)) >= ignoreNarrowerThanOctaves) return { status: 'found', frequencyHz: exitHz };
      exitHz = insideTo < 1 ? at(insideTo) : null;
    }
    if (exitHz !== null && ignoreNarrowerThanOctaves === 0) return { status: 'found', frequencyHz: exitHz };
    previousHz = nextHz;
    previousDb = nextDb;
  }
  if (exitHz !== null) return { status: 'found', frequencyHz: exitHz };
  return { status: 'beyond_measured_range', measuredEdgeHz: endHz };
}

/** Sub-interval [from, to] of t ∈ [0, 1] where L(t) = L0 + t·(L1 − L0) lies in the region (from > to: none). */
function insideInterval(startDb: number, endDb: number, region: LevelRegion): [number, number] {
  const change = endDb - startDb;
  if (change === 0) {
    return startDb >= region.lowDb && startDb <= region.highDb ? [0, 1] : [1, 0];
  }
  const tLow = (region.lowDb - startDb) / change;
  const tHigh = (region.highDb - startDb) / change;
  const from = change > 0 ? Math.max(0, tLow) : Math.max(0, tHigh);
  const to = change > 0 ? Math.min(1, tHigh) : Math.min(1, tLow);
  return [from, to];
}
