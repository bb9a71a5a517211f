import { logFrequencyGrid } from '../curves/grid';
import { binPeakAmplitude, type ToneSpectrum } from './tone-spectrum';

export interface ResidualSpectrumCurve {
  frequencyHz: number[];
  /** Largest bin in each grid cell, as a sine-peak reading in dB re the fundamental's amplitude; null = no bin. */
  levelDbRelFundamental: (number | null)[];
  description: string;
}

/**
 * The spectrum with the fundamental's main lobe removed, for plotting. Decimated to a log grid by keeping the
 * largest bin of each cell (f·2^(±1/(2·pointsPerOctave))), so harmonic peaks survive the decimation; each bin is
 * read as a sine amplitude (2·|X[k]|/Σw), so a harmonic shows at about its HD_n (within the window's scallop loss).
 */
export function residualSpectrumCurve(
  spectrum: ToneSpectrum,
  fundamentalHz: number,
  fundamentalPeak: number,
  pointsPerOctave: number,
  startHz: number,
): ResidualSpectrumCurve {
  const nyquistHz = spectrum.sampleRateHz / 2;
  const grid = logFrequencyGrid({ pointsPerOctave, startHz: Math.min(startHz, nyquistHz / 2), stopHz: nyquistHz });
  const halfStep = 2 ** (1 / (2 * pointsPerOctave));
  const fundamentalBin = Math.round(fundamentalHz / spectrum.binHz);
  const guard = spectrum.lobeHalfWidthBins;
  const lastBin = spectrum.power.length - 1;
  const frequencyHz: number[] = [];
  const levelDbRelFundamental: (number | null)[] = [];
  for (const centreHz of grid) {
    const from = Math.max(1, Math.ceil(centreHz / halfStep / spectrum.binHz));
    const to = Math.min(lastBin, Math.floor((centreHz * halfStep) / spectrum.binHz));
    let largestBin = -1;
    for (let k = from; k <= to; k++) {
      if (Math.abs(k - fundamentalBin) <= guard) continue;
      if (largestBin < 0 || spectrum.power[k] > spectrum.power[largestBin]) largestBin = k;
    }
    frequencyHz.push(centreHz);
    if (largestBin < 0) {
      levelDbRelFundamental.push(null);
      continue;
    }
    const amplitude = binPeakAmplitude(spectrum, largestBin);
    levelDbRelFundamental.push(amplitude > 0 ? 20 * Math.log10(amplitude / fundamentalPeak) : null);
  }
  return {
    frequencyHz,
    levelDbRelFundamental,
    description: `largest bin per 1/${pointsPerOctave}-octave cell, fundamental's main lobe removed, sine-peak reading (2·|X|/Σw) in dB re the fundamental`,
  };
}
