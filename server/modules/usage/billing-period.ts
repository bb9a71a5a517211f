/**
 * Monthly usage periods: a period starts at the anchor plus a whole number of months (UTC) and ends where the
 * next one starts. An anchor on the 31st starts on the last day of shorter months (common practice, no source).
 */

/** Calendar months (UTC) for organisations without a plan row. */
export const CALENDAR_MONTH_ANCHOR = new Date('2000-01-01T00:00:00.000Z');

export interface UsagePeriod {
  start: Date;
  end: Date;
}

export function addMonthsUtc(anchor: Date, months: number): Date {
  const monthIndex = anchor.getUTCMonth() + months;
  const year = anchor.getUTCFullYear() + Math.floor(monthIndex / 12);
  const month = ((monthIndex % 12) + 12) % 12;
  const daysInMonth = new Date(Date.UTC(year, month + 1, 0)).getUTCDate();
  const day = Math.min(anchor.getUTCDate(), daysInMonth);
  return new Date(
    Date.UTC(year, month, day, anchor.getUTCHours(), anchor.getUTCMinutes(), anchor.getUTCSeconds(), anchor.getUTCMilliseconds()),
  );
}

/** The period containing `now`. */
export function usagePeriodAt(anchor: Date, now: Date): UsagePeriod {
  let months = (now.getUTCFullYear() - anchor.getUTCFullYear()) * 12 + (now.getUTCMonth() - anchor.getUTCMonth());
  let start = addMonthsUtc(anchor, months);
  while (start.getTime() > now.getTime()) start = addMonthsUtc(anchor, --months);
  while (addMonthsUtc(anchor, months + 1).getTime() <= now.getTime()) start = addMonthsUtc(anchor, ++months);
  return { start, end: addMonthsUtc(anchor, months + 1) };
}
