import { describe, expect, it } from 'vitest';
import { belowThreshold, maximumInBand, valueAtFrequency } from './summaries';

// Constructed curves whose answers follow by hand from "dB linear in log f between points" (common practice, no source).
const frequencyHz = [100, 200, 400, 800, 1000, 2000, 4000, 8000];
const percent = [4, 2, 0.5, 0.4, 0.3, 0.5, 2, 8];
const curve = { frequencyHz, ratio: percent.map((p) => p / 100), isUpperBound: [0, 0, 0, 1, 0, 0, 0, 0] };

describe('distortion summaries', () => {
  it('finds the maximum over a stated band and where it occurs', () => {
    const max = maximumInBand(curve, [150, 5000])!;
    expect(max.valuePercent).toBeCloseTo(2, 12);
    expect(max.frequencyHz).toBe(200); // ties keep the first (200 Hz and 4 kHz both 2 %)
    expect(maximumInBand(curve, [10_000, 20_000])).toBeNull();
  });

  it('reads THD at 1 kHz and interpolates between points in dB against log f', () => {
    expect(valueAtFrequency(curve, 1000)!.valuePercent).toBeCloseTo(0.3, 12);
    // Midway in log f between 100 Hz (4 %) and 400 Hz (0.5 %) lies 200 Hz, a point: 2 %. Between 2 and 4 kHz at
    // √(2·4) kHz the dB mean of 0.5 % and 2 % is 1 %.
    expect(valueAtFrequency(curve, Math.sqrt(2000 * 4000))!.valuePercent).toBeCloseTo(1, 10);
    expect(valueAtFrequency(curve, 50)).toBeNull();
    // A neighbour that is a bound makes the interpolated value a bound.
    expect(valueAtFrequency(curve, 900)!.isUpperBound).toBe(true);
  });

  it('gives "THD below 1 % from A to B" as the crossings around 1 kHz', () => {
    const result = belowThreshold(curve, 1, 1000);
    // Lower crossing between 200 Hz (2 %, +6.02 dB re 1 %) and 400 Hz (0.5 %, −6.02 dB): midway in log f, 282.8 Hz.
    expect(result.lower.status).toBe('found');
    expect(result.lower.status === 'found' && result.lower.frequencyHz).toBeCloseTo(Math.sqrt(200 * 400), 6);
    // Upper crossing between 2 kHz (0.5 %) and 4 kHz (2 %): 2828.4 Hz.
    expect(result.upper.status === 'found' && result.upper.frequencyHz).toBeCloseTo(Math.sqrt(2000 * 4000), 6);
  });

  it('says "beyond measured range" when the curve stays below the threshold to its edge, and refuses a failing reference', () => {
    const wide = belowThreshold(curve, 10, 1000);
    expect(wide.lower).toEqual({ status: 'beyond_measured_range', measuredEdgeHz: 100 });
    expect(wide.upper).toEqual({ status: 'beyond_measured_range', measuredEdgeHz: 8000 });
    const tight = belowThreshold(curve, 0.2, 1000);
    expect(tight.lower.status).toBe('outside_at_reference_band');
    expect(tight.upper.status).toBe('outside_at_reference_band');
  });
});
