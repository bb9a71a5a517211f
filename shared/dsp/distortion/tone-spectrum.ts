import { windowFigures, windowSamples, WINDOW_DEFINITIONS, type WindowName } from '../windows';
import { realDft } from './dft';

/**
 * 'coherent': rectangular window over an integer number of cycles (stimulus ours, shared clock): each tone sits on
 * one bin, no leakage, ENBW = 1. 'windowed': a low-sidelobe cosine-sum window, every level read as the power sum
 * of its main lobe with the window's coherent-gain and noise-bandwidth corrections.
 */
export type ToneAnalysisMethod = 'coherent' | 'windowed';
export type ToneWindowName = Extract<WindowName, 'blackman_harris_4' | 'blackman_harris_7'>;

/** Power spectrum of one tone record with the scale factors that turn bin sums into RMS². */
export interface ToneSpectrum {
  method: ToneAnalysisMethod;
  windowName: WindowName;
  sampleRateHz: number;
  length: number;
  binHz: number;
  /** |X[k]|², bins 0..⌊N/2⌋. */
  power: Float64Array;
  /** The windowed record's complex spectrum (kept for phase read-outs). */
  re: Float64Array;
  im: Float64Array;
  /** Window samples (null for coherent: rectangular). */
  window: Float64Array | null;
  /** Σw. */
  windowSum: number;
  /** RMS² of a one-sided bin: 2/(N·Σw²) (Harris 1978: V² = 2·Σ|X|²/(N²·CG²·ENBW)). */
  rmsSquaredPerBinPower: number;
  /** Bins either side of a tone that belong to its main lobe (0 for coherent). */
  lobeHalfWidthBins: number;
  coherentGain: number;
  equivalentNoiseBandwidthBins: number;
}

export function toneSpectrum(
  record: ArrayLike<number>,
  sampleRateHz: number,
  method: ToneAnalysisMethod,
  windowName: ToneWindowName,
): ToneSpectrum {
  const length = record.length;
  const appliedWindow: WindowName = method === 'coherent' ? 'rectangular' : windowName;
  const window = method === 'coherent' ? null : windowSamples(appliedWindow, length);
  const weighted = new Float64Array(length);
  for (let n = 0; n < length; n++) weighted[n] = window ? record[n] * window[n] : record[n];
  const spectrum = realDft(weighted);
  const power = new Float64Array(spectrum.re.length);
  for (let k = 0; k < power.length; k++) power[k] = spectrum.re[k] ** 2 + spectrum.im[k] ** 2;
  const figures = window ? windowFigures(window) : { coherentGain: 1, equivalentNoiseBandwidthBins: 1, sumOfSquares: length };
  return {
    method,
    windowName: appliedWindow,
    sampleRateHz,
    length,
    binHz: sampleRateHz / length,
    power,
    re: spectrum.re,
    im: spectrum.im,
    window,
    windowSum: figures.coherentGain * length,
    rmsSquaredPerBinPower: 2 / (length * figures.sumOfSquares),
    lobeHalfWidthBins: method === 'coherent' ? 0 : WINDOW_DEFINITIONS[appliedWindow].mainLobeHalfWidthBins,
    coherentGain: figures.coherentGain,
    equivalentNoiseBandwidthBins: figures.equivalentNoiseBandwidthBins,
  };
}

/** Number of bins a tone's level is summed over. */
export function lobeBinCount(spectrum: ToneSpectrum): number {
  return 2 * spectrum.lobeHalfWidthBins + 1;
}

/** Nearest bin to a frequency. */
export function binOfFrequency(spectrum: ToneSpectrum, frequencyHz: number): number {
  return Math.round(frequencyHz / spectrum.binHz);
}

/** True when the whole main lobe around `frequencyHz` lies strictly between DC's lobe and the last bin. */
export function lobeFitsSpectrum(spectrum: ToneSpectrum, frequencyHz: number): boolean {
  const centre = binOfFrequency(spectrum, frequencyHz);
  const lastBin = spectrum.power.length - 1;
  return centre - spectrum.lobeHalfWidthBins > spectrum.lobeHalfWidthBins && centre + spectrum.lobeHalfWidthBins < lastBin;
}

/** RMS² of the tone at `frequencyHz`: main-lobe power sum (a single bin when coherent). */
export function tonePowerRmsSquared(spectrum: ToneSpectrum, frequencyHz: number): number {
  const centre = binOfFrequency(spectrum, frequencyHz);
  const h = spectrum.lobeHalfWidthBins;
  let sum = 0;
  for (let k = Math.max(0, centre - h); k <= Math.min(spectrum.power.length - 1, centre + h); k++) sum += spectrum.power[k];
  return sum * spectrum.rmsSquaredPerBinPower;
}

/** Sine-peak reading of one bin (2·|X[k]|/Σw): a tone on that bin reads its amplitude. */
export function binPeakAmplitude(spectrum: ToneSpectrum, bin: number): number {
  return (2 * Math.sqrt(spectrum.power[bin])) / spectrum.windowSum;
}
