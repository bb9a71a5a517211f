import type { CircularImpulseResponse } from '../response/deconvolve';
import type { Conventions } from '../result/types';
import type { EngineWarning } from '../result/warnings';
import type { SweepDesign } from '../stimuli/sweep';
import type { ResolvedSweepDistortionOptions } from './sweep-options';
import { describeThdDefinitions } from './thd';
import { belowThreshold, maximumInBand, valueAtFrequency } from './summaries';
import { combineOrders, nullable, orderWindows, thdRCurve, type CombinedOrders } from './sweep-curves';
import { prePeakSamples } from './harmonic-windows';
import { sweepHarmonics, type SweepHarmonics } from './sweep-harmonics';
import type { NoiseDensity } from './sweep-noise';
import { sweepDistortionWarnings } from './sweep-warnings';

/** An analytic-inverse deconvolution buffer and the linear IR's exact peak in it. */
export interface ImpulseForDistortion {
  ir: CircularImpulseResponse;
  /** τ_1 in samples from the sweep's t = 0 (sub-sample). */
  linearPeakSamples: number;
}

export interface SweepDistortionPartInput {
  impulse: ImpulseForDistortion;
  design: SweepDesign;
  gridHz: Float64Array;
  options: ResolvedSweepDistortionOptions;
  noise: NoiseDensity | null;
  loopback: ImpulseForDistortion | null;
}

function summaryOf(gridHz: Float64Array, ratio: Float64Array, isUpperBound: Uint8Array, options: ResolvedSweepDistortionOptions) {
  const curve = { frequencyHz: gridHz, ratio, isUpperBound };
  const { summary } = options.common;
  return {
    maximum: maximumInBand(curve, summary.maxBandHz),
    atReference: valueAtFrequency(curve, summary.referenceHz),
    below: belowThreshold(curve, summary.belowPercent, summary.referenceHz),
  };
}

function harmonicsFor(input: SweepDistortionPartInput, impulse: ImpulseForDistortion, orders: number[], bandLimitHz: number, noise: NoiseDensity | null): SweepHarmonics {
  const { design, options, gridHz } = input;
  const fs = design.sampleRateHz;
  const recordedDecay = impulse.ir.usedCaptureSampleCount - design.sweepSampleCount;
  const room = Math.min(recordedDecay, impulse.ir.positiveSampleCount) - Math.ceil(impulse.linearPeakSamples);
  const pre = prePeakSamples({ orders, prePeakSeconds: options.prePeakSeconds, rateConstantSeconds: design.rateConstantSeconds, sampleRateHz: fs });
  const requested = options.linearWindowSeconds === null ? design.rateConstantSeconds * Math.LN2 * fs - pre : options.linearWindowSeconds * fs;
  return sweepHarmonics({
    buffer: impulse.ir.samples,
    sampleRateHz: fs,
    rateConstantSeconds: design.rateConstantSeconds,
    sweepAmplitude: design.amplitude,
    linearPeakSamples: impulse.linearPeakSamples,
    linearPostPeakSamples: Math.max(Math.round(0.002 * fs), Math.floor(Math.min(requested, room))),
    prePeakSeconds: options.prePeakSeconds,
    gridHz,
    orders,
    bandLimitHz,
    sweepBandHz: [design.parameters.startHz, design.parameters.stopHz],
    smoothing: options.octaveFraction,
    withPhase: options.includePhase,
    marginDb: options.common.marginDb,
    noise,
  });
}

function range(from: number, to: number): number[] {
  return Array.from({ length: to - from + 1 }, (_, i) => from + i);
}

/** Harmonic distortion, THD both ways, screening and summaries from one deconvolution buffer. */
export function sweepDistortionPart(input: SweepDistortionPartInput) {
  const { design, options, gridHz } = input;
  const fs = design.sampleRateHz;
  const bandLimitHz = Math.min(fs / 2, design.parameters.stopHz, options.common.upperLimitHz);
  const thdOrders = range(2, options.common.maxOrder);
  const harmonics = harmonicsFor(input, input.impulse, thdOrders, bandLimitHz, input.noise);
  const thdF = combineOrders(gridHz, harmonics.orders);
  const thdR = thdRCurve(thdF.ratio);
  const screeningOrders = options.common.screening ? range(options.common.screening.fromOrder, options.common.screening.toOrder) : null;
  const screeningHarmonics = screeningOrders ? harmonicsFor(input, input.impulse, screeningOrders, bandLimitHz, input.noise) : null;
  const screening: CombinedOrders | null = screeningHarmonics ? combineOrders(gridHz, screeningHarmonics.orders) : null;

  let chain: { thdF: CombinedOrders; near: boolean[] } | null = null;
  if (input.loopback) {
    const loopbackThd = combineOrders(gridHz, harmonicsFor(input, input.loopback, thdOrders, bandLimitHz, null).orders);
    const margin = options.common.chainResidualMarginDb;
    const near = Array.from(gridHz, (_, i) => 20 * Math.log10(thdF.ratio[i] / loopbackThd.ratio[i]) < margin);
    chain = { thdF: loopbackThd, near };
  }

  const warnings: EngineWarning[] = sweepDistortionWarnings({ gridHz, harmonics, thdF, bandLimitHz, options, screeningHarmonics, chainNear: chain?.near ?? null, noiseAvailable: input.noise !== null });
  const headline = options.common.thdHeadline;
  const preMs = (1000 * harmonics.linearPlan.window.preRollSamples) / fs;
  const conventions: Conventions = {
    thdDefinition: describeThdDefinitions(headline),
    thdHeadline: headline,
    harmonicOrders: `2..${options.common.maxOrder}; order n is read at f0 only where n·f0 ≤ ${bandLimitHz} Hz = min(Nyquist, sweep stop ${design.parameters.stopHz} Hz, stated limit ${options.common.upperLimitHz} Hz); orders used per frequency in curves.harmonicDistortion.ordersUsed`,
    harmonicAxis: 'HD_n(f0) = |H_n(n·f0)| / |H_1(f0)|: the n-th harmonic spectrum read at n·f0 and plotted at the fundamental frequency f0',
    harmonicSeparation: `synchronized sweep (Novak et al., JAES 63(10) 2015): h_n peaks L·ln(n) = ${design.rateConstantSeconds} s·ln(n) before h_1; windows tile without overlap, ${preMs.toFixed(2)} ms before each peak, ending ${preMs.toFixed(2)} ms before the next later IR's peak (h_1: ${(harmonics.linearPlan.postPeakSeconds * 1000).toFixed(1)} ms after its peak); half-Hann rise over the pre-peak part and fall over the last 25 %; the fractional part of L·ln(n)·fs applied as a linear phase; lowest trustworthy f0 of each order ≈ 1/(its window after the peak)`,
    harmonicSmoothing: options.octaveFraction === 'none' ? 'none (power interpolated between FFT bins)' : `1/${options.octaveFraction} octave power smoothing of every harmonic spectrum`,
    harmonicPhase: options.includePhase ? 'arg H_n(n·f0) in degrees with each IR’s own peak time τ_n removed (meaningful because the sweep is synchronized)' : 'not computed',
    noiseFloor: input.noise
      ? `${input.noise.description}; expected noise in each order's window Σw²·s(f)·|G(f)|², |G| = 2√(f/L)/(fs·A); a harmonic less than ${options.common.marginDb} dB above it is an upper bound (measured + floor), and any THD that includes one is an upper bound`
      : 'no stimulus-off part available: harmonics not checked against a noise floor',
    screening: options.common.screening
      ? `high-order screening (rub and buzz, loose particles): √(Σ_{n=${options.common.screening.fromOrder}..${options.common.screening.toOrder}} |H_n(n·f0)|²) / |H_1(f0)| over the orders with n·f0 ≤ ${bandLimitHz} Hz; count per frequency in curves.screening.ordersUsed`
      : 'off',
    summaries: `maximum over ${options.common.summary.maxBandHz[0]}–${options.common.summary.maxBandHz[1]} Hz (grid points); value at ${options.common.summary.referenceHz} Hz (dB linear in log f); below ${options.common.summary.belowPercent} %: widest interval containing ${options.common.summary.referenceHz} Hz`,
  };

  const figures = {
    thdHeadline: headline,
    bandLimitHz,
    maxOrder: options.common.maxOrder,
    orderWindows: orderWindows(harmonics.orders, fs),
    prePeakMs: preMs,
    linearWindowMs: harmonics.linearPlan.postPeakSeconds * 1000,
    noiseFloorAvailable: input.noise !== null,
    thdF: summaryOf(gridHz, thdF.ratio, thdF.isUpperBound, options),
    thdR: summaryOf(gridHz, thdR, thdF.isUpperBound, options),
    screening: screening && options.common.screening
      ? { ...options.common.screening, maximum: maximumInBand({ frequencyHz: gridHz, ratio: screening.ratio, isUpperBound: screening.isUpperBound }, options.common.summary.maxBandHz) }
      : null,
    chainResidualNearCount: chain ? chain.near.filter(Boolean).length : null,
  };
  const curves = {
    harmonicDistortion: {
      frequencyHz: Array.from(gridHz),
      thdFPercent: nullable(thdF.ratio, 100),
      thdRPercent: nullable(thdR, 100),
      thdIsUpperBound: Array.from(thdF.isUpperBound, Boolean),
      ordersUsed: Array.from(thdF.ordersUsed),
      highestOrderUsed: Array.from(thdF.highestOrderUsed),
      ordersBelowTrustworthyFrequency: Array.from(thdF.ordersBelowTrustworthyFrequency),
      orders: harmonics.orders.map((curve) => ({
        order: curve.order,
        percent: nullable(curve.ratio, 100),
        isUpperBound: Array.from(curve.isUpperBound, Boolean),
        floorPercent: nullable(curve.floorRatio, 100),
        ...(curve.phaseDeg ? { phaseDeg: nullable(curve.phaseDeg) } : {}),
      })),
      linearSignalToNoiseDb: harmonics.linearSignalToNoiseDb ? nullable(harmonics.linearSignalToNoiseDb) : null,
    },
    screening:
      screening && screeningHarmonics
        ? {
            frequencyHz: Array.from(gridHz),
            percent: nullable(screening.ratio, 100),
            isUpperBound: Array.from(screening.isUpperBound, Boolean),
            ordersUsed: Array.from(screening.ordersUsed),
            ordersBelowTrustworthyFrequency: Array.from(screening.ordersBelowTrustworthyFrequency),
            orderWindows: orderWindows(screeningHarmonics.orders, fs),
          }
        : null,
    chainResidual: chain ? { thdFPercent: nullable(chain.thdF.ratio, 100), nearChainResidual: chain.near } : null,
  };
  return { figures, curves, conventions, warnings, harmonics };
}
