import { describe, expect, it } from 'vitest';
import { filtersFromSearchParams, toListQuery, withFilters } from './filters';

// The history's URL contract; no external source: these pin our own query names to the API's (shared/schemas).
describe('history filters in the URL', () => {
  it('reads known values and drops what the API would refuse', () => {
    const params = new URLSearchParams('kind=frequency_response&status=done&verdict=fail&model=%20KB-65%20woofer%20&createdFrom=2026-11-02&createdTo=2026-13-40');
    expect(filtersFromSearchParams(params)).toEqual({ kind: 'frequency_response', verdict: 'fail', model: 'KB-65 woofer', createdFrom: '2026-11-02' });
  });

  it('writes filters back without touching other parameters, and clears emptied ones', () => {
    const params = new URLSearchParams('select=ana_1&lot=LOT-A');
    const next = withFilters(params, { serial: 'KB65-24-000123' });
    expect(next.get('select')).toBe('ana_1');
    expect(next.get('serial')).toBe('KB65-24-000123');
    expect(next.has('lot')).toBe(false);
  });

  it('turns calendar days into the API timestamps, the end day included (createdTo is exclusive in the API)', () => {
    expect(toListQuery({ createdFrom: '2026-11-30', createdTo: '2026-11-30', tag: 'line-2' })).toEqual({
      tag: 'line-2',
      createdFrom: '2026-11-30T00:00:00.000Z',
      createdTo: '2026-12-01T00:00:00.000Z',
    });
  });
});
