import { estimateFundamental } from './fundamental';
import { classifyAgainstFloor, floorRmsSquaredAt, neighbourBinFloor, silentRecordFloor, type NoiseFloorSource } from './noise-floor';
import { thdFromHarmonics, type ThdPair } from './thd';
import { thdPlusNoise, type ThdPlusNoiseBand, type ThdPlusNoiseReading } from './thd-plus-noise';
import {
  lobeFitsSpectrum,
  tonePowerRmsSquared,
  toneSpectrum,
  type ToneAnalysisMethod,
  type ToneSpectrum,
  type ToneWindowName,
} from './tone-spectrum';

export const MAX_REPORTED_SNR_DB = 300;

/** Resolved (validated) options for one tone record. */
export interface ToneRecordOptions {
  method: ToneAnalysisMethod;
  window: ToneWindowName;
  /** Stimulus frequency when known (required for coherent analysis). */
  toneFrequencyHz?: number;
  /** Highest harmonic order K (orders 2..K). */
  maxOrder: number;
  /** Stated upper analysis limit; the band limit is min(Nyquist, this). */
  upperLimitHz: number;
  /** A harmonic must exceed its floor by this much to count as measured. */
  marginDb: number;
  thdPlusNoiseBand: ThdPlusNoiseBand;
  /** High-order screening orders [from, to], or null. */
  screeningOrders: { fromOrder: number; toOrder: number } | null;
}

export interface HarmonicReading {
  order: number;
  frequencyHz: number;
  /** RMS, or the upper bound on it. */
  rms: number;
  isUpperBound: boolean;
  /** Noise RMS in the same bandwidth. */
  floorRms: number;
  aboveFloorDb: number;
}

export interface ScreeningReading {
  /** √(Σ V_n²)/V_1 over the orders within the band limit. */
  ratio: number;
  isUpperBound: boolean;
  ordersUsed: number;
}

export interface ToneRecordAnalysis {
  spectrum: ToneSpectrum;
  fundamentalHz: number;
  fundamentalPeak: number;
  fundamentalRms: number;
  fundamentalLevelMethod: string;
  /** RMS from the analysis window's main-lobe sum: the denominator of every ratio, so window effects cancel. */
  fundamentalRmsForRatios: number;
  cyclesInRecord: number;
  bandLimitHz: number;
  harmonics: HarmonicReading[];
  /** Orders 2..K above the band limit (or whose main lobe would not fit below Nyquist). */
  droppedOrders: number[];
  thd: ThdPair;
  thdPlusNoise: ThdPlusNoiseReading;
  /** Fundamental over the in-band noise (residual less the measured harmonics), dB. */
  signalToNoiseDb: number;
  screening: ScreeningReading | null;
  noiseFloorDescription: string;
}

function readHarmonic(
  spectrum: ToneSpectrum,
  floor: NoiseFloorSource,
  order: number,
  frequencyHz: number,
  marginDb: number,
): HarmonicReading {
  const measured = tonePowerRmsSquared(spectrum, frequencyHz);
  const classified = classifyAgainstFloor(measured, floorRmsSquaredAt(spectrum, floor, frequencyHz), marginDb);
  return { order, frequencyHz, ...classified };
}

function withinBand(spectrum: ToneSpectrum, frequencyHz: number, bandLimitHz: number): boolean {
  return frequencyHz <= bandLimitHz && lobeFitsSpectrum(spectrum, frequencyHz);
}

/** Fundamental, harmonics 2..K with floors, THD both ways, THD+N, SINAD and optional screening of one record. */
export function analyzeToneRecord(
  record: ArrayLike<number>,
  sampleRateHz: number,
  options: ToneRecordOptions,
  silentRecord?: ArrayLike<number>,
): ToneRecordAnalysis {
  const spectrum = toneSpectrum(record, sampleRateHz, options.method, options.window);
  const fundamental = estimateFundamental(record, spectrum, options.toneFrequencyHz);
  const f0 = fundamental.frequencyHz;
  const floor = silentRecord
    ? silentRecordFloor(spectrum, toneSpectrum(silentRecord, sampleRateHz, options.method, options.window))
    : neighbourBinFloor(spectrum, f0);
  const bandLimitHz = Math.min(sampleRateHz / 2, options.upperLimitHz);
  const fundamentalRmsForRatios = Math.sqrt(tonePowerRmsSquared(spectrum, f0));

  const harmonics: HarmonicReading[] = [];
  const droppedOrders: number[] = [];
  for (let order = 2; order <= options.maxOrder; order++) {
    if (withinBand(spectrum, order * f0, bandLimitHz)) {
      harmonics.push(readHarmonic(spectrum, floor, order, order * f0, options.marginDb));
    } else {
      droppedOrders.push(order);
    }
  }
  const thd = thdFromHarmonics(fundamentalRmsForRatios, harmonics);
  const tnReading = thdPlusNoise(spectrum, f0, fundamentalRmsForRatios, options.thdPlusNoiseBand);

  let harmonicPowerInBand = 0;
  for (const harmonic of harmonics) {
    const inBand = harmonic.frequencyHz >= options.thdPlusNoiseBand.lowHz && harmonic.frequencyHz <= tnReading.bandHz[1];
    if (inBand && !harmonic.isUpperBound) harmonicPowerInBand += harmonic.rms ** 2;
  }
  const noisePower = Math.max(tnReading.residualRms ** 2 - harmonicPowerInBand, Number.MIN_VALUE);

  let screening: ScreeningReading | null = null;
  if (options.screeningOrders) {
    let sum = 0;
    let ordersUsed = 0;
    let isUpperBound = false;
    for (let order = options.screeningOrders.fromOrder; order <= options.screeningOrders.toOrder; order++) {
      if (!withinBand(spectrum, order * f0, bandLimitHz)) continue;
      const reading = readHarmonic(spectrum, floor, order, order * f0, options.marginDb);
      sum += reading.rms ** 2;
      isUpperBound ||= reading.isUpperBound;
      ordersUsed++;
    }
    screening = { ratio: ordersUsed > 0 ? Math.sqrt(sum) / fundamentalRmsForRatios : 0, isUpperBound, ordersUsed };
  }

  return {
    spectrum,
    fundamentalHz: f0,
    fundamentalPeak: fundamental.amplitudePeak,
    fundamentalRms: fundamental.amplitudePeak / Math.SQRT2,
    fundamentalLevelMethod: fundamental.levelMethod,
    fundamentalRmsForRatios,
    cyclesInRecord: f0 / spectrum.binHz,
    bandLimitHz,
    harmonics,
    droppedOrders,
    thd,
    thdPlusNoise: tnReading,
    // Capped so a noiseless synthetic record still gives a finite (JSON-safe) figure.
    signalToNoiseDb: Math.min(MAX_REPORTED_SNR_DB, 10 * Math.log10(fundamentalRmsForRatios ** 2 / noisePower)),
    screening,
    noiseFloorDescription: floor.description,
  };
}
