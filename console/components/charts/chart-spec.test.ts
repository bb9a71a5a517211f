import { describe, expect, it } from 'vitest';
import { alignSeries, visibleYExtent } from './chart-spec';

// Plumbing between curves and the plotting library: checked by hand-worked cases (common practice, no source).
describe('series alignment', () => {
  it('hands curves on one grid to the chart as they are, without a copy', () => {
    const x = Float64Array.from([20, 200, 2000, 20_000]);
    const a = Float64Array.from([80, 86, 86, 70]);
    const b = Float64Array.from([75, 85, 87, 72]);
    const aligned = alignSeries([{ x, y: a }, { x: Float64Array.from(x), y: b }]);
    expect(aligned.x).toBe(x);
    expect(aligned.ys[0]).toBe(a);
    expect(aligned.ys[1]).toBe(b);
  });

  it('turns non-finite values into gaps, copying only the series that has them', () => {
    const x = [100, 1000, 10_000];
    const clean = [1, 2, 3];
    const aligned = alignSeries([{ x, y: clean }, { x, y: [1, Number.NaN, Number.POSITIVE_INFINITY] }]);
    expect(aligned.ys[0]).toBe(clean);
    expect(aligned.ys[1]).toEqual([1, null, null]);
  });

  it('puts curves on different grids onto the union of their x values, with null where a curve has no point', () => {
    const aligned = alignSeries([
      { x: [100, 1000], y: [1, 2] },
      { x: [500, 1000, 2000], y: [5, 6, 7] },
    ]);
    expect(Array.from(aligned.x)).toEqual([100, 500, 1000, 2000]);
    expect(aligned.ys.map((y) => Array.from(y))).toEqual([
      [1, null, 2, null],
      [null, 5, 6, 7],
    ]);
  });

  it('finds the y extent of the visible series inside the x range only', () => {
    const spec = {
      xRange: [20, 20_000] as [number, number],
      series: [
        { id: 'a', label: 'a', colour: '#000', x: [10, 100, 1000], y: [-50, 80, 90] },
        { id: 'b', label: 'b', colour: '#000', x: [100, 1000], y: [0, 200], visible: false },
      ],
    };
    expect(visibleYExtent(spec)).toEqual([80, 90]);
  });
});
