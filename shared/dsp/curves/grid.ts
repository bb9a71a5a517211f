import { R80_PREFERRED_NUMBERS } from '@shared/units/bands';
import { EngineError } from '../errors';

export interface LogGridOptions {
  /** Integer 1…96. */
  pointsPerOctave: number;
  startHz: number;
  stopHz: number;
}

/**
 * Log-frequency grid of base-10 fractional-octave frequencies f_k = 1000·10^(3k/(10·b)) for b points per
 * octave (IEC 61260-1 base-10 octave G = 10^(3/10); the grid always contains 1 kHz). A point belongs to the
 * grid when it lies within half a grid step of [startHz, stopHz], so "20 Hz – 20 kHz" at 1/3 octave starts at
 * the exact 19.953 Hz point (nominal 20 Hz) and ends at 19 953 Hz (nominal 20 kHz).
 */
export function logFrequencyGrid(options: LogGridOptions): Float64Array {
  const { pointsPerOctave, startHz, stopHz } = options;
  if (!(Number.isInteger(pointsPerOctave) && pointsPerOctave >= 1 && pointsPerOctave <= 96)) {
    throw new EngineError('grid_points_per_octave_invalid', `pointsPerOctave must be an integer from 1 to 96, got ${pointsPerOctave}.`, {
      field: 'grid.pointsPerOctave',
    });
  }
  if (!(Number.isFinite(startHz) && startHz >= 0.01 && startHz <= 1e6)) {
    throw new EngineError('grid_start_invalid', `startHz must be from 0.01 Hz to 1 MHz, got ${startHz}.`, { field: 'grid.startHz' });
  }
  if (!(Number.isFinite(stopHz) && stopHz > startHz && stopHz <= 1e6)) {
    throw new EngineError('grid_stop_invalid', `stopHz must be above startHz and at most 1 MHz, got ${stopHz}.`, {
      field: 'grid.stopHz',
    });
  }
  const decadesPerStep = 0.3 / pointsPerOctave;
  const firstStep = Math.ceil(Math.log10(startHz / 1000) / decadesPerStep - 0.5);
  const lastStep = Math.floor(Math.log10(stopHz / 1000) / decadesPerStep + 0.5);
  // At most 96 points per octave over 0.01 Hz – 1 MHz: about 2 550 points.
  const count = lastStep - firstStep + 1;
  const grid = new Float64Array(Math.max(count, 0));
  for (let i = 0; i < grid.length; i++) grid[i] = 1000 * 10 ** ((firstStep + i) * decadesPerStep);
  return grid;
}

export function describeLogGrid(options: LogGridOptions): string {
  return (
    `${options.pointsPerOctave} points per octave, f = 1000·10^(3k/(10·${options.pointsPerOctave})) Hz ` +
    `(IEC 61260-1 base-10), ${options.startHz}–${options.stopHz} Hz (points within half a step of the range)`
  );
}

/**
 * Nominal label of each frequency that sits on a whole number of R80 steps (1/80 decade) from 1 kHz, taken from
 * the ISO 3 preferred numbers that ISO 266 uses (every 1/3-octave, 1/6-octave-grid and 1/12-octave point of the
 * base-10 grid, every other 1/48-octave point); null elsewhere.
 */
export function gridNominalLabels(frequencyHz: Float64Array): (string | null)[] {
  return Array.from(frequencyHz, (f) => {
    const steps = 80 * Math.log10(f / 1000);
    const whole = Math.round(steps);
    if (Math.abs(steps - whole) > 1e-6) return null;
    const decade = Math.floor(whole / 80);
    const member = R80_PREFERRED_NUMBERS[whole - 80 * decade];
    return String(Number((member * 10 ** (decade + 3)).toPrecision(3)));
  });
}
