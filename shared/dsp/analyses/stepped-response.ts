import { ENGINE_VERSION } from '../result/engine-version';
import type { AnalysisResult } from '../result/types';
import { warning, type EngineWarning } from '../result/warnings';
import { coherentBin, recordEnergy } from '../response/coherent-bin';
import { EngineError } from '../errors';
import { designSteppedSine, type SteppedSineParameters, type SteppedSinePlan } from '../stimuli/stepped-sine';
import type { BandLimitsResult, ThirdOctaveBandValue, ToleranceRangeResult } from '../curves';
import { channelWarnings, requireCapture, type CaptureInput } from './capture-checks';
import { deriveCurveOutputs } from './derived-curve-outputs';
import { magnitudeScale } from './magnitude-reference';
import { resolveSteppedResponseOptions, type SteppedResponseOptions } from './stepped-response-options';

/**
 * Response from a stepped-sine capture: per step, the fundamental's coherent DFT bin k over the step's N-sample
 * window (exactly k cycles of f' = k·fs/N, so no window is needed and nothing leaks). Level of the measurement
 * channel in dBFS (AES17: peak amplitude 2|X[k]|/N, a full-scale sine = 0 dBFS); gain and phase relative to the
 * stimulus tone A·sin(2πk(m + m0)/N) (its bin is A·N/2·e^(j(2πk·m0/N − π/2))), or to the loopback channel's bin.
 * Tone-to-residual = fundamental power over the rest of the window's power (noise and distortion).
 */
export interface SteppedResponseFigures {
  stepCount: number;
  analysedStepCount: number;
  lowestToneToResidualDb: number | null;
  normalisationReferenceLevelDb: number | null;
  bandLimits: BandLimitsResult | null;
  toleranceRange: ToleranceRangeResult | null;
}

export interface SteppedResponseCurves {
  exactHz: number[];
  nominalLabel: string[];
  /** f' = k·fs/N actually played and analysed. */
  frequencyHz: number[];
  /** Measurement channel level of the fundamental, dBFS AES17. */
  levelDbfs: number[];
  /** Gain in the stated magnitude reference (normalised if asked). */
  magnitudeDb: number[];
  /** Phase vs the stimulus (or the loopback), wrapped to (−180°, 180°]. */
  phaseDeg: number[];
  toneToResidualDb: number[];
  analysisCycles: number[];
  analysisSampleCount: number[];
  thirdOctave: ThirdOctaveBandValue[] | null;
}

export type SteppedResponseResult = AnalysisResult<SteppedResponseFigures, SteppedResponseCurves>;

function planFrom(stimulus: SteppedSineParameters | SteppedSinePlan): SteppedSinePlan {
  const maybePlan = stimulus as Partial<SteppedSinePlan>;
  return maybePlan.kind === 'stepped_sine' && maybePlan.parameters
    ? designSteppedSine(maybePlan.parameters, 'stimulus')
    : designSteppedSine(stimulus as SteppedSineParameters, 'stimulus');
}

export function analyzeSteppedResponse(
  capture: CaptureInput,
  stimulus: SteppedSineParameters | SteppedSinePlan,
  options: SteppedResponseOptions = {},
): SteppedResponseResult {
  const input = requireCapture(capture);
  const resolved = resolveSteppedResponseOptions(options, input.channels.length);
  const plan = planFrom(stimulus);
  if (plan.sampleRateHz !== input.sampleRateHz) {
    throw new EngineError(
      'sample_rate_mismatch',
      `The stepped-sine plan runs at ${plan.sampleRateHz} Hz but the capture at ${input.sampleRateHz} Hz; coherent analysis needs the plan's rate.`,
      { field: 'stimulus.sampleRateHz' },
    );
  }
  const y = input.channels[resolved.measurementChannel];
  const x = resolved.referenceChannel === null ? null : input.channels[resolved.referenceChannel];
  const warnings: EngineWarning[] = channelWarnings(y, resolved.measurementChannel, 'measurement');
  if (x) warnings.push(...channelWarnings(x, resolved.referenceChannel as number, 'reference'));

  const offset = Math.round(resolved.captureOffsetSeconds * plan.sampleRateHz);
  const steps = plan.steps.filter((step) => offset + step.analysisStartSample + step.analysisSampleCount <= y.length);
  if (steps.length < plan.steps.length) {
    warnings.push(
      warning('capture_shorter_than_stimulus', `The capture ends before step ${steps.length + 1} of ${plan.steps.length}; the remaining steps were not analysed.`, {
        analysedStepCount: steps.length,
        stepCount: plan.steps.length,
      }),
    );
  }
  if (steps.length === 0) {
    throw new EngineError('capture_too_short', 'The capture ends before the first step’s analysis window.', { field: 'capture' });
  }
  const rows = steps.map((step) => {
    const start = offset + step.analysisStartSample;
    const n = step.analysisSampleCount;
    const k = step.analysisCycles;
    const yk = coherentBin(y, start, n, k);
    const yPower = yk.re * yk.re + yk.im * yk.im;
    let xRe: number;
    let xIm: number;
    if (x) {
      const xk = coherentBin(x, start, n, k);
      xRe = xk.re;
      xIm = xk.im;
    } else {
      const m0 = step.analysisStartSample - step.startSample;
      const theta = (2 * Math.PI * ((k * m0) % n)) / n - Math.PI / 2;
      xRe = ((plan.amplitude * n) / 2) * Math.cos(theta);
      xIm = ((plan.amplitude * n) / 2) * Math.sin(theta);
    }
    const xPower = xRe * xRe + xIm * xIm;
    const hRe = (yk.re * xRe + yk.im * xIm) / xPower;
    const hIm = (yk.im * xRe - yk.re * xIm) / xPower;
    const tonePower = (2 * yPower) / n;
    const residual = Math.max(recordEnergy(y, start, n) - tonePower, 0);
    return {
      levelDbfs: 20 * Math.log10(Math.max((2 * Math.sqrt(yPower)) / n, 1e-20)),
      gainDb: 10 * Math.log10(Math.max(hRe * hRe + hIm * hIm, 1e-40)),
      phaseDeg: (Math.atan2(hIm, hRe) * 180) / Math.PI,
      toneToResidualDb: residual > 0 ? Math.min(10 * Math.log10(tonePower / residual), 400) : 400,
      xPower,
    };
  });
  let driveLevelDbfs = plan.parameters.levelDbfs;
  if (x) {
    const i = Math.floor(rows.length / 2);
    driveLevelDbfs = 20 * Math.log10(Math.max((2 * Math.sqrt(rows[i].xPower)) / steps[i].analysisSampleCount, 1e-20));
  }
  const scale = magnitudeScale(
    resolved,
    x ? 'loopback' : 'stimulus',
    driveLevelDbfs,
    x ? "the loopback channel's tone level at the middle step" : 'the plan level',
  );
  warnings.push(...scale.warnings);
  const frequencyHz = Float64Array.from(steps, (s) => s.analysedFrequencyHz);
  const magnitudeDb = Float64Array.from(rows, (r) => r.gainDb + scale.offsetDb);
  const derived =
    steps.length >= 2
      ? deriveCurveOutputs({ frequencyHz, magnitudeDb }, resolved, 'options')
      : null;
  if (derived) warnings.push(...derived.warnings);
  const lowest = Math.min(...rows.map((r) => r.toneToResidualDb));
  if (lowest < resolved.lowSnrThresholdDb) {
    const worst = rows.findIndex((r) => r.toneToResidualDb === lowest);
    warnings.push(
      warning('low_snr', `The tone-to-residual ratio falls to ${lowest.toFixed(1)} dB at ${steps[worst].nominalLabel} Hz (threshold ${resolved.lowSnrThresholdDb} dB).`, {
        toneToResidualDb: lowest,
        frequencyHz: steps[worst].analysedFrequencyHz,
      }),
    );
  }
  return {
    kind: 'stepped_sine',
    engineVersion: ENGINE_VERSION,
    conventions: {
      magnitudeReference: scale.description,
      dbfsConvention: 'aes17_sine',
      window: 'rectangular over a whole number of cycles per step (coherent DFT at bin k, f′ = k·fs/N)',
      grid: `1/${plan.parameters.bandsPerOctave}-octave steps at the exact IEC 61260-1 base-10 frequencies, ISO 266 nominal labels`,
      normalisation: derived ? derived.normalisationDescription : 'none',
      phase: x ? 'phase of H = Y[k]/X[k] vs the loopback channel, wrapped to (−180°, 180°]' : 'phase vs the stimulus tone, wrapped to (−180°, 180°]; includes any latency',
      calibration: scale.calibrationDescription,
      stimulus: `${plan.formula}; settle max(${plan.parameters.settleSeconds} s, ${plan.parameters.settleCycles} periods), at least ${plan.parameters.analysisCycles} cycles and ${plan.parameters.analysisSeconds} s analysed, level ${plan.parameters.levelDbfs} dBFS peak`,
      timeZero: 'start of the plan’s file in the capture (captureOffsetSeconds)',
    },
    figures: {
      stepCount: plan.steps.length,
      analysedStepCount: steps.length,
      lowestToneToResidualDb: lowest,
      normalisationReferenceLevelDb: derived ? derived.normalisationReferenceLevelDb : null,
      bandLimits: derived ? derived.bandLimits : null,
      toleranceRange: derived ? derived.toleranceRange : null,
    },
    curves: {
      exactHz: steps.map((s) => s.exactHz),
      nominalLabel: steps.map((s) => s.nominalLabel),
      frequencyHz: Array.from(frequencyHz),
      levelDbfs: rows.map((r) => r.levelDbfs),
      magnitudeDb: derived ? Array.from(derived.curve.magnitudeDb) : Array.from(magnitudeDb),
      phaseDeg: rows.map((r) => r.phaseDeg),
      toneToResidualDb: rows.map((r) => r.toneToResidualDb),
      analysisCycles: steps.map((s) => s.analysisCycles),
      analysisSampleCount: steps.map((s) => s.analysisSampleCount),
      thirdOctave: derived ? derived.thirdOctave : null,
    },
    warnings,
  };
}
