import { warning, type EngineWarning } from '../result/warnings';
import { distortionValue, headlineThd, type DistortionValue, type ThdForm } from './thd';
import type { ToneRecordAnalysis } from './tone-record';

/** One harmonic as a result states it. */
export interface HarmonicFigure extends DistortionValue {
  order: number;
  frequencyHz: number;
  /** The noise floor in the harmonic's bandwidth, re the fundamental. */
  floorPercent: number;
  /** True when within the chain-residual margin of the loopback channel's own figure (only with a loopback). */
  nearChainResidual?: boolean;
}

export interface ToneFigures {
  fundamentalFrequencyHz: number;
  fundamentalLevelDbfs: number;
  thdF: DistortionValue;
  thdR: DistortionValue;
  thdHeadline: DistortionValue & { form: ThdForm };
  harmonics: HarmonicFigure[];
  ordersUsed: number[];
  droppedOrders: number[];
  bandLimitHz: number;
  thdPlusNoise: DistortionValue;
  sinadDb: number;
  signalToNoiseDb: number;
  screening: (DistortionValue & { ordersUsed: number }) | null;
}

/** Figures of one analysed record; every ratio is relative to the fundamental's main-lobe RMS. */
export function toneFigures(analysis: ToneRecordAnalysis, headline: ThdForm): ToneFigures {
  const v1 = analysis.fundamentalRmsForRatios;
  const harmonics = analysis.harmonics.map((h) => ({
    order: h.order,
    frequencyHz: h.frequencyHz,
    ...distortionValue(h.rms / v1, h.isUpperBound),
    floorPercent: (100 * h.floorRms) / v1,
  }));
  const screening = analysis.screening
    ? { ...distortionValue(analysis.screening.ratio, analysis.screening.isUpperBound), ordersUsed: analysis.screening.ordersUsed }
    : null;
  return {
    fundamentalFrequencyHz: analysis.fundamentalHz,
    fundamentalLevelDbfs: 20 * Math.log10(analysis.fundamentalPeak),
    thdF: analysis.thd.thdF,
    thdR: analysis.thd.thdR,
    thdHeadline: { ...headlineThd(analysis.thd, headline), form: headline },
    harmonics,
    ordersUsed: harmonics.map((h) => h.order),
    droppedOrders: analysis.droppedOrders,
    bandLimitHz: analysis.bandLimitHz,
    thdPlusNoise: distortionValue(analysis.thdPlusNoise.ratio),
    sinadDb: analysis.thdPlusNoise.sinadDb,
    signalToNoiseDb: analysis.signalToNoiseDb,
    screening,
  };
}

export interface ToneWarningLimits {
  minSnrDb: number;
  /** Prefix of the messages, e.g. "tone"; empty for none. */
  label: string;
}

/** The warnings one analysed record raises (clipping is checked on the capture by the caller). */
export function toneWarnings(analysis: ToneRecordAnalysis, limits: ToneWarningLimits): EngineWarning[] {
  const warnings: EngineWarning[] = [];
  const prefix = limits.label ? `${limits.label}: ` : '';
  const h = analysis.spectrum.lobeHalfWidthBins;
  const minimumCycles = analysis.spectrum.method === 'coherent' ? 2 : 2 * h + 2;
  if (analysis.cyclesInRecord < minimumCycles) {
    warnings.push(
      warning(
        'too_few_cycles',
        `${prefix}${analysis.cyclesInRecord.toFixed(1)} cycles in the record; the ${analysis.spectrum.windowName} analysis needs at least ${minimumCycles} to keep the fundamental's lobe clear of DC.`,
        { cycles: analysis.cyclesInRecord, minimumCycles },
      ),
    );
  }
  if (analysis.droppedOrders.length > 0) {
    warnings.push(
      warning(
        'harmonics_beyond_band_dropped',
        `${prefix}orders ${analysis.droppedOrders.join(', ')} lie above the band limit ${analysis.bandLimitHz} Hz and were left out of THD.`,
        { droppedOrders: analysis.droppedOrders.join(','), bandLimitHz: analysis.bandLimitHz },
      ),
    );
  }
  const bounded = analysis.harmonics.filter((x) => x.isUpperBound).map((x) => x.order);
  if (bounded.length > 0) {
    warnings.push(
      warning(
        'harmonic_below_noise_floor',
        `${prefix}orders ${bounded.join(', ')} are not clearly above the noise floor and are reported as upper bounds; THD is an upper bound.`,
        { orders: bounded.join(',') },
      ),
    );
  }
  if (analysis.signalToNoiseDb < limits.minSnrDb) {
    warnings.push(
      warning('low_snr', `${prefix}the fundamental is only ${analysis.signalToNoiseDb.toFixed(1)} dB above the in-band noise.`, {
        signalToNoiseDb: analysis.signalToNoiseDb,
        minSnrDb: limits.minSnrDb,
      }),
    );
  }
  return warnings;
}
