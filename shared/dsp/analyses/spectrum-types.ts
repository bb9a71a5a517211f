import type { BandLimit, LimitPoint, ThirdOctaveBandValue } from '../curves/curve';
import type { MaskVerdict } from '../masks/mask-types';
import type { AnalysisResult } from '../result/types';
import type { SpectrumSensitivity } from './spectrum-sensitivity';

/** Result of analyzeSpectrum: kind 'spectrum'. Levels are in the supplied spectrum's dB reference unless named. */
export type SpectrumResult = AnalysisResult<SpectrumFigures, SpectrumCurves>;

export interface SpectrumFigures {
  pointCount: number;
  fromHz: number;
  toHz: number;
  /** Normalisation reference level in the input's dB reference; null without normalisation. */
  referenceLevelDb: number | null;
  levelAtOneKilohertzDb: number | null;
  bandLimits: {
    referenceLevelDb: number;
    limits: BandLimit[];
    toleranceRange: { toleranceDb: number; lower: LimitPoint; upper: LimitPoint };
  } | null;
  sensitivity: SpectrumSensitivity | null;
  mask: MaskVerdict | null;
}

export interface SpectrumCurves {
  response: {
    frequencyHz: number[];
    /** ISO 266 / ISO 3 nominal label where the point is a preferred frequency, else null. */
    nominalLabel: (string | null)[];
    /** In the input's reference (smoothed if asked). */
    magnitudeDb: number[];
    /** Minus the normalisation reference; null without normalisation. */
    relativeMagnitudeDb: number[] | null;
    /** Complex smoothing gives wrapped phase; no smoothing gives the supplied phase read on the grid; power smoothing none. */
    phaseDeg: number[] | null;
  };
  /** From the supplied (unsmoothed) spectrum. */
  thirdOctave: ThirdOctaveBandValue[] | null;
}
