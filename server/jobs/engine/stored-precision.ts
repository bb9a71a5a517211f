/**
 * The precision a stored result keeps. Non-integer numbers are rounded to 7 significant digits: float32 carries
 * 24 mantissa bits (≈ 7.2 decimal digits) and a 24-bit capture resolves 1 part in 2^23, so no capture this
 * service accepts holds information past the 7th digit. Full double precision would print 17 digits per number and
 * almost double the stored and transmitted result (an impulse response alone has thousands of samples) for digits
 * that are computation noise. Integers (counts, sample indices, sizes) are kept exactly.
 */
export const STORED_SIGNIFICANT_DIGITS = 7;

/** The convention line every result states about its numbers. */
export const STORED_PRECISION_CONVENTION = `non-integer numbers rounded to ${STORED_SIGNIFICANT_DIGITS} significant digits (float32 precision); integers exact`;

const POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => 10 ** k);

/**
 * `x` to `STORED_SIGNIFICANT_DIGITS` significant digits. Division by an exact power of ten gives the double nearest
 * the rounded decimal, which JSON then prints with no more digits than were kept; `toPrecision` covers the rest.
 */
export function roundToStoredPrecision(x: number): number {
  if (!Number.isFinite(x) || Number.isInteger(x)) return x;
  const decimals = STORED_SIGNIFICANT_DIGITS - 1 - Math.floor(Math.log10(Math.abs(x)));
  if (decimals < 0) return x; // |x| ≥ 10^7 with a fraction: already at least 8 digits before the point; rare
  if (decimals < POWERS_OF_TEN.length) return Math.round(x * POWERS_OF_TEN[decimals]!) / POWERS_OF_TEN[decimals]!;
  return Number(x.toPrecision(STORED_SIGNIFICANT_DIGITS));
}

/** A copy of `value` with every number rounded as above; strings, booleans and null are kept. */
export function withStoredPrecision<T>(value: T): T {
  if (typeof value === 'number') return roundToStoredPrecision(value) as T;
  if (Array.isArray(value)) return value.map(withStoredPrecision) as T;
  if (value !== null && typeof value === 'object') {
    const copy: Record<string, unknown> = {};
    for (const [key, item] of Object.entries(value)) copy[key] = withStoredPrecision(item);
    return copy as T;
  }
  return value;
}
