/** Source of the current time. Injected so tests can move time (session expiry, throttling windows). */
export interface Clock {
  now(): Date;
}

export const systemClock: Clock = { now: () => new Date() };

/** A clock that only moves when told to. */
export function manualClock(start: Date = new Date('2025-01-15T08:00:00.000Z')) {
  let current = start.getTime();
  return {
    now: () => new Date(current),
    advanceSeconds(seconds: number) {
      current += seconds * 1000;
    },
    set(date: Date) {
      current = date.getTime();
    },
  };
}
