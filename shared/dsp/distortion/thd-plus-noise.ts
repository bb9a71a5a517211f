import { aWeightingDb } from '../../units/weighting';
import type { ToneSpectrum } from './tone-spectrum';

export type ResidualWeighting = 'none' | 'a';

export interface ThdPlusNoiseBand {
  lowHz: number;
  highHz: number;
  weighting: ResidualWeighting;
}

export interface ThdPlusNoiseReading {
  /** RMS of everything in band except DC and the fundamental's main lobe (weighted when stated). */
  residualRms: number;
  /** residual / √(V_1² + residual²). */
  ratio: number;
  /** 20·log10(V_1 / residual). */
  sinadDb: number;
  /** The band actually used (upper edge clipped to Nyquist). */
  bandHz: [number, number];
}

/**
 * THD+N in the FFT form of a notch-and-band-limit measurement (AES17 style, from memory): sum the power of every
 * bin in [low, high] except DC's and the fundamental's main lobes, with the window's noise-power correction
 * (2/(N·Σw²) per bin), optionally A-weighted (IEC 61672-1) on the residual only, and relate it to the total
 * V_1² + residual².
 */
export function thdPlusNoise(
  spectrum: ToneSpectrum,
  fundamentalHz: number,
  fundamentalRms: number,
  band: ThdPlusNoiseBand,
): ThdPlusNoiseReading {
  const { binHz, power } = spectrum;
  const highHz = Math.min(band.highHz, spectrum.sampleRateHz / 2);
  const guard = spectrum.lobeHalfWidthBins;
  const fundamentalBin = Math.round(fundamentalHz / binHz);
  let sum = 0;
  for (let k = Math.max(guard + 1, Math.ceil(band.lowHz / binHz)); k <= Math.min(power.length - 1, Math.floor(highHz / binHz)); k++) {
    if (Math.abs(k - fundamentalBin) <= guard) continue;
    const weight = band.weighting === 'a' ? 10 ** (aWeightingDb(k * binHz) / 10) : 1;
    sum += power[k] * weight;
  }
  const residualRms = Math.sqrt(sum * spectrum.rmsSquaredPerBinPower);
  return {
    residualRms,
    ratio: residualRms / Math.sqrt(fundamentalRms * fundamentalRms + residualRms * residualRms),
    sinadDb: 20 * Math.log10(fundamentalRms / residualRms),
    bandHz: [band.lowHz, highHz],
  };
}

export function describeThdPlusNoiseBand(band: ThdPlusNoiseBand, usedHighHz: number): string {
  const weighting = band.weighting === 'a' ? 'A-weighted residual (IEC 61672-1)' : 'unweighted';
  return `${band.lowHz}–${usedHighHz} Hz, ${weighting}; THD+N = residual RMS (all in-band bins except DC and the fundamental's main lobe) over √(V_1² + residual²); SINAD = 20·log10(V_1 / residual)`;
}
