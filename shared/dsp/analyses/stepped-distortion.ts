import { compareWithChainResidual } from '../distortion/chain-residual';
import { nullable } from '../distortion/sweep-curves';
import { belowThreshold, maximumInBand, valueAtFrequency } from '../distortion/summaries';
import { toneFigures, toneWarnings, type ToneFigures } from '../distortion/tone-figures';
import { resolveToneOptions, type ResolvedToneOptions, type ToneAnalysisOptions } from '../distortion/tone-options';
import { analyzeToneRecord } from '../distortion/tone-record';
import { EngineError } from '../errors';
import { ENGINE_VERSION } from '../result/engine-version';
import type { AnalysisResult } from '../result/types';
import { warning, type EngineWarning } from '../result/warnings';
import { requireNumberInRange } from '../stimuli/parameter-checks';
import { designSteppedSine, type SteppedSineParameters, type SteppedSinePlan, type SteppedSineStep } from '../stimuli/stepped-sine';
import { channelWarnings, requireCapture, requireFiniteSamples, type CaptureInput } from './capture-checks';
import { resolveChannelIndex } from './channel-options';
import { toneConventions } from './tone-distortion';

/** Tone options plus where the plan sits in the capture; method defaults to 'coherent' (the plan's integer-cycle windows). */
export interface SteppedDistortionOptions extends ToneAnalysisOptions {
  measurementChannel?: number;
  loopbackChannel?: number | null;
  captureOffsetSeconds?: number;
}

function planFrom(stimulus: SteppedSineParameters | SteppedSinePlan): SteppedSinePlan {
  const maybePlan = stimulus as Partial<SteppedSinePlan>;
  return maybePlan?.kind === 'stepped_sine' && maybePlan.parameters
    ? designSteppedSine(maybePlan.parameters, 'stimulus')
    : designSteppedSine(stimulus as SteppedSineParameters, 'stimulus');
}

/** Per-step warnings folded into one warning per code, naming the steps. */
function foldWarnings(perStep: { step: SteppedSineStep; warnings: EngineWarning[] }[]): EngineWarning[] {
  const byCode = new Map<string, { first: EngineWarning; steps: string[] }>();
  for (const { step, warnings } of perStep) {
    for (const w of warnings) {
      const entry = byCode.get(w.code) ?? { first: w, steps: [] };
      entry.steps.push(step.nominalLabel);
      byCode.set(w.code, entry);
    }
  }
  return [...byCode.values()].map(({ first, steps }) =>
    warning(first.code, `${steps.length} step(s) (${steps.slice(0, 8).join(', ')}${steps.length > 8 ? ', …' : ''} Hz); at the first of them: ${first.message}`, {
      ...first.details,
      stepCount: steps.length,
      steps: steps.join(','),
    }),
  );
}

function summaries(frequencyHz: number[], rows: ToneFigures[], pick: (row: ToneFigures) => { valuePercent: number; isUpperBound: boolean }, options: ResolvedToneOptions) {
  const curve = { frequencyHz, ratio: rows.map((r) => pick(r).valuePercent / 100), isUpperBound: rows.map((r) => pick(r).isUpperBound) };
  const { summary } = options.common;
  return {
    maximum: maximumInBand(curve, summary.maxBandHz),
    atReference: valueAtFrequency(curve, summary.referenceHz),
    below: belowThreshold(curve, summary.belowPercent, summary.referenceHz),
  };
}

/** Harmonic distortion, THD both ways, THD+N and screening at every step of a stepped-sine capture. */
export function analyzeSteppedDistortion(
  capture: CaptureInput,
  stimulus: SteppedSineParameters | SteppedSinePlan,
  rawOptions: SteppedDistortionOptions = {},
): AnalysisResult {
  const input = requireCapture(capture);
  const withDefaults = { method: 'coherent', ...rawOptions } as SteppedDistortionOptions;
  const options = resolveToneOptions(withDefaults, 'options', ['measurementChannel', 'loopbackChannel', 'captureOffsetSeconds']);
  const measurementChannel = resolveChannelIndex(rawOptions.measurementChannel, 'options.measurementChannel', input.channels.length, 0) as number;
  const loopbackIndex = resolveChannelIndex(rawOptions.loopbackChannel, 'options.loopbackChannel', input.channels.length, null);
  const captureOffsetSeconds = requireNumberInRange(rawOptions.captureOffsetSeconds ?? 0, 'options.captureOffsetSeconds', 0, 600, 's');
  const plan = planFrom(stimulus);
  if (plan.sampleRateHz !== input.sampleRateHz) {
    throw new EngineError('sample_rate_mismatch', `The plan runs at ${plan.sampleRateHz} Hz but the capture at ${input.sampleRateHz} Hz.`, {
      field: 'stimulus.sampleRateHz',
    });
  }
  const y = input.channels[measurementChannel];
  const loopback = loopbackIndex === null ? null : input.channels[loopbackIndex];
  requireFiniteSamples(y, `capture.channels[${measurementChannel}]`);
  if (loopback) requireFiniteSamples(loopback, `capture.channels[${loopbackIndex}]`);
  const warnings: EngineWarning[] = [...channelWarnings(y, measurementChannel, 'measurement')];
  if (loopback) warnings.push(...channelWarnings(loopback, loopbackIndex as number, 'loopback'));

  const offset = Math.round(captureOffsetSeconds * plan.sampleRateHz);
  const steps = plan.steps.filter((s) => offset + s.analysisStartSample + s.analysisSampleCount <= y.length);
  if (steps.length === 0) throw new EngineError('capture_too_short', 'The capture ends before the first step’s analysis window.', { field: 'capture' });
  if (steps.length < plan.steps.length) {
    warnings.push(warning('capture_shorter_than_stimulus', `Only ${steps.length} of ${plan.steps.length} steps lie inside the capture.`, { analysedStepCount: steps.length }));
  }
  const toneOptions = (step: SteppedSineStep) => ({
    method: options.method,
    window: options.window,
    toneFrequencyHz: step.analysedFrequencyHz,
    maxOrder: options.common.maxOrder,
    upperLimitHz: options.common.upperLimitHz,
    marginDb: options.common.marginDb,
    thdPlusNoiseBand: options.thdPlusNoiseBand,
    screeningOrders: options.common.screening,
  });
  const record = (channel: Float64Array, step: SteppedSineStep) =>
    channel.subarray(offset + step.analysisStartSample, offset + step.analysisStartSample + step.analysisSampleCount);
  const perStep = steps.map((step) => {
    const analysis = analyzeToneRecord(record(y, step), plan.sampleRateHz, toneOptions(step));
    const figures = toneFigures(analysis, options.common.thdHeadline);
    const stepWarnings = toneWarnings(analysis, { minSnrDb: options.minSnrDb, label: '' });
    let nearChainResidual = false;
    if (loopback) {
      const chain = toneFigures(analyzeToneRecord(record(loopback, step), plan.sampleRateHz, toneOptions(step)), options.common.thdHeadline);
      const comparison = compareWithChainResidual(figures, chain, options.common.chainResidualMarginDb);
      nearChainResidual = comparison.thdNearChainResidual || comparison.thdPlusNoiseNearChainResidual;
      if (nearChainResidual || comparison.harmonicOrdersNearChainResidual.length > 0) {
        stepWarnings.push(warning('near_chain_residual', `THD, THD+N or an HD within ${options.common.chainResidualMarginDb} dB of the loopback channel's.`));
      }
    }
    return { step, analysis, figures, warnings: stepWarnings, nearChainResidual };
  });
  warnings.push(...foldWarnings(perStep));

  const rows = perStep.map((p) => p.figures);
  const frequencyHz = perStep.map((p) => p.step.analysedFrequencyHz);
  const orders = [];
  for (let order = 2; order <= options.common.maxOrder; order++) {
    const readings = rows.map((r) => r.harmonics.find((h) => h.order === order));
    orders.push({
      order,
      percent: readings.map((h) => (h ? h.valuePercent : null)),
      isUpperBound: readings.map((h) => Boolean(h?.isUpperBound)),
      floorPercent: readings.map((h) => (h ? h.floorPercent : null)),
    });
  }
  const conventions = toneConventions(options, perStep[0].analysis);
  conventions.stimulus = `${plan.formula}; steps at 1/${plan.parameters.bandsPerOctave}-octave IEC 61260-1 frequencies, each analysed over its integer-cycle window`;
  return {
    kind: 'stepped_sine',
    engineVersion: ENGINE_VERSION,
    conventions,
    figures: {
      stepCount: plan.steps.length,
      analysedStepCount: steps.length,
      thdHeadline: options.common.thdHeadline,
      thdF: summaries(frequencyHz, rows, (r) => r.thdF, options),
      thdR: summaries(frequencyHz, rows, (r) => r.thdR, options),
      thdPlusNoise: summaries(frequencyHz, rows, (r) => r.thdPlusNoise, options),
    },
    curves: {
      frequencyHz,
      exactHz: perStep.map((p) => p.step.exactHz),
      nominalLabel: perStep.map((p) => p.step.nominalLabel),
      fundamentalLevelDbfs: rows.map((r) => r.fundamentalLevelDbfs),
      thdFPercent: rows.map((r) => r.thdF.valuePercent),
      thdRPercent: rows.map((r) => r.thdR.valuePercent),
      thdIsUpperBound: rows.map((r) => r.thdF.isUpperBound),
      ordersUsed: rows.map((r) => r.ordersUsed.length),
      orders,
      thdPlusNoisePercent: rows.map((r) => r.thdPlusNoise.valuePercent),
      sinadDb: rows.map((r) => r.sinadDb),
      screeningPercent: nullable(rows.map((r) => (r.screening ? r.screening.valuePercent : Number.NaN))),
      screeningOrdersUsed: rows.map((r) => r.screening?.ordersUsed ?? 0),
      nearChainResidual: loopback ? perStep.map((p) => p.nearChainResidual) : null,
    },
    warnings,
  };
}
