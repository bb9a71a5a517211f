import { windowSamples } from '../windows';
import type { TonePowerSpectrum } from './tone-power-spectrum';
import { largestBin, lobeCentroidHz, lobePower, localNoisePerBin, tonePowerSpectrum } from './tone-power-spectrum';

/**
 * Spectral lines (narrow peaks) of a windowed power spectrum: a line is a local maximum whose bin stands at least
 * `minProminenceDb` above the local noise per bin. A sine gives one line; a sweep or noise gives none in a
 * long record; harmonics, hum or a second tone give further lines.
 */
export interface SpectralLine {
  bin: number;
  frequencyHz: number;
  /** Mean square of the line (lobe sum minus the local noise in the lobe), (full-scale units)². */
  meanSquare: number;
  /** Peak bin over the local noise per bin, dB. */
  prominenceDb: number;
  /** Local noise per bin, (full-scale units)². */
  noisePerBin: number;
}

/** Search range of a line: clear of the DC region and of the Nyquist edge by two main lobes. */
export function lineSearchRange(spectrum: TonePowerSpectrum): { fromBin: number; toBin: number } {
  const margin = 2 * spectrum.lobeHalfWidthBins + 1;
  return { fromBin: margin, toBin: Math.max(margin, spectrum.power.length - 1 - margin) };
}

/** Describe the line at `bin`: noise-corrected lobe power, centroid frequency and prominence. */
export function lineAt(spectrum: TonePowerSpectrum, bin: number): SpectralLine {
  const { power, lobeHalfWidthBins: half, binHz } = spectrum;
  const noisePerBin = localNoisePerBin(power, bin, 2 * half, 40 * half);
  const lobe = lobePower(power, bin, half);
  const meanSquare = Math.max(lobe - noisePerBin * (2 * half + 1), lobe * 1e-3);
  return {
    bin,
    frequencyHz: lobeCentroidHz(power, bin, half, binHz),
    meanSquare,
    prominenceDb: 10 * Math.log10(power[bin] / Math.max(noisePerBin, Number.MIN_VALUE)),
    noisePerBin,
  };
}

/** The strongest line of the spectrum, or null when its peak is not prominent enough. */
export function strongestLine(spectrum: TonePowerSpectrum, minProminenceDb: number): SpectralLine | null {
  const { fromBin, toBin } = lineSearchRange(spectrum);
  const line = lineAt(spectrum, largestBin(spectrum.power, fromBin, toBin));
  return line.prominenceDb >= minProminenceDb ? line : null;
}

/**
 * Other prominent lines whose peak bin is within `relativeDb` of the main line's peak bin, outside three
 * main-lobe half-widths of it (strongest first).
 */
export function otherLines(spectrum: TonePowerSpectrum, main: SpectralLine, relativeDb: number, minProminenceDb: number): SpectralLine[] {
  const { power, lobeHalfWidthBins: half } = spectrum;
  const { fromBin, toBin } = lineSearchRange(spectrum);
  const threshold = power[main.bin] * 10 ** (relativeDb / 10);
  const found: SpectralLine[] = [];
  for (let k = fromBin; k <= toBin; k++) {
    if (power[k] < threshold || Math.abs(k - main.bin) <= 3 * half) continue;
    if (largestBin(power, Math.max(0, k - half), Math.min(power.length - 1, k + half)) !== k) continue;
    const line = lineAt(spectrum, k);
    if (line.prominenceDb >= minProminenceDb) found.push(line);
  }
  return found.sort((a, b) => b.meanSquare - a.meanSquare);
}

export interface BlockReading {
  /** Mean square of the tone in the block, at the main line's frequency. */
  toneMeanSquare: number;
  /** Frequency of the block's strongest prominent line, Hz, or null when the block has none. */
  lineFrequencyHz: number | null;
}

/** Split the capture into whole blocks and read the tone level at `toneFrequencyHz` and each block's own line. */
export function readBlocks(
  samples: Float64Array,
  sampleRateHz: number,
  blockLength: number,
  toneFrequencyHz: number | null,
  minProminenceDb: number,
): BlockReading[] {
  const readings: BlockReading[] = [];
  const window = windowSamples('flat_top', blockLength);
  for (let start = 0; start + blockLength <= samples.length; start += blockLength) {
    const spectrum = tonePowerSpectrum(samples.subarray(start, start + blockLength), sampleRateHz, 'flat_top', window);
    const line = strongestLine(spectrum, minProminenceDb);
    const toneBin = toneFrequencyHz === null ? null : Math.round(toneFrequencyHz / spectrum.binHz);
    readings.push({
      toneMeanSquare: toneBin === null ? 0 : lobePower(spectrum.power, toneBin, spectrum.lobeHalfWidthBins),
      lineFrequencyHz: line ? line.frequencyHz : null,
    });
  }
  return readings;
}
