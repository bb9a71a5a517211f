import { describe, expect, it } from 'vitest';
import { maskOffsetDb, responseSpec } from './response-plots';
import type { ResponseView } from './result-view';

// A response that is a straight line in dB against log f, L(f) = 80 + 2·log2(f / 1 kHz): its level at any
// frequency and its dB mean over a band are closed form.
const frequencyHz = Array.from({ length: 61 }, (_, i) => 1000 * 2 ** ((i - 30) / 6));
const view: ResponseView = {
  frequencyHz,
  magnitudeDb: frequencyHz.map((f) => 80 + 2 * Math.log2(f / 1000)),
  phaseDeg: null,
  groupDelayMs: null,
  belowLowestValidFrequency: null,
  normalisationReferenceLevelDb: null,
};

describe('mask drawn on the response', () => {
  it('draws an absolute mask as stated', () => {
    expect(maskOffsetDb(view, { levelReference: 'absolute', referenceLevel: null })).toBe(0);
  });

  it('reads a relative mask against the curve at its reference frequency', () => {
    expect(maskOffsetDb(view, { levelReference: 'relative', referenceLevel: { kind: 'at_frequency', frequencyHz: 2000 } })).toBeCloseTo(82, 9);
    expect(maskOffsetDb(view, { levelReference: 'relative', referenceLevel: null })).toBeCloseTo(80, 9);
  });

  it('reads a band-mean reference as the dB mean over log frequency', () => {
    // Mean of 80 + 2x over x = log2(f/1k) ∈ [−1, 1] is 80 (odd part integrates to zero).
    expect(maskOffsetDb(view, { levelReference: 'relative', referenceLevel: { kind: 'band_mean', fromHz: 500, toHz: 2000, average: 'db' } })).toBeCloseTo(80, 6);
  });

  it('marks each failing span of the verdict and shades the band between the limits', () => {
    const limit = { pass: false, worstMarginDb: -1, worstMarginFrequencyHz: 3000, evaluatedFromHz: 100, evaluatedToHz: 5000, coversLimitSpan: true };
    const spec = responseSpec(
      view,
      'dB SPL re 20 µPa at 1 m for 2.83 V',
      { verdict: 'fail', guardBandDb: 0, description: '', upper: { ...limit, failingRegionsHz: [[2500, 4000]] }, lower: null },
      { levelReference: 'relative', referenceLevel: null, upper: [{ frequencyHz: 100, levelDb: 3 }, { frequencyHz: 5000, levelDb: 3 }], lower: [{ frequencyHz: 100, levelDb: -3 }, { frequencyHz: 5000, levelDb: -3 }] },
    );
    expect(spec.yLabel).toBe('Level (dB SPL re 20 µPa at 1 m)');
    expect(spec.regions).toEqual([expect.objectContaining({ fromX: 2500, toX: 4000, label: 'Above the upper limit' })]);
    expect(spec.series.find((s) => s.id === 'mask-upper')!.y).toEqual([83, 83]);
    expect(spec.bands).toEqual([expect.objectContaining({ upperSeriesId: 'mask-upper', lowerSeriesId: 'mask-lower' })]);
  });
});
