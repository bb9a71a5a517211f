// Dates come from the API as RFC 3339 strings; these turn them into words for a person in their own locale.
// `now` and `locale` are parameters so the output can be pinned in tests.

export function formatDate(iso: string, locale?: string): string {
  return new Intl.DateTimeFormat(locale, { year: 'numeric', month: 'short', day: 'numeric' }).format(new Date(iso));
}

export function formatDateTime(iso: string, locale?: string, timeZone?: string): string {
  return new Intl.DateTimeFormat(locale, {
    year: 'numeric',
    month: 'short',
    day: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    timeZone,
  }).format(new Date(iso));
}

const RELATIVE_STEPS: Array<{ unit: Intl.RelativeTimeFormatUnit; seconds: number }> = [
  { unit: 'year', seconds: 365 * 24 * 3600 },
  { unit: 'month', seconds: 30 * 24 * 3600 },
  { unit: 'week', seconds: 7 * 24 * 3600 },
  { unit: 'day', seconds: 24 * 3600 },
  { unit: 'hour', seconds: 3600 },
  { unit: 'minute', seconds: 60 },
];

/** "5 minutes ago", "in 3 days"; anything under a minute reads as "just now". */
export function formatRelativeTime(iso: string, now: Date = new Date(), locale?: string): string {
  const deltaSeconds = (new Date(iso).getTime() - now.getTime()) / 1000;
  const format = new Intl.RelativeTimeFormat(locale, { numeric: 'auto' });
  for (const step of RELATIVE_STEPS) {
    if (Math.abs(deltaSeconds) >= step.seconds) {
      return format.format(Math.trunc(deltaSeconds / step.seconds), step.unit);
    }
  }
  return 'just now';
}

/** "YYYY-MM-DD" in local time, as a date <input> expects. */
export function toDateInputValue(date: Date): string {
  const pad = (value: number) => String(value).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/**
 * The last moment of a picked calendar day in the person's own time zone, as an RFC 3339 UTC instant:
 * a key "valid until 12 March" stays usable through the whole of 12 March where it was created.
 */
export function endOfLocalDayIso(dateInputValue: string): string | undefined {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(dateInputValue);
  if (!match) return undefined;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const end = new Date(year, month - 1, day, 23, 59, 59, 999);
  if (end.getFullYear() !== year || end.getMonth() !== month - 1 || end.getDate() !== day) return undefined;
  return end.toISOString();
}
