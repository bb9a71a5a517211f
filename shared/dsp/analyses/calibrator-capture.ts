import { analyzeCalibratorTone, type CalibratorToneOptions, type CalibratorToneResult } from '../levels/calibrator-tone';
import { ENGINE_VERSION } from '../result/engine-version';
import type { AnalysisResult } from '../result/types';
import type { EngineWarning } from '../result/warnings';
import { rejectUnknownKeys, requireNumberInRange, requireObject } from '../stimuli/parameter-checks';
import { channelWarnings, requireCapture, type CaptureInput } from './capture-checks';
import { resolveChannelIndex } from './channel-options';

/**
 * Calibrator capture → chain sensitivity (dBFS at 1 Pa). The tone analysis itself (frequency, level, stability,
 * SNR, refusal of a non-steady tone) is levels/calibrator-tone.ts; this adds the capture checks, channel choice,
 * conventions and the result envelope.
 */
export interface CalibratorCaptureOptions {
  /** Channel holding the microphone signal. Default 0. */
  channel?: number;
  /** The calibrator's stated level, dB SPL re 20 µPa (e.g. 94 or 114). */
  statedLevelDbSpl: number;
  /** The calibrator's stated frequency, Hz. Default 1000. */
  statedFrequencyHz?: number;
  /** Acceptance limits of the tone analysis. */
  tone?: CalibratorToneOptions;
}

export type CalibratorFigures = Omit<CalibratorToneResult, 'warnings'> & {
  statedLevelDbSpl: number;
  statedFrequencyHz: number;
  channel: number;
};

export type CalibratorCaptureResult = AnalysisResult<CalibratorFigures, Record<string, never>>;

export function analyzeCalibratorCapture(capture: CaptureInput, options: CalibratorCaptureOptions): CalibratorCaptureResult {
  const input = requireCapture(capture);
  const raw = requireObject(options, 'options');
  rejectUnknownKeys(raw, 'options', ['channel', 'statedLevelDbSpl', 'statedFrequencyHz', 'tone']);
  const channel = resolveChannelIndex(raw.channel, 'options.channel', input.channels.length, 0) as number;
  const statedLevelDbSpl = requireNumberInRange(raw.statedLevelDbSpl, 'options.statedLevelDbSpl', 40, 174, 'dB SPL');
  const statedFrequencyHz = requireNumberInRange(raw.statedFrequencyHz ?? 1000, 'options.statedFrequencyHz', 1, input.sampleRateHz / 2, 'Hz');
  const toneOptions = raw.tone === undefined ? {} : (requireObject(raw.tone, 'options.tone') as CalibratorToneOptions);
  const samples = input.channels[channel];
  const warnings: EngineWarning[] = channelWarnings(samples, channel, 'microphone');
  const { warnings: toneWarnings, ...tone } = analyzeCalibratorTone(samples, input.sampleRateHz, { statedLevelDbSpl, statedFrequencyHz }, toneOptions);
  warnings.push(...toneWarnings);
  return {
    kind: 'calibrator',
    engineVersion: ENGINE_VERSION,
    conventions: {
      magnitudeReference: 'dBFS (AES17: full-scale sine = 0 dBFS); dB SPL re 20 µPa; 1 Pa = 93.979 dB SPL',
      dbfsConvention: 'aes17_sine',
      calibration: `chain sensitivity = tone level − (stated level − 93.979 dB SPL), from a calibrator stated as ${statedLevelDbSpl} dB SPL at ${statedFrequencyHz} Hz; valid only for the gain settings and microphone of this capture`,
      sensitivity: 'dBFS at 1 Pa RMS',
      window: tone.method,
    },
    figures: { ...tone, statedLevelDbSpl, statedFrequencyHz, channel },
    curves: {},
    warnings,
  };
}
