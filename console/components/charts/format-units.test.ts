import { describe, expect, it } from 'vitest';
import { formatDb, formatFrequency, formatMilliseconds, formatPercent } from './format-units';

describe('unit formatting', () => {
  it('writes frequencies in Hz below 1 kHz and in kHz above, with three significant figures', () => {
    // SI prefixes (BIPM SI Brochure, 9th ed., Table 7); three figures: common practice, no source.
    expect(formatFrequency(31.5)).toBe('31.5 Hz');
    expect(formatFrequency(249.7)).toBe('250 Hz');
    expect(formatFrequency(1000)).toBe('1 kHz');
    expect(formatFrequency(1258.9)).toBe('1.26 kHz');
    expect(formatFrequency(12_500)).toBe('12.5 kHz');
  });

  it('writes dB with a typographic minus and, when signed, an explicit plus', () => {
    // The minus sign U+2212 for negative numbers: ISO 80000-1:2009 §7.1.3 uses the minus, not the hyphen (from memory).
    expect(formatDb(-3.04)).toBe('\u22123.0 dB');
    expect(formatDb(2.5, { signed: true })).toBe('+2.5 dB');
    expect(formatDb(0, { signed: true })).toBe('±0.0 dB');
    expect(formatDb(86.27, { decimals: 2, unit: 'dB SPL' })).toBe('86.27 dB SPL');
    expect(formatDb(-0.04, { signed: true })).toBe('±0.0 dB');
  });

  it('writes distortion with two significant figures below 10 % and marks an upper bound', () => {
    // A value "not above the noise" is a bound: common practice, no source.
    expect(formatPercent(0.1234)).toBe('0.12\u202f%');
    expect(formatPercent(3.456)).toBe('3.5\u202f%');
    expect(formatPercent(12.6)).toBe('13\u202f%');
    expect(formatPercent(0.05, { isUpperBound: true })).toBe('< 0.05\u202f%');
  });

  it('writes durations in ms with three significant figures', () => {
    expect(formatMilliseconds(4.1666)).toBe('4.17 ms');
    expect(formatMilliseconds(Number.NaN)).toBe('—');
  });
});
