import type { ReferenceLevelSpec, SpectrumInput, ToleranceMask } from '@shared/dsp';
import type { AnalysisKind, MeasurementConditions } from '@shared/schemas/analyses';
import type { StimulusType } from '@shared/schemas/stimuli';

/** Everything the engine needs for one analysis, as stored with the job (plain JSON). */
export interface AnalysisJobSpec {
  kind: AnalysisKind;
  stimulus: { type: StimulusType; parameters: Record<string, unknown> } | null;
  channels: { measurement: number; reference: number | null };
  conditions: MeasurementConditions;
  options: Record<string, unknown>;
  spectrum?: SpectrumInput;
  calibrator?: { statedLevelDbSpl: number; statedFrequencyHz?: number };
  sensitivity?: {
    deviceType: 'loudspeaker' | 'microphone' | 'headphone';
    bandHz?: [number, number];
    statedLevelDbSpl?: number;
    statedFrequencyHz?: number;
    adcFullScaleVoltsRms?: number;
    /** Set when the sensitivity is derived from a stored response analysis instead of a capture. */
    source?: SensitivitySource;
  };
}

/** A calibrated response analysis a sensitivity is derived from: its curve (dB SPL) and the conditions it holds for. */
export interface SensitivitySource {
  analysisId: string;
  kind: string;
  frequencyHz: number[];
  magnitudeDb: number[];
  /** What the curve's dB mean, as the source result states it. */
  magnitudeReference: string;
  /** Microphone distance the curve holds for, m (1 when the source stated none). */
  distanceM: number;
  distanceStated: boolean;
  /** The source's applied calibration, as stored with it. */
  calibration: { id: string; dbfsAtOnePascal: number; expired: boolean } & Record<string, unknown>;
}

/** A calibration as applied by the engine, with what the result records about it. */
export interface JobCalibration {
  id: string;
  dbfsAtOnePascal: number;
  expired: boolean;
}

/** What an engine thread receives: the spec, the capture's file bytes (decoded there), calibration and mask. */
export interface EngineTask {
  spec: AnalysisJobSpec;
  wavBytes: Uint8Array | null;
  calibration: JobCalibration | null;
  /** referenceLevel: for a relative mask, the curve level that counts as 0 dB (null: normalisation reference or 1 kHz). */
  mask: { mask: ToleranceMask; id: string; version: number; referenceLevel: ReferenceLevelSpec | null } | null;
}

export interface EngineTaskOutput {
  /** The result envelope serialised once, stored and returned as this exact text. */
  resultJson: string;
  verdict: 'pass' | 'fail' | 'incomplete' | null;
  /** The smaller of the stored upper and lower worst mask margins, dB; null without a mask verdict (list sorting). */
  worstMarginDb: number | null;
  engineVersion: string;
}

export const DEFAULT_SENSITIVITY_BAND_HZ: [number, number] = [300, 3000];
