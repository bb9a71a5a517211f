import { describe, expect, it } from 'vitest';
import { dailyBars, niceAxis } from './daily-chart';

describe('niceAxis', () => {
  it('rounds the maximum up to 4 steps of 1, 2 or 5 × 10^n', () => {
    // Steps of 1-2-5 × 10^n: common practice, no source.
    expect(niceAxis(37)).toEqual({ max: 40, step: 10 });
    expect(niceAxis(41)).toEqual({ max: 80, step: 20 });
    expect(niceAxis(1900)).toEqual({ max: 2000, step: 500 });
    expect(niceAxis(0)).toEqual({ max: 4, step: 1 });
    expect(niceAxis(0.9)).toEqual({ max: 2, step: 0.5 });
  });

  it('keeps steps whole for counts', () => {
    expect(niceAxis(3, { integer: true })).toEqual({ max: 4, step: 1 });
    expect(niceAxis(1, { integer: true })).toEqual({ max: 4, step: 1 });
  });
});

describe('dailyBars', () => {
  it('lays out every day of the period, with no bar for the days still to come', () => {
    // December has 31 days (Gregorian calendar).
    const bars = dailyBars(
      {
        period: { start: '2026-12-01T00:00:00.000Z', end: '2027-01-01T00:00:00.000Z' },
        days: [
          { date: '2026-12-01', analyses: 12, audioMinutes: 0.8 },
          { date: '2026-12-02', analyses: 0, audioMinutes: 0 },
        ],
      },
      'analyses',
    );
    expect(bars).toHaveLength(31);
    expect(bars.slice(0, 3)).toEqual([
      { date: '2026-12-01', value: 12 },
      { date: '2026-12-02', value: 0 },
      { date: '2026-12-03', value: null },
    ]);
    expect(bars.at(-1)).toEqual({ date: '2026-12-31', value: null });
  });
});
