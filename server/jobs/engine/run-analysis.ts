import {
  analyzeCalibratorCapture,
  analyzeSpectrum,
  analyzeSteppedResponse,
  analyzeSweepDistortion,
  analyzeSweepResponse,
  analyzeSweepResponseAndDistortion,
  analyzeToneDistortion,
  ENGINE_VERSION,
  readWav,
  warning,
  type AnalysisResult,
  type CaptureInput,
  type SteppedSineParameters,
  type SweepParameters,
} from '@shared/dsp';
import type { AnalysisJobSpec, EngineTask, EngineTaskOutput } from './job-spec';
import {
  responseAndDistortionOptions,
  spectrumOptions,
  steppedResponseOptions,
  sweepDistortionOptions,
  sweepResponseOptions,
  toneDistortionOptions,
} from './engine-options';
import { applyMaskVerdict } from './mask-verdict';
import { sensitivityResult } from './sensitivity';
import { sensitivityFromResponse } from './sensitivity-from-response';
import { STORED_PRECISION_CONVENTION, withStoredPrecision } from './stored-precision';

/** Kinds whose levels depend on a calibration (the others are ratios, or carry their own reference). */
const LEVEL_KINDS = new Set(['frequency_response', 'response_and_distortion', 'stepped_sine', 'sensitivity']);

function decodeCapture(task: EngineTask): CaptureInput {
  if (!task.wavBytes) throw new Error('This analysis kind needs a capture');
  // Limits were checked on upload; here the file is only decoded.
  const wav = readWav(task.wavBytes, { maxDurationSeconds: 1e9, maxChannels: 4096, maxSampleRateHz: 1e7, minSampleRateHz: 1 });
  return { sampleRateHz: wav.sampleRateHz, channels: wav.channels };
}

function sweepOf(spec: AnalysisJobSpec): SweepParameters {
  return spec.stimulus?.parameters as unknown as SweepParameters;
}

function runEngine(task: EngineTask): AnalysisResult {
  const { spec, calibration } = task;
  switch (spec.kind) {
    case 'spectrum':
      return analyzeSpectrum(spec.spectrum!, { ...spectrumOptions(spec), ...(task.mask ? { mask: task.mask.mask } : {}) }) as unknown as AnalysisResult;
    case 'frequency_response':
      return analyzeSweepResponse(decodeCapture(task), sweepOf(spec), sweepResponseOptions(spec, spec.options, calibration) as never) as unknown as AnalysisResult;
    case 'distortion':
      return analyzeSweepDistortion(decodeCapture(task), sweepOf(spec), sweepDistortionOptions(spec, spec.options) as never) as unknown as AnalysisResult;
    case 'response_and_distortion':
      return analyzeSweepResponseAndDistortion(decodeCapture(task), sweepOf(spec), responseAndDistortionOptions(spec, calibration) as never) as unknown as AnalysisResult;
    case 'stepped_sine':
      return analyzeSteppedResponse(
        decodeCapture(task),
        spec.stimulus?.parameters as unknown as SteppedSineParameters,
        steppedResponseOptions(spec, calibration) as never,
      ) as unknown as AnalysisResult;
    case 'calibrator':
      return analyzeCalibratorCapture(decodeCapture(task), {
        ...spec.options,
        channel: spec.channels.measurement,
        statedLevelDbSpl: spec.calibrator!.statedLevelDbSpl,
        ...(spec.calibrator!.statedFrequencyHz !== undefined ? { statedFrequencyHz: spec.calibrator!.statedFrequencyHz } : {}),
      }) as unknown as AnalysisResult;
    case 'sensitivity':
      return spec.sensitivity?.source ? sensitivityFromResponse(task) : sensitivityResult(decodeCapture(task), task);
    case 'tone_distortion': {
      const capture = decodeCapture(task);
      const loopback = spec.channels.reference === null ? undefined : capture.channels[spec.channels.reference];
      return analyzeToneDistortion(
        { samples: capture.channels[spec.channels.measurement], sampleRateHz: capture.sampleRateHz, ...(loopback ? { loopbackSamples: loopback } : {}) },
        toneDistortionOptions(spec, calibration) as never,
      ) as unknown as AnalysisResult;
    }
  }
}

/** The smaller of the upper and lower limits' worst margins in `figures.mask`, as stored; null without either. */
function worstMarginOf(result: AnalysisResult): number | null {
  const mask = (result.figures as { mask?: { upper?: { worstMarginDb?: number } | null; lower?: { worstMarginDb?: number } | null } | null }).mask;
  const margins = [mask?.upper?.worstMarginDb, mask?.lower?.worstMarginDb].filter((margin): margin is number => typeof margin === 'number');
  return margins.length ? Math.min(...margins) : null;
}

/**
 * Runs one analysis, adds the calibration warnings and the mask verdict, and serialises the result once: the
 * stored text is what every later read returns. Pure: the same task gives the same text. The stored numbers keep
 * 7 significant digits (stored-precision.ts), and the mask verdict is judged on them.
 */
export function runAnalysis(task: EngineTask): EngineTaskOutput {
  const result = runEngine(task);
  const extra = [];
  if (LEVEL_KINDS.has(task.spec.kind) && !task.calibration && task.spec.sensitivity?.deviceType !== 'microphone') {
    extra.push(
      warning('uncalibrated', 'No calibration was applied: levels are relative (dB re the stimulus or dBFS), not dB SPL. Name a calibration or a rig input to get absolute levels.'),
    );
  }
  if (task.calibration?.expired) {
    extra.push(warning('calibration_expired', `Calibration ${task.calibration.id} had expired when the analysis ran; absolute levels may be off.`, { calibrationId: task.calibration.id }));
  }
  const rounded = withStoredPrecision({
    ...result,
    conventions: { ...result.conventions, numberPrecision: STORED_PRECISION_CONVENTION },
    warnings: [...result.warnings, ...extra],
  });
  // Judged on the stored numbers, so the verdict follows from what every reader gets back (and a mask derived
  // from stored golden curves lines up with the grid it is later judged on); the verdict's own figures are
  // rounded the same way.
  const { result: judged, verdict } = applyMaskVerdict(rounded, task);
  const stored = judged === rounded ? rounded : { ...judged, figures: { ...judged.figures, mask: withStoredPrecision((judged.figures as { mask?: unknown }).mask) } };
  return { resultJson: JSON.stringify(stored), verdict, worstMarginDb: worstMarginOf(stored), engineVersion: ENGINE_VERSION };
}
