import { EngineError } from '../errors';
import { ENGINE_VERSION } from '../result/engine-version';
import type { AnalysisResult, Conventions } from '../result/types';
import type { EngineWarning } from '../result/warnings';
import { requireSampleRateHz } from '../stimuli/parameter-checks';
import { chainResidualWarnings, compareWithChainResidual, type ChainResidualComparison } from '../distortion/chain-residual';
import { clippingWarnings, requireChannel, selectSegment } from '../distortion/capture-checks';
import { residualSpectrumCurve, type ResidualSpectrumCurve } from '../distortion/residual-spectrum';
import { describeThdDefinitions } from '../distortion/thd';
import { describeThdPlusNoiseBand } from '../distortion/thd-plus-noise';
import { toneFigures, toneWarnings, type ToneFigures } from '../distortion/tone-figures';
import { calibratedLevels, resolveToneOptions, type ResolvedToneOptions, type ToneAnalysisOptions } from '../distortion/tone-options';
import { analyzeToneRecord, type ToneRecordAnalysis } from '../distortion/tone-record';
import type { SegmentSpec } from '../distortion/capture-checks';

export interface ToneDistortionInput {
  /** Measurement channel, full scale ±1. */
  samples: Float64Array;
  sampleRateHz: number;
  /** Loopback (reference) channel of the same capture: analysed the same way as the chain's own residual. */
  loopbackSamples?: Float64Array;
  /** A separate stimulus-off capture for the noise floor (otherwise the neighbouring bins are used). */
  silentSamples?: Float64Array;
}

export interface ToneDistortionOptions extends ToneAnalysisOptions {
  /** Stimulus frequency (required for coherent analysis; otherwise the largest tone is taken). */
  toneFrequencyHz?: number;
  /** Part of the capture to analyse (skip the settling). Default: all of it. */
  analysisSegment?: SegmentSpec;
  /** A stimulus-off part of the same capture for the noise floor. */
  silentSegment?: SegmentSpec;
}

export type ToneDistortionFigures = ToneFigures &
  Record<string, unknown> & {
    chainResidual: (ToneFigures & ChainResidualComparison) | null;
  };

export interface ToneDistortionCurves {
  residualSpectrum: ResidualSpectrumCurve;
  chainResidualSpectrum?: ResidualSpectrumCurve;
  [name: string]: unknown;
}

/** The conventions every tone-based distortion result states. */
export function toneConventions(options: ResolvedToneOptions, analysis: ToneRecordAnalysis): Conventions {
  const spectrum = analysis.spectrum;
  const window =
    spectrum.method === 'coherent'
      ? 'coherent: rectangular window over an integer number of cycles (stimulus and capture on one clock), ENBW 1 bin'
      : `${spectrum.windowName} (CG ${spectrum.coherentGain.toFixed(4)}, ENBW ${spectrum.equivalentNoiseBandwidthBins.toFixed(4)} bins), levels from main-lobe power sums (±${spectrum.lobeHalfWidthBins} bins) corrected by CG and ENBW; fundamental level: ${analysis.fundamentalLevelMethod}`;
  return {
    magnitudeReference: 'dB re the fundamental (HD, THD, THD+N); fundamental level in dBFS',
    dbfsConvention: 'aes17_sine',
    window,
    thdDefinition: describeThdDefinitions(options.common.thdHeadline),
    thdHeadline: options.common.thdHeadline,
    harmonicOrders: `2..${options.common.maxOrder}; orders above the band limit min(Nyquist, ${options.common.upperLimitHz} Hz) dropped and listed`,
    thdPlusNoiseBandwidth: describeThdPlusNoiseBand(options.thdPlusNoiseBand, analysis.thdPlusNoise.bandHz[1]),
    noiseFloor: `${analysis.noiseFloorDescription}; a harmonic less than ${options.common.marginDb} dB above the floor in its own bandwidth is an upper bound (measured + floor RMS), and any THD that includes one is an upper bound`,
    screening: options.common.screening
      ? `high-order screening: √(Σ V_n²)/V_1 over orders ${options.common.screening.fromOrder}..${options.common.screening.toOrder} within the band limit`
      : 'off',
  };
}

function analyse(samples: Float64Array, input: ToneDistortionInput, raw: ToneDistortionOptions | undefined, options: ResolvedToneOptions, silent?: Float64Array) {
  return analyzeToneRecord(
    samples,
    input.sampleRateHz,
    {
      method: options.method,
      window: options.window,
      toneFrequencyHz: raw?.toneFrequencyHz,
      maxOrder: options.common.maxOrder,
      upperLimitHz: options.common.upperLimitHz,
      marginDb: options.common.marginDb,
      thdPlusNoiseBand: options.thdPlusNoiseBand,
      screeningOrders: options.common.screening,
    },
    silent,
  );
}

/** Harmonic distortion, THD (both forms), THD+N and SINAD of a single-tone capture. */
export function analyzeToneDistortion(
  input: ToneDistortionInput,
  rawOptions?: ToneDistortionOptions,
): AnalysisResult<ToneDistortionFigures, ToneDistortionCurves> {
  if (typeof input !== 'object' || input === null) throw new EngineError('input_invalid', 'input must be an object.', { field: 'input' });
  const sampleRateHz = requireSampleRateHz(input.sampleRateHz, 'input.sampleRateHz');
  const channel = requireChannel(input.samples, 'input.samples');
  const options = resolveToneOptions(rawOptions, 'options', ['toneFrequencyHz', 'analysisSegment', 'silentSegment']);
  if (rawOptions?.toneFrequencyHz !== undefined && !(Number.isFinite(rawOptions.toneFrequencyHz) && rawOptions.toneFrequencyHz > 0 && rawOptions.toneFrequencyHz < sampleRateHz / 2)) {
    throw new EngineError('tone_frequency_invalid', `options.toneFrequencyHz must lie between 0 and ${sampleRateHz / 2} Hz.`, {
      field: 'options.toneFrequencyHz',
    });
  }
  const record = selectSegment(channel, sampleRateHz, rawOptions?.analysisSegment, 'options.analysisSegment');
  let silent: Float64Array | undefined;
  if (input.silentSamples !== undefined) silent = requireChannel(input.silentSamples, 'input.silentSamples');
  if (rawOptions?.silentSegment !== undefined) silent = selectSegment(channel, sampleRateHz, rawOptions.silentSegment, 'options.silentSegment');

  const analysis = analyse(record, input, rawOptions, options, silent);
  const figures = toneFigures(analysis, options.common.thdHeadline);
  const warnings: EngineWarning[] = [...clippingWarnings(record, 'measurement channel'), ...toneWarnings(analysis, { minSnrDb: options.minSnrDb, label: 'tone' })];
  const curves: ToneDistortionCurves = {
    residualSpectrum: residualSpectrumCurve(analysis.spectrum, analysis.fundamentalHz, analysis.fundamentalPeak, options.residualPointsPerOctave, 20),
  };

  let chainResidual: ToneDistortionFigures['chainResidual'] = null;
  if (input.loopbackSamples !== undefined) {
    const loopbackChannel = requireChannel(input.loopbackSamples, 'input.loopbackSamples');
    if (loopbackChannel.length !== channel.length) {
      throw new EngineError('loopback_length_mismatch', 'The loopback channel must have as many samples as the measurement channel.', {
        field: 'input.loopbackSamples',
      });
    }
    const loopbackRecord = selectSegment(loopbackChannel, sampleRateHz, rawOptions?.analysisSegment, 'options.analysisSegment');
    const loopback = analyse(loopbackRecord, input, { ...rawOptions, toneFrequencyHz: rawOptions?.toneFrequencyHz ?? analysis.fundamentalHz }, options);
    const loopbackFigures = toneFigures(loopback, options.common.thdHeadline);
    const comparison = compareWithChainResidual(figures, loopbackFigures, options.common.chainResidualMarginDb);
    chainResidual = { ...loopbackFigures, ...comparison };
    warnings.push(...clippingWarnings(loopbackRecord, 'loopback channel'), ...chainResidualWarnings(comparison, options.common.chainResidualMarginDb, 'tone'));
    curves.chainResidualSpectrum = residualSpectrumCurve(loopback.spectrum, loopback.fundamentalHz, loopback.fundamentalPeak, options.residualPointsPerOctave, 20);
  }

  const conventions = toneConventions(options, analysis);
  conventions.residualSpectrum = curves.residualSpectrum.description;
  return {
    kind: 'tone_distortion',
    engineVersion: ENGINE_VERSION,
    conventions,
    figures: { ...figures, ...calibratedLevels(figures.fundamentalLevelDbfs, options.levelCalibration), chainResidual },
    curves,
    warnings,
  };
}
