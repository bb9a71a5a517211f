// Every reader gets the same wording whatever the server's locale or time zone: e-mails state UTC.
const DATE_TIME_FORMAT = new Intl.DateTimeFormat('en-GB', {
  timeZone: 'UTC',
  day: 'numeric',
  month: 'long',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
  hourCycle: 'h23',
});
const COUNT_FORMAT = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });
const ONE_DECIMAL_FORMAT = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1 });
const BYTES_PER_GIGABYTE = 1e9;
/** Keeps "80 %" on one line. */
export const NO_BREAK_SPACE = '\u00a0';

/** "14 March 2026 at 09:30 UTC". */
export function formatUtcDateTime(instant: Date): string {
  const parts = Object.fromEntries(DATE_TIME_FORMAT.formatToParts(instant).map((part) => [part.type, part.value]));
  return `${parts.day} ${parts.month} ${parts.year} at ${parts.hour}:${parts.minute} UTC`;
}

export function formatCount(value: number): string {
  return COUNT_FORMAT.format(value);
}

/** Decimal gigabytes (1 GB = 10^9 bytes), the unit the plans are sold in. */
export function formatGigabytes(bytes: number): string {
  return `${ONE_DECIMAL_FORMAT.format(bytes / BYTES_PER_GIGABYTE)}${NO_BREAK_SPACE}GB`;
}

export function formatPercent(percent: number): string {
  return `${COUNT_FORMAT.format(percent)}${NO_BREAK_SPACE}%`;
}
