/**
 * Harmonic-distortion definitions and conversions. V_1 is the RMS of the fundamental, V_n that of the n-th
 * harmonic, V_H = √(Σ_{n=2..K} V_n²) (RMS sum, not an amplitude sum, not a power ratio).
 * Both THD forms are always computed; a result names which one is its headline.
 */

export type ThdForm = 'thd_f' | 'thd_r';

export const THD_F_DEFINITION = 'THD_F = V_H / V_1: RMS sum of harmonics 2..K over the fundamental (IEEE usage)';
export const THD_R_DEFINITION =
  'THD_R = V_H / √(V_1² + V_H²): RMS sum of harmonics 2..K over the RMS of fundamental plus harmonics (distortion factor)';
export const HD_DEFINITION = 'HD_n = V_n / V_1: each harmonic relative to the fundamental, both RMS';
export const DISTORTION_UNITS = 'percent = 100·ratio; dB = 20·log10(ratio)';

/** One distortion figure. An upper bound means "less than this value": the quantity was not measurably above the noise. */
export interface DistortionValue {
  valuePercent: number;
  valueDb: number;
  isUpperBound: boolean;
}

export function percentFromRatio(ratio: number): number {
  return 100 * ratio;
}

export function ratioFromPercent(percent: number): number {
  return percent / 100;
}

export function dbFromRatio(ratio: number): number {
  return 20 * Math.log10(ratio);
}

export function ratioFromDb(levelDb: number): number {
  return 10 ** (levelDb / 20);
}

/** THD_R = THD_F / √(1 + THD_F²) (from the definitions). */
export function thdRFromThdF(thdF: number): number {
  return thdF / Math.sqrt(1 + thdF * thdF);
}

/** THD_F = THD_R / √(1 − THD_R²), defined for THD_R < 1 (from the definitions). */
export function thdFFromThdR(thdR: number): number {
  return thdR / Math.sqrt(1 - thdR * thdR);
}

export function distortionValue(ratio: number, isUpperBound = false): DistortionValue {
  return { valuePercent: percentFromRatio(ratio), valueDb: dbFromRatio(ratio), isUpperBound };
}

/** A harmonic level as an RMS value, or an upper bound on it. */
export interface HarmonicLevel {
  rms: number;
  isUpperBound: boolean;
}

export interface ThdPair {
  thdF: DistortionValue;
  thdR: DistortionValue;
}

/**
 * THD_F and THD_R of a fundamental and its harmonics. A bound enters the sum at its bound value, which makes
 * the THD itself an upper bound.
 */
export function thdFromHarmonics(fundamentalRms: number, harmonics: readonly HarmonicLevel[]): ThdPair {
  let sumSquares = 0;
  let isUpperBound = false;
  for (const harmonic of harmonics) {
    sumSquares += harmonic.rms * harmonic.rms;
    isUpperBound ||= harmonic.isUpperBound;
  }
  const thdF = Math.sqrt(sumSquares) / fundamentalRms;
  return { thdF: distortionValue(thdF, isUpperBound), thdR: distortionValue(thdRFromThdF(thdF), isUpperBound) };
}

/** The headline value out of a pair. */
export function headlineThd(pair: ThdPair, form: ThdForm): DistortionValue {
  return form === 'thd_f' ? pair.thdF : pair.thdR;
}

/** The sentence for a result's `conventions.thdDefinition`. */
export function describeThdDefinitions(headline: ThdForm): string {
  return `${THD_F_DEFINITION}; ${THD_R_DEFINITION}; ${HD_DEFINITION}; ${DISTORTION_UNITS}; headline: ${headline === 'thd_f' ? 'THD_F' : 'THD_R'}`;
}
