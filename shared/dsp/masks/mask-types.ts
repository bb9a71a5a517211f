/**
 * Tolerance masks: an upper and/or a lower limit line against frequency, each a polyline read linearly in dB
 * against log frequency between its points.
 */

export interface MaskLimitPoint {
  frequencyHz: number;
  levelDb: number;
}

export interface ToleranceMask {
  /**
   * 'absolute': limits in the curve's own dB reference (e.g. dB SPL).
   * 'relative': limits in dB relative to the curve's reference level (the normalisation reference); they are
   * shifted by `referenceLevelDb` at evaluation.
   */
  levelReference: 'absolute' | 'relative';
  upper?: MaskLimitPoint[];
  lower?: MaskLimitPoint[];
}

export interface MaskEvaluationOptions {
  /** Required for a relative mask: the curve's reference level in the curve's dB (0 when the curve is already normalised). */
  referenceLevelDb?: number;
  /**
   * Guard band in dB (≥ 0): both limits move inward by this amount for the verdict, so a unit passes only with at
   * least this margin (set it to the measurement uncertainty). Default 0.
   */
  guardBandDb?: number;
}

/** Verdict of one limit. Margins are limit − curve for the upper limit and curve − limit for the lower; negative = violation. */
export interface LimitVerdict {
  pass: boolean;
  /** Smallest margin over the evaluated span (after the guard band). */
  worstMarginDb: number;
  /** Where the smallest margin occurs (the lowest such frequency on a tie). */
  worstMarginFrequencyHz: number;
  /** Maximal intervals [fromHz, toHz] where the margin is negative, crossings interpolated on log f. */
  failingRegionsHz: [number, number][];
  /** Span actually evaluated: the limit's span ∩ the curve's span. Outside it nothing is checked. */
  evaluatedFromHz: number;
  evaluatedToHz: number;
  /** False when the curve does not cover the limit's whole span. */
  coversLimitSpan: boolean;
}

export interface MaskVerdict {
  /** 'fail' if any limit is violated; 'incomplete' if none is but the curve does not cover a limit's span; else 'pass'. */
  verdict: 'pass' | 'fail' | 'incomplete';
  upper: LimitVerdict | null;
  lower: LimitVerdict | null;
  guardBandDb: number;
  /** Plain-words statement for the result's conventions. */
  description: string;
}
