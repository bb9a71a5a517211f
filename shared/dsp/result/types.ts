import type { EngineWarning } from './warnings';

/**
 * The envelope every engine analysis returns (and the API stores as the job's result). Each analysis kind fills
 * `figures` (single numbers, units in the key names) and `curves` (arrays against frequency or time), and states
 * every convention it used in `conventions` in plain, machine-readable terms: nothing is implied.
 */
export interface AnalysisResult<
  TFigures extends object = Record<string, unknown>,
  TCurves extends object = Record<string, unknown>,
> {
  kind: AnalysisKind;
  engineVersion: string;
  conventions: Conventions;
  figures: TFigures;
  curves: TCurves;
  warnings: EngineWarning[];
}

export type AnalysisKind =
  | 'frequency_response'
  | 'distortion'
  | 'response_and_distortion'
  | 'stepped_sine'
  | 'calibrator'
  | 'sensitivity'
  | 'spectrum'
  | 'tone_distortion';

/**
 * Conventions a result states. Keys are optional because not every kind uses every convention, but a kind that
 * uses one must state it. Values are plain strings/numbers so they serialise unchanged into JSON.
 */
export interface Conventions {
  /** e.g. "dBFS (AES17: full-scale sine = 0 dBFS)", "dB SPL re 20 µPa at 1 m", "dB re 1 (relative to the stimulus)". */
  magnitudeReference?: string;
  dbfsConvention?: 'aes17_sine';
  deconvolution?: string;
  smoothing?: string;
  gate?: string;
  grid?: string;
  normalisation?: string;
  window?: string;
  phase?: string;
  thdDefinition?: string;
  thdHeadline?: 'thd_f' | 'thd_r';
  harmonicOrders?: string;
  thdPlusNoiseBandwidth?: string;
  calibration?: string;
  sensitivity?: string;
  speedOfSound?: string;
  mask?: string;
  [extra: string]: string | number | undefined;
}
