import { lobeBinCount, type ToneSpectrum } from './tone-spectrum';

/**
 * Noise floor near a frequency, as the mean noise power per bin of the analysed spectrum. Taken as the median of
 * neighbouring bin powers outside every tone's main lobe, divided by ln 2: the median of an exponential (χ²₂)
 * variable, which is what a bin of Gaussian noise is, equals its mean times ln 2 (statistics, standard). The
 * median ignores the odd spur that a mean would pick up.
 * With a stimulus-off record the same is done on that record's own spectrum (same window), converted through
 * the power spectral density so its length may differ.
 */
export interface NoiseFloorSource {
  /** Mean noise power per bin of `target` near `frequencyHz` (|X|² units of `target`). */
  meanBinPowerAt(frequencyHz: number): number;
  description: string;
}

const MIN_NEIGHBOUR_BINS = 16;
const INITIAL_HALF_SPAN_BINS = 32;

function medianOf(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/** Bins that belong to a tone (DC, the fundamental and every harmonic below Nyquist), each ± its lobe plus one bin. */
export function toneExclusionMask(spectrum: ToneSpectrum, fundamentalHz: number): Uint8Array {
  const excluded = new Uint8Array(spectrum.power.length);
  const guard = spectrum.lobeHalfWidthBins + 1;
  const mark = (centre: number) => {
    for (let k = Math.max(0, centre - guard); k <= Math.min(excluded.length - 1, centre + guard); k++) excluded[k] = 1;
  };
  mark(0);
  for (let order = 1; order * fundamentalHz < spectrum.sampleRateHz / 2; order++) {
    mark(Math.round((order * fundamentalHz) / spectrum.binHz));
  }
  return excluded;
}

function localMedianPower(power: Float64Array, excluded: Uint8Array, centre: number): number {
  for (let halfSpan = INITIAL_HALF_SPAN_BINS; ; halfSpan *= 2) {
    const values: number[] = [];
    const from = Math.max(0, centre - halfSpan);
    const to = Math.min(power.length - 1, centre + halfSpan);
    for (let k = from; k <= to; k++) if (!excluded[k]) values.push(power[k]);
    const coversAll = from === 0 && to === power.length - 1;
    if (values.length >= MIN_NEIGHBOUR_BINS || (coversAll && values.length > 0)) return medianOf(values) / Math.LN2;
    if (coversAll) return 0;
  }
}

/** Floor from the analysed record's own neighbouring bins. */
export function neighbourBinFloor(spectrum: ToneSpectrum, fundamentalHz: number): NoiseFloorSource {
  const excluded = toneExclusionMask(spectrum, fundamentalHz);
  return {
    meanBinPowerAt: (frequencyHz) => localMedianPower(spectrum.power, excluded, Math.round(frequencyHz / spectrum.binHz)),
    description: `median power of up to ±${INITIAL_HALF_SPAN_BINS} neighbouring bins (widened until ≥ ${MIN_NEIGHBOUR_BINS}) outside every tone's main lobe, divided by ln 2`,
  };
}

/** Floor from a stimulus-off record analysed with the same window, converted via its PSD to `target`'s bins. */
export function silentRecordFloor(target: ToneSpectrum, silent: ToneSpectrum): NoiseFloorSource {
  const excluded = new Uint8Array(silent.power.length);
  for (let k = 0; k <= Math.min(excluded.length - 1, silent.lobeHalfWidthBins + 1); k++) excluded[k] = 1;
  // PSD per bin: S = rmsSquaredPerBinPower·|X|² / binHz; in target bins: S·binHz_target / rmsSquaredPerBinPower_target.
  const scale = (silent.rmsSquaredPerBinPower / silent.binHz) * (target.binHz / target.rmsSquaredPerBinPower);
  return {
    meanBinPowerAt: (frequencyHz) => scale * localMedianPower(silent.power, excluded, Math.round(frequencyHz / silent.binHz)),
    description: `stimulus-off record (${silent.length} samples, same window): median power of neighbouring bins divided by ln 2, scaled by its PSD`,
  };
}

/** RMS² of the noise inside one tone's measurement bandwidth (its main lobe). */
export function floorRmsSquaredAt(spectrum: ToneSpectrum, floor: NoiseFloorSource, frequencyHz: number): number {
  return floor.meanBinPowerAt(frequencyHz) * lobeBinCount(spectrum) * spectrum.rmsSquaredPerBinPower;
}

export interface ClassifiedLevel {
  /** Measured RMS, or the upper bound when not clearly above the floor. */
  rms: number;
  isUpperBound: boolean;
  /** Measured level over the floor in the same bandwidth, dB. */
  aboveFloorDb: number;
  floorRms: number;
}

/**
 * A level at least `marginDb` above the floor in the same bandwidth is a value. Otherwise only a bound is known;
 * it is taken as measured + floor RMS (triangle inequality |h| ≤ |h + n| + |n|, with the noise at its RMS), so a
 * noise draw that partly cancels the harmonic does not give a bound below it.
 */
export function classifyAgainstFloor(measuredRmsSquared: number, floorRmsSquared: number, marginDb: number): ClassifiedLevel {
  const measuredRms = Math.sqrt(measuredRmsSquared);
  const floorRms = Math.sqrt(floorRmsSquared);
  const aboveFloorDb = floorRmsSquared > 0 ? 10 * Math.log10(measuredRmsSquared / floorRmsSquared) : Number.POSITIVE_INFINITY;
  if (aboveFloorDb >= marginDb) return { rms: measuredRms, isUpperBound: false, aboveFloorDb, floorRms };
  return { rms: measuredRms + floorRms, isUpperBound: true, aboveFloorDb, floorRms };
}
