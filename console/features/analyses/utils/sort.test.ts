import { describe, expect, it } from 'vitest';
import { ANALYSIS_SORTS } from '@shared/schemas/analyses';
import { ariaSortOf, describeSort, sortAfterClick, sortedColumnOf, sortFromSearchParams, withSort } from './sort';

// The history's sort contract with the API's `sort` parameter (shared/schemas/analyses.ts); aria-sort values from
// WAI-ARIA 1.2 (§6.7 aria-sort: ascending | descending, on the sorted column header).
describe('history sort in the URL', () => {
  it('reads every sort the API accepts and falls back to newest first otherwise', () => {
    for (const sort of ANALYSIS_SORTS) expect(sortFromSearchParams(new URLSearchParams({ sort }))).toBe(sort);
    expect(sortFromSearchParams(new URLSearchParams('sort=levelDb'))).toBe('-createdAt');
    expect(sortFromSearchParams(new URLSearchParams())).toBe('-createdAt');
  });

  it('writes the sort without touching the filters, leaving the default out of the URL', () => {
    const params = new URLSearchParams('verdict=fail&tag=line-2');
    expect(withSort(params, 'worstMarginDb').toString()).toBe('verdict=fail&tag=line-2&sort=worstMarginDb');
    expect(withSort(new URLSearchParams('sort=model&lot=LOT-A'), '-createdAt').toString()).toBe('lot=LOT-A');
  });

  it('clicking a header sorts by it first in its natural direction, then toggles', () => {
    expect(sortAfterClick('-createdAt', 'verdict')).toBe('verdict');
    expect(sortAfterClick('verdict', 'verdict')).toBe('-verdict');
    expect(sortAfterClick('-verdict', 'verdict')).toBe('verdict');
    expect(sortAfterClick('verdict', 'createdAt')).toBe('-createdAt');
    expect(sortAfterClick('-createdAt', 'createdAt')).toBe('createdAt');
    expect(sortAfterClick('-createdAt', 'device')).toBe('model');
    expect(sortAfterClick('-createdAt', 'worstMarginDb')).toBe('worstMarginDb');
  });

  it('marks only the sorted column with aria-sort', () => {
    expect(ariaSortOf('-worstMarginDb', 'worstMarginDb')).toBe('descending');
    expect(ariaSortOf('model', 'device')).toBe('ascending');
    expect(ariaSortOf('model', 'createdAt')).toBeUndefined();
    // Serial has no column of its own: no header claims the order.
    expect(sortedColumnOf('serial')).toBeNull();
    expect(describeSort('serial')).toBe('by serial number, ascending');
    expect(describeSort('-createdAt')).toBe('newest first');
  });
});
