import { sweepDistortionPart, type ImpulseForDistortion } from '../distortion/sweep-distortion-part';
import { resolveSweepDistortionOptions, type SweepDistortionOptions } from '../distortion/sweep-options';
import type { AnalysisResult } from '../result/types';
import type { SweepDesign, SweepParameters } from '../stimuli/sweep';
import { requireCapture, type CaptureInput } from './capture-checks';
import { impulseForDistortion, sweepNoiseDensity, type SweepDistortionPart } from './sweep-distortion';
import { analyzeSweepResponse } from './sweep-response';
import type { SweepImpulse } from './sweep-impulse';
import type { SweepResponseOptions } from './sweep-response-options';
import type { SweepResponseCurves, SweepResponseFigures } from './sweep-response-types';

export interface ResponseAndDistortionOptions {
  response?: SweepResponseOptions;
  /** measurementChannel, loopbackChannel and captureOffsetSeconds default to the response's (its referenceChannel is the loopback). */
  distortion?: Omit<SweepDistortionOptions, 'grid'>;
}

export type ResponseAndDistortionResult = AnalysisResult<
  SweepResponseFigures & { distortion: SweepDistortionPart['figures'] },
  SweepResponseCurves & Pick<SweepDistortionPart['curves'], 'harmonicDistortion' | 'screening' | 'chainResidual'>
>;

/**
 * Frequency response and harmonic distortion of one sweep capture, on the response's log grid. Without a loopback
 * division the response's own deconvolution (analytic inverse) is reused, so the capture is deconvolved once. With
 * a loopback division the response is relative to the loopback, whose division would also cancel the chain's own
 * harmonics, so distortion takes a second, analytic-inverse deconvolution of the measurement channel.
 */
export function analyzeSweepResponseAndDistortion(
  capture: CaptureInput,
  stimulus: SweepParameters | SweepDesign,
  options: ResponseAndDistortionOptions = {},
): ResponseAndDistortionResult {
  const input = requireCapture(capture);
  let observed: { impulse: SweepImpulse; design: SweepDesign; divided: boolean } | null = null;
  const response = analyzeSweepResponse(input, stimulus, options.response ?? {}, {
    onImpulse: (impulse, design, divided) => {
      observed = { impulse, design, divided };
    },
  });
  const seen = observed as unknown as { impulse: SweepImpulse; design: SweepDesign; divided: boolean };
  const responseOptions = options.response ?? {};
  const distortionOptions = {
    measurementChannel: responseOptions.measurementChannel,
    loopbackChannel: responseOptions.referenceChannel,
    captureOffsetSeconds: responseOptions.captureOffsetSeconds,
    ...options.distortion,
  };
  const resolved = resolveSweepDistortionOptions(distortionOptions, input.channels.length, 'options.distortion');
  const { design } = seen;
  const measurement = input.channels[resolved.measurementChannel];
  const reused = !seen.divided && resolved.measurementChannel === (responseOptions.measurementChannel ?? 0);
  const impulse: ImpulseForDistortion = reused
    ? { ir: seen.impulse.ir, linearPeakSamples: seen.impulse.peak.delaySamples }
    : impulseForDistortion(measurement, design, resolved);
  const loopback = resolved.loopbackChannel === null ? null : impulseForDistortion(input.channels[resolved.loopbackChannel], design, resolved);
  const part = sweepDistortionPart({
    impulse,
    design,
    gridHz: Float64Array.from(response.curves.frequencyHz),
    options: resolved,
    noise: sweepNoiseDensity(measurement, design, resolved),
    loopback,
  });
  return {
    kind: 'response_and_distortion',
    engineVersion: response.engineVersion,
    conventions: {
      ...response.conventions,
      ...part.conventions,
      distortionReference: 'HD_n, THD and screening in % or dB re the fundamental',
      distortionDeconvolution: reused
        ? 'the response’s analytic-inverse deconvolution, reused'
        : 'a separate analytic-inverse deconvolution of the measurement channel (the response divides by the loopback)',
    },
    figures: { ...response.figures, distortion: part.figures },
    curves: { ...response.curves, harmonicDistortion: part.curves.harmonicDistortion, screening: part.curves.screening, chainResidual: part.curves.chainResidual },
    warnings: [...response.warnings, ...part.warnings],
  };
}
