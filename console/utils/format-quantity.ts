// Quantities of the plans and of usage, in the reader's language.

const count = new Intl.NumberFormat(undefined, { maximumFractionDigits: 0 });
const oneDecimal = new Intl.NumberFormat(undefined, { maximumFractionDigits: 1 });

/** Decimal units (1 GB = 10^9 bytes), as the plans are sold. */
export function formatBytes(bytes: number): string {
  const units = [
    { unit: 'TB', size: 1e12 },
    { unit: 'GB', size: 1e9 },
    { unit: 'MB', size: 1e6 },
    { unit: 'kB', size: 1e3 },
  ];
  const match = units.find(({ size }) => bytes >= size);
  return match ? `${oneDecimal.format(bytes / match.size)} ${match.unit}` : `${count.format(bytes)} B`;
}

export function formatCount(value: number): string {
  return count.format(value);
}

export function formatMinutes(minutes: number): string {
  return `${oneDecimal.format(minutes)} min`;
}
