import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { gridNominalLabels, logFrequencyGrid } from './grid';

// ISO 266:1997 preferred 1/3-octave frequencies 20 Hz – 20 kHz.
const ISO_266_THIRD_OCTAVE = [
  '20', '25', '31.5', '40', '50', '63', '80', '100', '125', '160', '200', '250', '315', '400', '500', '630', '800',
  '1000', '1250', '1600', '2000', '2500', '3150', '4000', '5000', '6300', '8000', '10000', '12500', '16000', '20000',
];

describe('log-frequency grid', () => {
  it('gives the IEC 61260-1 base-10 1/3-octave frequencies 1000·10^(x/10), x = −17…13, with ISO 266 labels', () => {
    const grid = logFrequencyGrid({ pointsPerOctave: 3, startHz: 20, stopHz: 20000 });
    expect(grid.length).toBe(31);
    grid.forEach((f, i) => expect(f).toBeCloseTo(1000 * 10 ** ((i - 17) / 10), 9));
    expect(grid[17]).toBe(1000);
    expect(grid[0]).toBeCloseTo(19.953, 3); // IEC 61260-1: x = −17 ↔ 19.953 Hz
    expect(gridNominalLabels(grid)).toEqual(ISO_266_THIRD_OCTAVE);
  });

  it('gives the octave frequencies 31.62 … 15848.93 Hz (IEC 61260-1 base 10)', () => {
    const grid = logFrequencyGrid({ pointsPerOctave: 1, startHz: 25, stopHz: 20000 });
    const expected = [31.62, 63.1, 125.89, 251.19, 501.19, 1000, 1995.26, 3981.07, 7943.28, 15848.93];
    expect(grid.length).toBe(expected.length);
    grid.forEach((f, i) => expect(f).toBeCloseTo(expected[i], 2));
  });

  it('48 points per octave: 481 points over 20 Hz – 20 kHz, every other one an ISO 266 / R80 frequency', () => {
    const grid = logFrequencyGrid({ pointsPerOctave: 48, startHz: 20, stopHz: 20000 });
    expect(grid.length).toBe(481);
    const labels = gridNominalLabels(grid);
    labels.forEach((label, i) => expect(label === null).toBe(i % 2 === 1));
    expect(labels.filter((_, i) => i % 16 === 0)).toEqual(ISO_266_THIRD_OCTAVE);
  });

  it('rejects bad grid options with EngineErrors naming the field', () => {
    const cases: [Parameters<typeof logFrequencyGrid>[0], string][] = [
      [{ pointsPerOctave: 0, startHz: 20, stopHz: 20000 }, 'grid_points_per_octave_invalid'],
      [{ pointsPerOctave: 2.5, startHz: 20, stopHz: 20000 }, 'grid_points_per_octave_invalid'],
      [{ pointsPerOctave: 3, startHz: 0, stopHz: 20000 }, 'grid_start_invalid'],
      [{ pointsPerOctave: 3, startHz: 200, stopHz: 100 }, 'grid_stop_invalid'],
      [{ pointsPerOctave: 3, startHz: 0.001, stopHz: 100 }, 'grid_start_invalid'],
      [{ pointsPerOctave: 3, startHz: 20, stopHz: 2e6 }, 'grid_stop_invalid'],
    ];
    for (const [options, code] of cases) {
      let thrown: unknown = null;
      try {
        logFrequencyGrid(options);
      } catch (error) {
        thrown = error;
      }
      expect(thrown).toBeInstanceOf(EngineError);
      expect((thrown as EngineError).code).toBe(code);
      expect((thrown as EngineError).field).toMatch(/^grid\./);
    }
  });
});
