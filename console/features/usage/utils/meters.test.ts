import { describe, expect, it } from 'vitest';
import { formatBytes, toneOf } from './meters';

describe('usage meters', () => {
  it('formats storage in decimal units', () => {
    // SI prefixes (BIPM SI Brochure, 9th ed., Table 7): 1 GB = 10^9 B, as the plans are sold.
    expect(formatBytes(2_400_000_000)).toMatch(/^2[.,]4 GB$/);
    expect(formatBytes(1e12)).toMatch(/^1 TB$/);
    expect(formatBytes(999)).toBe('999 B');
  });

  it('warns from 80 % and marks the limit at 100 %, the points at which admins are e-mailed', () => {
    expect(toneOf(79.9)).toBe('ok');
    expect(toneOf(80)).toBe('warning');
    expect(toneOf(100)).toBe('danger');
    expect(toneOf(130)).toBe('danger');
  });
});
