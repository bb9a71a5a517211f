// Numbers with units for people: one place so a plot axis, a figure and a table all say "1.25 kHz" alike.
const MINUS = '\u2212';
const NARROW_SPACE = '\u202f';

function trimmed(value: number, significantFigures: number): string {
  return String(Number(value.toPrecision(significantFigures)));
}

/** Replaces the ASCII hyphen of a negative number by the typographic minus sign. */
export function withMinus(text: string): string {
  return text.replace(/^-/, MINUS);
}

/** "31.5 Hz", "250 Hz", "1 kHz", "12.5 kHz"; three significant figures by default. */
export function formatFrequency(frequencyHz: number, significantFigures = 3): string {
  if (!Number.isFinite(frequencyHz)) return '—';
  if (Math.abs(frequencyHz) >= 1000) return `${trimmed(frequencyHz / 1000, significantFigures)} kHz`;
  return `${trimmed(frequencyHz, significantFigures)} Hz`;
}

/** dB with a fixed number of decimals; `signed` always shows + or − (for margins, differences, gains). */
export function formatDb(levelDb: number, options: { decimals?: number; signed?: boolean; unit?: string } = {}): string {
  if (!Number.isFinite(levelDb)) return '—';
  const { decimals = 1, signed = false, unit = 'dB' } = options;
  const rounded = Number(levelDb.toFixed(decimals));
  const magnitude = Math.abs(rounded).toFixed(decimals);
  const sign = rounded < 0 ? MINUS : signed && rounded > 0 ? '+' : signed ? '±' : '';
  return `${sign}${magnitude}${unit ? ` ${unit}` : ''}`;
}

/**
 * A distortion percentage with two significant figures below 10 % ("0.12 %", "3.4 %") and whole numbers above;
 * an upper bound reads "< 0.12 %": the quantity was not measurably above the noise.
 */
export function formatPercent(percent: number, options: { isUpperBound?: boolean } = {}): string {
  if (!Number.isFinite(percent)) return '—';
  const text = Math.abs(percent) >= 10 ? percent.toFixed(0) : trimmed(percent, 2);
  return `${options.isUpperBound ? '< ' : ''}${withMinus(text)}${NARROW_SPACE}%`;
}

/** Milliseconds with three significant figures: "4.17 ms", "0.25 ms". */
export function formatMilliseconds(durationMs: number): string {
  if (!Number.isFinite(durationMs)) return '—';
  return `${withMinus(trimmed(durationMs, 3))} ms`;
}
