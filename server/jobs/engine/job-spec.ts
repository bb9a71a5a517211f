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
  };
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
  engineVersion: string;
}

export const DEFAULT_SENSITIVITY_BAND_HZ: [number, number] = [300, 3000];
