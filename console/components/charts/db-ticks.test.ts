import { describe, expect, it } from 'vitest';
import { dbAxisRange, dbTicks, dbTickStep, logAxisRange, logTicks } from './db-ticks';

// dB axes step by 1-2-5 and show at least 20 dB: common practice, no source.
describe('dB axis ticks', () => {
  it('picks the smallest step that keeps at most eight ticks', () => {
    expect(dbTickStep(40)).toBe(5);
    expect(dbTickStep(60)).toBe(10);
    expect(dbTickStep(8)).toBe(1);
    expect(dbTickStep(15)).toBe(2);
    expect(dbTickStep(120)).toBe(20);
  });

  it('lists whole multiples of the step inside the range, negative ones included', () => {
    expect(dbTicks(-12, 7, 5)).toEqual([-10, -5, 0, 5]);
    expect(dbTicks(70, 90, 10)).toEqual([70, 80, 90]);
  });

  it('widens a flat curve to the minimum span around its centre and snaps to whole ticks', () => {
    expect(dbAxisRange(84.2, 86.1)).toEqual([75, 100]);
    const [low, high] = dbAxisRange(-43.7, 12.2);
    expect(low).toBe(-50);
    expect(high).toBe(20);
  });

  it('never fails on an empty or non-finite curve', () => {
    expect(dbAxisRange(Number.NaN, Number.NaN)).toEqual([-10, 10]);
  });
});

describe('log axis ticks', () => {
  // 1-2-5 per decade on log axes: common practice, no source.
  it('lists 1, 2 and 5 times each power of ten', () => {
    expect(logTicks(0.01, 10)).toEqual([0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1, 2, 5, 10]);
  });

  it('keeps only powers of ten past three decades', () => {
    expect(logTicks(0.001, 10)).toEqual([0.001, 0.01, 0.1, 1, 10]);
  });

  it('widens to whole decades, at least two and at most four below the top', () => {
    expect(logAxisRange(0.13, 4.2)).toEqual([0.1, 10]);
    expect(logAxisRange(0.3, 0.8)).toEqual([0.01, 1]);
    expect(logAxisRange(1e-9, 3)).toEqual([0.001, 10]);
  });
});
