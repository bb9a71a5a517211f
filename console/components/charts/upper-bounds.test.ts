import { describe, expect, it } from 'vitest';
import { splitUpperBounds } from './upper-bounds';

// An upper bound is drawn apart from measured values: common practice, no source.
describe('upper-bound split', () => {
  it('keeps measured values in one series and bounds (plus their joining neighbours) in the other', () => {
    const { measured, bounds } = splitUpperBounds([1, 2, 3, 4, 5], [false, false, true, true, false]);
    expect(measured).toEqual([1, 2, null, null, 5]);
    expect(bounds).toEqual([null, 2, 3, 4, 5]);
  });

  it('leaves the bound series empty when nothing is a bound', () => {
    const { measured, bounds } = splitUpperBounds([0.1, null, 0.3], [false, false, false]);
    expect(measured).toEqual([0.1, null, 0.3]);
    expect(bounds).toEqual([null, null, null]);
  });
});
