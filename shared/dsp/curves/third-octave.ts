import { fractionalOctaveBands, type FractionalOctaveBand } from '@shared/units/bands';
import { EngineError } from '../errors';
import type { LinearSpectrum, MagnitudeCurve, ThirdOctaveBandValue } from './curve';
import { binLogIntegral } from './bin-integral';
import { curvePowerIntegral } from './integrands';
import { levelAtFrequencyDb } from './interpolate';
import type { PiecewiseIntegral } from './piecewise-integral';
import { validateCurve } from './validate-curve';

export interface ThirdOctaveOptions {
  /** Default 20 Hz: the band containing this frequency is the first. */
  startHz?: number;
  /** Default 20 kHz. */
  stopHz?: number;
}

function bandsFor(options: ThirdOctaveOptions): FractionalOctaveBand[] {
  const startHz = options.startHz ?? 20;
  const stopHz = options.stopHz ?? 20_000;
  if (!(Number.isFinite(startHz) && Number.isFinite(stopHz) && startHz > 0 && stopHz >= startHz && stopHz <= 1e6)) {
    throw new EngineError('band_table_range_invalid', `Band table range must satisfy 0 < start ≤ stop ≤ 1 MHz, got ${startHz}–${stopHz} Hz.`, {
      field: 'thirdOctave',
    });
  }
  return fractionalOctaveBands(3, startHz, stopHz);
}

function powerMeanDb(integral: PiecewiseIntegral, band: FractionalOctaveBand): number | null {
  if (band.lowerEdgeHz < integral.firstHz || band.upperEdgeHz > integral.lastHz) return null;
  const meanPower = integral.integrate(band.lowerEdgeHz, band.upperEdgeHz) / Math.log(band.upperEdgeHz / band.lowerEdgeHz);
  return 10 * Math.log10(Math.max(meanPower, 1e-40));
}

/**
 * The 1/3-octave table (IEC 61260-1 exact centres and edges, ISO 266 labels) of a curve: per band the power mean
 * over its edges, uniform in log frequency (what a 1/3-octave analyser reads for pink-noise excitation), and
 * the curve's value at the exact centre. A band not fully inside the curve gets bandLevelDb = null.
 */
export function thirdOctaveBandValues(curve: MagnitudeCurve, options: ThirdOctaveOptions = {}): ThirdOctaveBandValue[] {
  validateCurve(curve);
  const integral = curvePowerIntegral(curve.frequencyHz, curve.magnitudeDb);
  const first = curve.frequencyHz[0];
  const last = curve.frequencyHz[curve.frequencyHz.length - 1];
  return bandsFor(options).map((band) => ({
    exactHz: band.exactHz,
    nominalLabel: band.nominalLabel,
    lowerEdgeHz: band.lowerEdgeHz,
    upperEdgeHz: band.upperEdgeHz,
    bandLevelDb: powerMeanDb(integral, band),
    centreLevelDb: band.exactHz >= first && band.exactHz <= last ? levelAtFrequencyDb(curve, band.exactHz) : null,
  }));
}

/** The same table straight from linear FFT bins (power linear in f between bins); dB re |H| = 1. */
export function thirdOctaveBandValuesFromSpectrum(
  spectrum: LinearSpectrum,
  options: ThirdOctaveOptions = {},
): ThirdOctaveBandValue[] {
  const { re, im, binSpacingHz } = spectrum;
  if (!(Number.isFinite(binSpacingHz) && binSpacingHz > 0) || re.length !== im.length || re.length < 3) {
    throw new EngineError('spectrum_bins_invalid', 'A spectrum needs re and im of equal length ≥ 3 and a positive binSpacingHz.', {
      field: 'spectrum',
    });
  }
  const power = new Float64Array(re.length);
  for (let k = 0; k < re.length; k++) power[k] = re[k] * re[k] + im[k] * im[k];
  const badBin = power.findIndex((value) => !Number.isFinite(value));
  if (badBin >= 0) {
    throw new EngineError('spectrum_value_not_finite', `Spectrum bin ${badBin} is not a finite number.`, { field: `spectrum.re[${badBin}]` });
  }
  const integral = binLogIntegral(power, binSpacingHz);
  return bandsFor(options).map((band) => {
    const inside = band.exactHz <= integral.lastHz;
    let centreLevelDb: number | null = null;
    if (inside) {
      const position = band.exactHz / binSpacingHz;
      const k = Math.min(re.length - 2, Math.floor(position));
      const value = power[k] + (position - k) * (power[k + 1] - power[k]);
      centreLevelDb = 10 * Math.log10(Math.max(value, 1e-40));
    }
    return {
      exactHz: band.exactHz,
      nominalLabel: band.nominalLabel,
      lowerEdgeHz: band.lowerEdgeHz,
      upperEdgeHz: band.upperEdgeHz,
      bandLevelDb: powerMeanDb(integral, band),
      centreLevelDb,
    };
  });
}
