import type { BandLimitsResult, ThirdOctaveBandValue, ToleranceRangeResult } from '../curves';
import type { AnalysisResult } from '../result/types';

/** Figures of a sweep frequency-response result (units in the names). */
export interface SweepResponseFigures {
  /** Bulk delay from the IR peak (parabolic sub-sample fit); includes interface latency unless a loopback was divided out. */
  delayMs: number;
  delaySamples: number;
  /** c·τ0 at the stated temperature. */
  delayDistanceMetres: number;
  speedOfSoundMetresPerSecond: number;
  temperatureCelsius: number;
  /** Sign of the IR peak. */
  polarity: 'positive' | 'negative';
  /** IR peak-to-noise ratio, dB (null when no noise span was available). */
  peakToNoiseDb: number | null;
  /** 1/T of the gate (or of the analysis window when ungated), Hz. */
  lowestValidFrequencyHz: number;
  gated: boolean;
  windowPreRollMs: number;
  windowLengthMs: number;
  /** Level used as 0 dB by the normalisation, in the magnitude reference (null when not normalised). */
  normalisationReferenceLevelDb: number | null;
  /** Loopback channel's sweep level, dBFS AES17 (null without a reference channel). */
  referenceChannelLevelDbfs: number | null;
  bandLimits: BandLimitsResult | null;
  toleranceRange: ToleranceRangeResult | null;
  sweep: {
    startHz: number;
    stopHz: number;
    rateConstantSeconds: number;
    sweepDurationSeconds: number;
    levelDbfs: number;
    sampleRateHz: number;
  };
  deconvolutionFftSize: number;
  spectrumFftSize: number;
}

export interface SweepResponseCurves {
  frequencyHz: number[];
  /** ISO 266 nominal label where the grid point has one, else null. */
  nominalLabel: (string | null)[];
  magnitudeDb: number[];
  /** Unwrapped, bulk delay removed, degrees. */
  phaseDeg: number[];
  /** Total group delay (bulk delay included), ms. */
  groupDelayMs: number[];
  /** True below the lowest valid frequency of the gate (always false when ungated). */
  belowLowestValidFrequency: boolean[];
  /** True outside the sweep's [startHz, stopHz]: no excitation there. */
  outsideSweepBand: boolean[];
  /** True below 2·f1 and above f2·2^(−1/6), where the sweep's band edges and fades affect the response. */
  nearSweepEdge: boolean[];
  /** Estimated SNR per grid point, dB (null when the IR held no noise span). */
  snrDb: number[] | null;
  thirdOctave: ThirdOctaveBandValue[] | null;
  /** The windowed impulse response, first sample at startSeconds (t = 0 is the sweep start). */
  impulseResponse: { startSeconds: number; sampleRateHz: number; samples: number[] } | null;
}

export type SweepResponseResult = AnalysisResult<SweepResponseFigures, SweepResponseCurves>;
