import { EngineError } from '../errors';
import type { LinearSpectrum, MagnitudeCurve, SmoothingOptions } from './curve';
import { binLogIntegral } from './bin-integral';
import { curveLinearIntegral, curvePowerIntegral } from './integrands';
import { resampleCurve } from './interpolate';
import type { PiecewiseIntegral } from './piecewise-integral';
import { resolveSmoothingOptions, type ResolvedSmoothing } from './smoothing-options';
import { logFrequencyWindow, windowedMeans } from './smoothing-window';
import { validateCurve } from './validate-curve';

/**
 * Fractional-octave smoothing (Hatziantoniou & Mourjopoulos, JAES 48(4) 2000, from memory): each output point
 * f_c is the window-weighted mean over log frequency of the band f_c·2^(±1/(2N)), of |H|² ('power') or of H
 * itself ('complex'). The weighting is uniform in ln f (d(ln f) = df/f), so a linear-bin spectrum and a
 * log-sampled copy of the same response smooth to the same values.
 */

/** Levels are floored here so an empty band gives a finite number (−400 dB) rather than −Infinity. */
export const SMOOTHING_FLOOR_DB = -400;
const FLOOR_POWER = 10 ** (SMOOTHING_FLOOR_DB / 10);

function requireGrid(gridHz: Float64Array, firstHz: number, lastHz: number, lowerOpen: boolean): void {
  if (!(gridHz instanceof Float64Array) || gridHz.length === 0) {
    throw new EngineError('grid_empty', 'The output grid needs at least one frequency.', { field: 'gridHz' });
  }
  for (let i = 0; i < gridHz.length; i++) {
    const f = gridHz[i];
    const aboveFirst = lowerOpen ? f > firstHz : f >= firstHz;
    if (!Number.isFinite(f) || !aboveFirst || f > lastHz) {
      throw new EngineError('grid_outside_data', `Grid frequency ${f} Hz lies outside the data (${firstHz}–${lastHz} Hz).`, {
        field: `gridHz[${i}]`,
      });
    }
  }
}

function halfWidthLn(octaveFraction: number): number {
  return Math.LN2 / (2 * octaveFraction);
}

/** Smooth (or, with 'none', interpolate) a one-sided linear-bin spectrum onto `gridHz`. dB are re |H| = 1. */
export function smoothSpectrum(spectrum: LinearSpectrum, gridHz: Float64Array, options: SmoothingOptions): MagnitudeCurve {
  const settings = resolveSmoothingOptions(options);
  const { re, im, binSpacingHz } = spectrum;
  if (!(Number.isFinite(binSpacingHz) && binSpacingHz > 0)) {
    throw new EngineError('bin_spacing_invalid', 'binSpacingHz must be a finite positive number.', { field: 'spectrum.binSpacingHz' });
  }
  if (re.length !== im.length || re.length < 3) {
    throw new EngineError('spectrum_bins_invalid', 're and im need the same length, at least 3 bins.', { field: 'spectrum.im' });
  }
  requireGrid(gridHz, 0, (re.length - 1) * binSpacingHz, true);

  const complex = settings.averaging === 'complex';
  const channels: Float64Array[] = complex ? [re, im] : [powerOfBins(re, im)];
  for (const channel of channels) requireFinite(channel);
  const magnitudeDb = new Float64Array(gridHz.length);
  const phaseDeg = complex ? new Float64Array(gridHz.length) : undefined;
  const values = new Float64Array(channels.length);

  if (settings.octaveFraction === 'none') {
    for (let i = 0; i < gridHz.length; i++) {
      const position = gridHz[i] / binSpacingHz;
      const k = Math.min(re.length - 2, Math.floor(position));
      const t = position - k;
      for (let c = 0; c < channels.length; c++) values[c] = channels[c][k] + t * (channels[c][k + 1] - channels[c][k]);
      writePoint(values, complex, i, magnitudeDb, phaseDeg);
    }
  } else {
    const integrals = channels.map((channel) => binLogIntegral(channel, binSpacingHz));
    smoothOntoGrid(integrals, gridHz, settings, values, complex, magnitudeDb, phaseDeg);
  }
  const frequencyHz = Float64Array.from(gridHz);
  return phaseDeg ? { frequencyHz, magnitudeDb, phaseDeg } : { frequencyHz, magnitudeDb };
}

/**
 * Smooth a curve (any spacing, typically log-spaced) onto `gridHz` (default: its own frequencies). Power
 * averaging reads dB as linear in ln f between points and returns no phase; complex averaging needs `phaseDeg`,
 * reads re/im as linear in ln f (so the points must be dense enough for the phase, bulk delay removed) and
 * returns wrapped phase. 'none' reads the curve (and its phase, if any) on the grid.
 */
export function smoothCurve(curve: MagnitudeCurve, options: SmoothingOptions, gridHz?: Float64Array): MagnitudeCurve {
  const settings = resolveSmoothingOptions(options);
  validateCurve(curve);
  const grid = gridHz ?? curve.frequencyHz;
  const { frequencyHz } = curve;
  requireGrid(grid, frequencyHz[0], frequencyHz[frequencyHz.length - 1], false);
  const complex = settings.averaging === 'complex';
  if (complex && !curve.phaseDeg) {
    throw new EngineError('phase_required', 'Complex smoothing needs the curve’s phase.', { field: 'curve.phaseDeg' });
  }
  // No smoothing: the curve read on the grid, phase included when present.
  if (settings.octaveFraction === 'none') return resampleCurve(curve, grid);
  let integrals: PiecewiseIntegral[];
  if (complex && curve.phaseDeg) {
    const real = new Float64Array(frequencyHz.length);
    const imaginary = new Float64Array(frequencyHz.length);
    for (let i = 0; i < frequencyHz.length; i++) {
      const amplitude = 10 ** (curve.magnitudeDb[i] / 20);
      const radians = (curve.phaseDeg[i] * Math.PI) / 180;
      real[i] = amplitude * Math.cos(radians);
      imaginary[i] = amplitude * Math.sin(radians);
    }
    integrals = [curveLinearIntegral(frequencyHz, real), curveLinearIntegral(frequencyHz, imaginary)];
  } else {
    integrals = [curvePowerIntegral(frequencyHz, curve.magnitudeDb)];
  }
  const magnitudeDb = new Float64Array(grid.length);
  const phaseDeg = complex ? new Float64Array(grid.length) : undefined;
  smoothOntoGrid(integrals, grid, settings, new Float64Array(integrals.length), complex, magnitudeDb, phaseDeg);
  const outHz = Float64Array.from(grid);
  return phaseDeg ? { frequencyHz: outHz, magnitudeDb, phaseDeg } : { frequencyHz: outHz, magnitudeDb };
}

function smoothOntoGrid(
  integrals: PiecewiseIntegral[],
  gridHz: Float64Array,
  settings: ResolvedSmoothing,
  values: Float64Array,
  complex: boolean,
  magnitudeDb: Float64Array,
  phaseDeg: Float64Array | undefined,
): void {
  const window = logFrequencyWindow(halfWidthLn(settings.octaveFraction as number), settings.window);
  for (let i = 0; i < gridHz.length; i++) {
    windowedMeans(integrals, gridHz[i], window, values);
    writePoint(values, complex, i, magnitudeDb, phaseDeg);
  }
}

function writePoint(
  values: Float64Array,
  complex: boolean,
  index: number,
  magnitudeDb: Float64Array,
  phaseDeg: Float64Array | undefined,
): void {
  if (complex && phaseDeg) {
    const power = values[0] * values[0] + values[1] * values[1];
    magnitudeDb[index] = 10 * Math.log10(Math.max(power, FLOOR_POWER));
    phaseDeg[index] = (Math.atan2(values[1], values[0]) * 180) / Math.PI;
  } else {
    magnitudeDb[index] = 10 * Math.log10(Math.max(values[0], FLOOR_POWER));
  }
}

function powerOfBins(re: Float64Array, im: Float64Array): Float64Array {
  const power = new Float64Array(re.length);
  for (let k = 0; k < re.length; k++) power[k] = re[k] * re[k] + im[k] * im[k];
  return power;
}

function requireFinite(values: Float64Array): void {
  let sum = 0;
  for (let k = 0; k < values.length; k++) sum += values[k] * 0;
  if (sum !== 0) {
    const index = values.findIndex((v) => !Number.isFinite(v));
    throw new EngineError('spectrum_value_not_finite', `Spectrum bin ${index} is not a finite number.`, {
      field: `spectrum.re[${index}]`,
    });
  }
}
