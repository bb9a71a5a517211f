import { describe, expect, it } from 'vitest';
import { passRatePercent, tallyAnalyses } from './week-tally';

// Counting outcomes: hand-worked cases (common practice, no source: a verdict belongs to a finished analysis,
// and an analysis that failed to run is not a failing unit).
describe('week tally', () => {
  it('counts each outcome once', () => {
    const tally = tallyAnalyses(
      [
        { id: 'a', status: 'succeeded', verdict: 'pass' },
        { id: 'b', status: 'succeeded', verdict: 'pass' },
        { id: 'c', status: 'succeeded', verdict: 'fail' },
        { id: 'd', status: 'succeeded', verdict: 'incomplete' },
        { id: 'e', status: 'succeeded', verdict: null },
        { id: 'f', status: 'failed', verdict: null },
        { id: 'g', status: 'canceled', verdict: null },
        { id: 'h', status: 'running', verdict: null },
        { id: 'i', status: 'queued', verdict: null },
      ],
      false,
    );
    expect(tally).toEqual({ total: 9, pass: 2, fail: 1, incomplete: 1, noVerdict: 1, notRun: 2, inProgress: 2, truncated: false });
  });

  it('gives the pass rate among judged units only', () => {
    expect(passRatePercent({ pass: 3, fail: 1 })).toBe(75);
    expect(passRatePercent({ pass: 0, fail: 0 })).toBeNull();
  });
});
