/**
 * Curve types shared by every frequency-domain analysis. A curve is sampled at strictly ascending, positive
 * frequencies; between samples it is read as a straight line in dB against log frequency (phase: a straight
 * line in degrees against log frequency). All arithmetic is float64.
 */

/** A magnitude curve, optionally with phase. `magnitudeDb` carries whatever dB reference its producer states. */
export interface MagnitudeCurve {
  /** Strictly ascending, > 0. */
  frequencyHz: Float64Array;
  /** Level in dB (20·log10 of an amplitude, or 10·log10 of a power: the same number). */
  magnitudeDb: Float64Array;
  /** Phase in degrees, same length as `frequencyHz` when present. */
  phaseDeg?: Float64Array;
}

/**
 * A one-sided spectrum on linear FFT bins: bin k sits at k·binSpacingHz (bin 0 = 0 Hz). `re`/`im` have the same
 * length. Structurally compatible with `Spectrum` from shared/dsp/fft.ts plus the bin spacing (= sampleRate/N).
 */
export interface LinearSpectrum {
  re: Float64Array;
  im: Float64Array;
  binSpacingHz: number;
}

/** Width of the smoothing window: 'none', or N for 1/N octave (integer, 1…48). */
export type OctaveFraction = 'none' | number;

/**
 * - 'power': |H_s| = sqrt(∫W·|H|² / ∫W) (robust to phase; no phase is returned).
 * - 'complex': H_s = ∫W·H / ∫W on re and im (returns phase). The caller must remove the bulk delay first, or
 *   the fast phase rotation cancels the average.
 */
export type SmoothingAveraging = 'power' | 'complex';

/**
 * Window shape over log frequency. The window spans the whole 1/N-octave interval f·2^(±1/(2N)); 'hann' tapers
 * to zero at its edges (its equivalent rectangular width is half the interval).
 */
export type SmoothingWindow = 'hann' | 'rectangular';

export interface SmoothingOptions {
  octaveFraction: OctaveFraction;
  /** Default 'power'. */
  averaging?: SmoothingAveraging;
  /** Default 'hann'. */
  window?: SmoothingWindow;
}

/** How the reference level of a curve is taken (for normalisation, band limits, masks). */
export type ReferenceLevelSpec =
  | { kind: 'at_frequency'; frequencyHz: number }
  | {
      kind: 'band_mean';
      fromHz: number;
      toHz: number;
      /** 'db': mean of the dB values; 'power': 10·log10 of the mean power. Both over log frequency. */
      average: BandAverage;
    };

/** Mean of dB values, or 10·log10 of the mean of power (10^(L/10)); both weighted uniformly in log frequency. */
export type BandAverage = 'db' | 'power';

export interface ReferenceLevel {
  levelDb: number;
  /** The reference band [from, to]; a single frequency gives from = to. Band limits walk outward from its edges. */
  bandHz: [number, number];
  /** Plain-words statement for the result's conventions. */
  description: string;
}

export type NormalisationSpec = { kind: 'none' } | ReferenceLevelSpec;

/**
 * Where a limit (a −X dB point, or an edge of the ±X dB range) lies:
 * - 'found': the curve crosses at `frequencyHz` (interpolated linearly in dB against log f).
 * - 'beyond_measured_range': the curve does not cross inside the data; `measuredEdgeHz` is the last frequency
 *   examined and is NOT the limit.
 * - 'outside_at_reference_band': the curve already violates the condition at the reference band's edge (or,
 *   for the ±X range, inside the reference band), so there is no interval to walk; `atHz` is where.
 */
export type LimitPoint =
  | { status: 'found'; frequencyHz: number }
  | { status: 'beyond_measured_range'; measuredEdgeHz: number }
  | { status: 'outside_at_reference_band'; atHz: number };

export interface BandLimit {
  /** e.g. 3 for the −3 dB points. */
  dropDb: number;
  /** referenceLevelDb − dropDb. */
  thresholdDb: number;
  lower: LimitPoint;
  upper: LimitPoint;
}

export interface BandLimitsResult {
  reference: ReferenceLevel;
  /** Excursions narrower than this (octaves) are stepped over; 0 = none ignored. */
  ignoredExcursionsNarrowerThanOctaves: number;
  limits: BandLimit[];
}

export interface ToleranceRangeResult {
  reference: ReferenceLevel;
  toleranceDb: number;
  ignoredExcursionsNarrowerThanOctaves: number;
  lower: LimitPoint;
  upper: LimitPoint;
}

/** One row of the 1/3-octave table. */
export interface ThirdOctaveBandValue {
  /** Exact IEC 61260-1 base-10 mid-band frequency. */
  exactHz: number;
  /** ISO 266 nominal label, e.g. "31.5". */
  nominalLabel: string;
  lowerEdgeHz: number;
  upperEdgeHz: number;
  /** Power mean over the band edges (uniform in log f), or null when the band is not fully inside the curve. */
  bandLevelDb: number | null;
  /** The curve read at the exact centre, or null when the centre is outside the curve. */
  centreLevelDb: number | null;
}

/**
 * Function map (import from '@shared/dsp/curves'; each lives in its own module here):
 *
 *   smoothSpectrum(spectrum: LinearSpectrum, gridHz: Float64Array, options: SmoothingOptions): MagnitudeCurve
 *   smoothCurve(curve: MagnitudeCurve, options: SmoothingOptions, gridHz?: Float64Array): MagnitudeCurve
 *   describeSmoothing(options: SmoothingOptions): string
 *   logFrequencyGrid(options: { pointsPerOctave; startHz; stopHz }): Float64Array   describeLogGrid(options): string
 *   gridNominalLabels(frequencyHz: Float64Array): (string | null)[]
 *   thirdOctaveBandValues(curve, { startHz?, stopHz? }?): ThirdOctaveBandValue[]
 *   thirdOctaveBandValuesFromSpectrum(spectrum: LinearSpectrum, { startHz?, stopHz? }?): ThirdOctaveBandValue[]
 *   levelAtFrequencyDb(curve, frequencyHz): number        resampleCurve(curve, gridHz): MagnitudeCurve
 *   bandMeanLevelDb(curve, fromHz, toHz, average: BandAverage): number
 *   referenceLevel(curve, spec: ReferenceLevelSpec): ReferenceLevel
 *   normaliseCurve(curve, spec: NormalisationSpec): { curve; reference: ReferenceLevel | null; description }
 *   bandLimits(curve, { reference; dropsDb?; ignoreExcursionsNarrowerThanOctaves? }): BandLimitsResult
 *   toleranceRange(curve, { reference; toleranceDb; ignoreExcursionsNarrowerThanOctaves? }): ToleranceRangeResult
 *   validateCurve(curve, field?): void
 *
 * Masks ('@shared/dsp/masks'): evaluateMask(curve, mask, options) and deriveMaskFromGolden(curves, options).
 */
