import { describe, expect, it } from 'vitest';
import { histogram, niceBinWidth } from './histogram';

describe('histogram binning', () => {
  it('hand-computed: eight sensitivities in four 1 dB classes', () => {
    // Sturges (JASA 21(153), 1926): k = ⌈log2 8⌉ + 1 = 4; (89.9 − 86.2) / 4 = 0.925 → width 1 dB; edges 86, 87, 88, 89, 90.
    const result = histogram([88.3, 86.2, 87.4, 89.9, 86.9, 88.1, 87.6, 88.4]);
    expect(result.binWidth).toBe(1);
    expect(result.bins).toEqual([
      { fromValue: 86, toValue: 87, count: 2 },
      { fromValue: 87, toValue: 88, count: 2 },
      { fromValue: 88, toValue: 89, count: 3 },
      { fromValue: 89, toValue: 90, count: 1 },
    ]);
  });

  it('hand-computed: THD values in 0.25 % classes, an empty class kept', () => {
    // k = ⌈log2 5⌉ + 1 = 4; (1.2 − 0.31) / 4 = 0.2225 → 0.25; first edge ⌊0.31 / 0.25⌋ · 0.25 = 0.25.
    const result = histogram([0.31, 0.35, 0.42, 0.58, 1.2]);
    expect(result.binWidth).toBe(0.25);
    expect(result.bins.map((bin) => [bin.fromValue, bin.toValue, bin.count])).toEqual([
      [0.25, 0.5, 3],
      [0.5, 0.75, 1],
      [0.75, 1, 0],
      [1, 1.25, 1],
    ]);
  });

  it('puts a value on an edge into the upper class and keeps every value counted', () => {
    const result = histogram([1, 2, 3, 4], { binWidth: 1 });
    // Half-open classes [1,2) [2,3) [3,4) [4,5): each value starts its own class.
    expect(result.bins.map((bin) => bin.count)).toEqual([1, 1, 1, 1]);
    const many = histogram(Array.from({ length: 1000 }, (_, i) => i * 0.37));
    expect(many.bins.reduce((sum, bin) => sum + bin.count, 0)).toBe(1000);
    expect(many.bins.length).toBeLessThanOrEqual(16);
  });

  it('handles a single value and no values', () => {
    expect(histogram([]).bins).toEqual([]);
    const single = histogram([88]);
    expect(single.bins).toHaveLength(1);
    expect(single.bins[0].count).toBe(1);
    expect(single.bins[0].fromValue).toBeLessThanOrEqual(88);
    expect(single.bins[0].toValue).toBeGreaterThan(88);
  });

  it('rounds class widths up to 1, 2, 2.5 or 5 times a power of ten', () => {
    expect([0.925, 0.2225, 1.7, 3, 4.2, 0.011].map(niceBinWidth)).toEqual([1, 0.25, 2, 5, 5, 0.02]);
  });
});
