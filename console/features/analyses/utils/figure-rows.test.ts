import { describe, expect, it } from 'vitest';
import { figureGroups, limitPointText } from './figure-rows';
import type { ResultEnvelope } from './result-view';

const envelope = (figures: Record<string, unknown>): ResultEnvelope => ({ kind: 'frequency_response', engineVersion: '1', conventions: {}, figures, curves: {}, warnings: [] });

describe('figures in words', () => {
  it('says when a band limit lies beyond the measured range instead of showing the data edge as the limit', () => {
    // A −X dB point the curve never crosses is not a measured limit: common practice, no source.
    expect(limitPointText({ status: 'beyond_measured_range', measuredEdgeHz: 20 })).toEqual({ value: 'beyond measured range (data ends at 20 Hz)', tone: 'warning' });
    expect(limitPointText({ status: 'found', frequencyHz: 62.4 }).value).toBe('62.4 Hz');
  });

  it('states the worst mask margin with its sign and frequency', () => {
    const groups = figureGroups(
      envelope({
        mask: {
          verdict: 'fail',
          guardBandDb: 0,
          description: '',
          upper: { pass: true, worstMarginDb: 1.2, worstMarginFrequencyHz: 800, failingRegionsHz: [], evaluatedFromHz: 20, evaluatedToHz: 20000, coversLimitSpan: true },
          lower: { pass: false, worstMarginDb: -2.35, worstMarginFrequencyHz: 4000, failingRegionsHz: [[3000, 5000]], evaluatedFromHz: 20, evaluatedToHz: 20000, coversLimitSpan: true },
        },
      }),
    );
    const verdict = groups.find((group) => group.title === 'Mask verdict')!;
    expect(verdict.rows[0]).toMatchObject({ value: 'Fail', tone: 'danger' });
    expect(verdict.rows[1].value).toBe('\u22122.35 dB at 4 kHz');
  });

  it('marks the headline THD form and an upper bound', () => {
    const groups = figureGroups(envelope({ thdF: { valuePercent: 0.05, valueDb: -66, isUpperBound: true }, thdR: { valuePercent: 0.05, valueDb: -66, isUpperBound: true }, thdHeadline: { form: 'thd_r' } }));
    const rows = groups.find((group) => group.title === 'Harmonic distortion')!.rows;
    expect(rows.map((row) => row.label)).toEqual(['THD_F', 'THD_R (headline)']);
    expect(rows[0].value).toBe('< 0.05\u202f%');
  });
});
