import { describe, expect, it } from 'vitest';
import { toleranceRange } from './band-limits';
import type { LimitPoint } from './curve';
import { curveThrough } from './test-curves';

function foundHz(point: LimitPoint): number {
  if (point.status !== 'found') throw new Error(`expected a found limit, got ${point.status}`);
  return point.frequencyHz;
}

describe('"±X dB from A to B" range', () => {
  // Constructed trapezoid: −12 dB at 50 Hz rising 6 dB/octave to 0 dB at 200 Hz, flat to 5 kHz, falling
  // 6 dB/octave to −12 dB at 20 kHz. ±3 dB: A = 200·2^(−1/2) Hz, B = 5000·2^(1/2) Hz (hand-computed).
  const trapezoid: [number, number][] = [[50, -12], [200, 0], [5000, 0], [20000, -12]];
  const atOneKilohertz = { kind: 'at_frequency' as const, frequencyHz: 1000 };

  it('finds A and B on a trapezoid (hand-computed)', () => {
    const result = toleranceRange(curveThrough(trapezoid), { reference: atOneKilohertz, toleranceDb: 3 });
    expect(foundHz(result.lower)).toBeCloseTo(200 * 2 ** -0.5, 9);
    expect(foundHz(result.upper)).toBeCloseTo(5000 * 2 ** 0.5, 6);
  });

  it('stops at a peak above +X unless it is narrower than the ignored width', () => {
    // A +4 dB peak at 2 kHz spanning ±0.02 octave: it crosses +3 dB at 2000·2^(−0.02 + 0.02·3/4) Hz.
    const withPeak = curveThrough([
      [50, -12], [200, 0], [2000 * 2 ** -0.02, 0], [2000, 4], [2000 * 2 ** 0.02, 0], [5000, 0], [20000, -12],
    ]);
    const strict = toleranceRange(withPeak, { reference: atOneKilohertz, toleranceDb: 3 });
    expect(foundHz(strict.upper)).toBeCloseTo(2000 * 2 ** (-0.02 + (0.02 * 3) / 4), 6);
    const lenient = toleranceRange(withPeak, { reference: atOneKilohertz, toleranceDb: 3, ignoreExcursionsNarrowerThanOctaves: 1 / 9 });
    expect(foundHz(lenient.upper)).toBeCloseTo(5000 * 2 ** 0.5, 6);

    // With the peak inside the reference band, the band itself breaks ±3 dB: there is no range.
    const insideBand = toleranceRange(withPeak, {
      reference: { kind: 'band_mean', fromHz: 1000, toHz: 3000, average: 'db' },
      toleranceDb: 3,
    });
    expect(insideBand.lower.status).toBe('outside_at_reference_band');
    expect(insideBand.upper.status).toBe('outside_at_reference_band');
  });

  it('reports both ends beyond the measured range when ±X is never left', () => {
    const result = toleranceRange(curveThrough(trapezoid), { reference: atOneKilohertz, toleranceDb: 20 });
    expect(result.lower).toEqual({ status: 'beyond_measured_range', measuredEdgeHz: 50 });
    expect(result.upper).toEqual({ status: 'beyond_measured_range', measuredEdgeHz: 20000 });
  });
});
