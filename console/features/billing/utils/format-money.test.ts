import { describe, expect, it } from 'vitest';
import { formatMoney } from './format-money';

describe('formatMoney', () => {
  it('reads minor units with the currency\'s own number of decimals', () => {
    // ISO 4217: EUR has 2 minor-unit digits, JPY has 0.
    expect(formatMoney(29_000, 'eur', 'en-GB')).toBe('€290.00');
    expect(formatMoney(149_000, 'eur', 'en-GB')).toBe('€1,490.00');
    expect(formatMoney(500, 'jpy', 'en-GB')).toBe('JP¥500');
    expect(formatMoney(0, 'eur', 'en-GB')).toBe('€0.00');
  });
});
