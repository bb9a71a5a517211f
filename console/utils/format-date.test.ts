import { describe, expect, it } from 'vitest';
import { endOfLocalDayIso, formatDateTime, formatRelativeTime, toDateInputValue } from './format-date';

describe('formatRelativeTime', () => {
  const now = new Date('2026-03-12T12:00:00Z');

  // Expected strings: ECMA-402 Intl.RelativeTimeFormat with CLDR English data, numeric "auto".
  it('words past instants the way CLDR English does', () => {
    expect(formatRelativeTime('2026-03-12T11:55:00Z', now, 'en')).toBe('5 minutes ago');
    expect(formatRelativeTime('2026-03-11T12:00:00Z', now, 'en')).toBe('yesterday');
    expect(formatRelativeTime('2026-03-05T12:00:00Z', now, 'en')).toBe('last week');
  });

  it('words future instants (expiry) forwards', () => {
    expect(formatRelativeTime('2026-03-15T12:00:00Z', now, 'en')).toBe('in 3 days');
    expect(formatRelativeTime('2026-03-12T15:00:00Z', now, 'en')).toBe('in 3 hours');
  });

  it('treats anything under a minute as just now', () => {
    expect(formatRelativeTime('2026-03-12T11:59:30Z', now, 'en')).toBe('just now');
  });
});

describe('formatDateTime', () => {
  // ECMA-402 DateTimeFormat, CLDR en-GB pattern "d MMM y, HH:mm".
  it('formats an RFC 3339 instant in the given zone', () => {
    expect(formatDateTime('2026-03-12T09:05:00Z', 'en-GB', 'UTC')).toBe('12 Mar 2026, 09:05');
  });
});

describe('endOfLocalDayIso', () => {
  it('gives the last millisecond of the picked local day', () => {
    const iso = endOfLocalDayIso('2026-03-12');
    expect(iso).toBeDefined();
    const end = new Date(iso as string);
    expect(toDateInputValue(end)).toBe('2026-03-12');
    expect([end.getHours(), end.getMinutes(), end.getSeconds(), end.getMilliseconds()]).toEqual([23, 59, 59, 999]);
    expect(toDateInputValue(new Date(end.getTime() + 1))).toBe('2026-03-13');
  });

  it('is an RFC 3339 UTC timestamp', () => {
    // RFC 3339 §5.6 date-time with a "Z" offset, as Date.prototype.toISOString emits (ECMA-262 §21.4.4.36).
    expect(endOfLocalDayIso('2026-12-31')).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
  });

  it('refuses values that are not a real calendar day', () => {
    expect(endOfLocalDayIso('2026-02-30')).toBeUndefined();
    expect(endOfLocalDayIso('12/03/2026')).toBeUndefined();
    expect(endOfLocalDayIso('')).toBeUndefined();
  });
});
