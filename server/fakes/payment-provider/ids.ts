import { randomBytes } from 'node:crypto';

const BASE62 = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

/** Provider-style ids ("cus_…", "sub_…"): a type prefix and 24 random base62 characters. */
export function newObjectId(prefix: string): string {
  const bytes = randomBytes(24);
  let suffix = '';
  for (const byte of bytes) suffix += BASE62[byte % BASE62.length];
  return `${prefix}_${suffix}`;
}

export function unixSeconds(instant: Date = new Date()): number {
  return Math.floor(instant.getTime() / 1000);
}

/** Same day next month in UTC, clamped to the month's last day (31 January → 28/29 February). */
export function addOneMonthSeconds(startSeconds: number): number {
  const start = new Date(startSeconds * 1000);
  const year = start.getUTCFullYear();
  const month = start.getUTCMonth() + 1;
  const lastDayOfNextMonth = new Date(Date.UTC(year, month + 1, 0)).getUTCDate();
  const day = Math.min(start.getUTCDate(), lastDayOfNextMonth);
  return unixSeconds(
    new Date(Date.UTC(year, month, day, start.getUTCHours(), start.getUTCMinutes(), start.getUTCSeconds())),
  );
}
