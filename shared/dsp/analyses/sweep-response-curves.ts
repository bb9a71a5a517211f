import { gridNominalLabels, logFrequencyGrid, smoothSpectrum, type MagnitudeCurve } from '../curves';
import { EngineError } from '../errors';
import { groupDelayFromPhase, radiansToDegrees, unwrapGridPhase, unwrappedPhaseOnGrid } from '../response/phase';
import type { WindowedSpectrum } from '../response/windowed-spectrum';
import type { SweepDesign } from '../stimuli/sweep';
import type { ResolvedSweepResponseOptions } from './sweep-response-options';

/**
 * The response on the log grid: smoothed magnitude (dB re |H| = 1, before any calibration offset), phase with the
 * bulk delay removed (unwrapped from the grid point nearest 1 kHz, or the band's geometric centre if 1 kHz is
 * outside it), and total group delay. With complex smoothing the phase is the smoothed one; otherwise it is the
 * raw phase of the bins, interpolated.
 */
export interface GridResponse {
  gridHz: Float64Array;
  nominalLabels: (string | null)[];
  curve: MagnitudeCurve;
  groupDelaySeconds: Float64Array;
  gridDescription: { pointsPerOctave: number; startHz: number; stopHz: number };
}

export function responseOnGrid(
  spectrum: WindowedSpectrum,
  design: SweepDesign,
  delaySeconds: number,
  options: ResolvedSweepResponseOptions,
  field: string,
): GridResponse {
  const startHz = options.grid.startHz ?? design.parameters.startHz;
  const stopHz = options.grid.stopHz ?? design.parameters.stopHz;
  const nyquistHz = design.sampleRateHz / 2;
  if (startHz >= nyquistHz) {
    throw new EngineError('grid_above_nyquist', `${field}.grid.startHz must be below the Nyquist frequency ${nyquistHz} Hz.`, {
      field: `${field}.grid.startHz`,
    });
  }
  const fullGrid = logFrequencyGrid({ pointsPerOctave: options.grid.pointsPerOctave, startHz, stopHz });
  // A defaulted edge keeps the grid inside the sweep band (the grid rule admits points up to half a step outside).
  const lowestHz = options.grid.startHz === null ? startHz : 0;
  const highestHz = options.grid.stopHz === null ? Math.min(stopHz, nyquistHz) : nyquistHz;
  const gridHz = fullGrid.filter((f) => f > 0 && f >= lowestHz && f <= highestHz);
  if (gridHz.length < 2) {
    throw new EngineError('grid_too_small', `The output grid ${startHz}–${stopHz} Hz holds fewer than two points below Nyquist.`, {
      field: `${field}.grid`,
    });
  }
  const { octaveFraction, averaging, window } = options.smoothing;
  const smoothed = smoothSpectrum(spectrum, gridHz, { octaveFraction, averaging, window });
  const anchorHz = gridHz[0] <= 1000 && gridHz[gridHz.length - 1] >= 1000 ? 1000 : Math.sqrt(gridHz[0] * gridHz[gridHz.length - 1]);
  const phaseRad =
    smoothed.phaseDeg && averaging === 'complex'
      ? unwrapGridPhase(gridHz, smoothed.phaseDeg.map((deg) => (deg * Math.PI) / 180), anchorHz)
      : unwrappedPhaseOnGrid(spectrum.re, spectrum.im, spectrum.binSpacingHz, gridHz, anchorHz);
  return {
    gridHz,
    nominalLabels: gridNominalLabels(gridHz),
    curve: { frequencyHz: gridHz, magnitudeDb: smoothed.magnitudeDb, phaseDeg: radiansToDegrees(phaseRad) },
    groupDelaySeconds: groupDelayFromPhase(gridHz, phaseRad, delaySeconds),
    gridDescription: { pointsPerOctave: options.grid.pointsPerOctave, startHz, stopHz },
  };
}

